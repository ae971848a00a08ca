import { describe, expect, it } from "vitest";
import { api, BASE_URL, freshIp, session, signIn, waitFor, withDb } from "./support";

describe("people and roles", () => {
  it("a lead lists the shop's people; nobody else may", async () => {
    const lead = await session("lead@irongully.example");
    const list = await api("/api/people?pageSize=50", { session: lead });
    expect(list.status).toBe(200);
    const emails = list.json.people.map((p: { email: string }) => p.email);
    expect(emails).toContain("welder@irongully.example");
    expect(emails).not.toContain("lead@saltpan.example");
    for (const who of ["welder@irongully.example", "inspector@irongully.example", "auditor@irongully.example"]) {
      const r = await api("/api/people", { session: await session(who) });
      expect(r.status, who).toBe(403);
      expect(r.json.error.code).toBe("forbidden");
    }
  });

  it("another shop's person answers 404, both ways", async () => {
    const lead = await session("lead@irongully.example");
    const otherLead = await session("lead@saltpan.example");
    const mine = (await api("/api/people", { session: lead })).json.people[0];
    const theirs = (await api("/api/people", { session: otherLead })).json.people[0];
    expect((await api(`/api/people/${mine.membershipId}`, { session: lead })).status).toBe(200);
    expect((await api(`/api/people/${theirs.membershipId}`, { session: lead })).status).toBe(404);
    expect((await api(`/api/people/${mine.membershipId}`, { session: otherLead })).status).toBe(404);
    const patch = await api(`/api/people/${theirs.membershipId}`, { session: lead, method: "PATCH", body: { roles: ["auditor"] } });
    expect(patch.status).toBe(404);
  });

  it("a welder's attempt to change roles answers 403", async () => {
    const lead = await session("lead@irongully.example");
    const target = (await api("/api/people?q=welder2", { session: lead })).json.people[0];
    const welder = await session("welder@irongully.example");
    const r = await api(`/api/people/${target.membershipId}`, { session: welder, method: "PATCH", body: { roles: ["lead"] } });
    expect(r.status).toBe(403);
  });

  it("bad input answers 400 with field errors", async () => {
    const lead = await session("lead@irongully.example");
    const r = await api("/api/people/invitations", { session: lead, body: { email: "not-an-address", roles: ["boss"] } });
    expect(r.status).toBe(400);
    expect(Object.keys(r.json.error.fields)).toEqual(expect.arrayContaining(["email", "roles.0"]));
    const notJson = await api("/api/people/invitations", { session: lead, body: "{oops" });
    expect(notJson.status).toBe(400);
    expect(notJson.json.error.message).toMatch(/not valid JSON/);
  });

  it("the last active lead cannot drop the lead role", async () => {
    const lead = await session("lead@saltpan.example");
    const me = (await api("/api/people?q=lead@saltpan", { session: lead })).json.people[0];
    const r = await api(`/api/people/${me.membershipId}`, { session: lead, method: "PATCH", body: { roles: ["welder"] } });
    expect(r.status).toBe(409);
  });

  it("invites by e-mail; the mail reaches the catcher; the invitee joins and signs in with their roles", async () => {
    const lead = await session("lead@irongully.example");
    const email = `new-${Date.now()}@irongully.example`;
    const inv = await api("/api/people/invitations", { session: lead, body: { email, roles: ["welder", "inspector"] } });
    expect(inv.status).toBe(201);
    expect(inv.json.invitation.sent).toBe(true);
    const mail = await waitFor(() =>
      withDb(async (c) => (await c.query("select subject, text_body, html_body from caught_mail where to_address like $1", [`%${email}%`])).rows[0]),
    );
    expect(mail.subject).toContain("Iron Gully 4x4 Fabrication");
    expect(mail.html_body).toContain("Accept the invitation");
    const link = /\/invite\/([A-Za-z0-9_-]+)/.exec(mail.text_body);
    expect(link).not.toBeNull();
    const token = link![1]!;
    const accept = await api(`/api/invitations/${token}/accept`, { body: { name: "Sam Brakewell", password: "a-long-password-1" } });
    expect(accept.status).toBe(201);
    const again = await api(`/api/invitations/${token}/accept`, { body: { name: "Sam Again", password: "a-long-password-1" } });
    expect(again.status).toBe(404);
    const { res, session: s } = await signIn(email, "a-long-password-1");
    expect(res.status).toBe(200);
    const me = await api("/api/me", { session: s });
    expect(me.json.roles.sort()).toEqual(["inspector", "welder"]);
    const page = await fetch(`${BASE_URL}/invite/${token}`);
    expect(await page.text()).toContain("cannot be used");
  });

  it("a deactivated person keeps their account but loses the shop", async () => {
    const lead = await session("lead@irongully.example");
    const email = `temp-${Date.now()}@irongully.example`;
    await api("/api/people/invitations", { session: lead, body: { email, roles: ["welder"] } });
    const mail = await waitFor(() => withDb(async (c) => (await c.query("select text_body from caught_mail where to_address like $1", [`%${email}%`])).rows[0]));
    const token = /\/invite\/([A-Za-z0-9_-]+)/.exec(mail.text_body)![1]!;
    await api(`/api/invitations/${token}/accept`, { body: { name: "Temp Person", password: "a-long-password-2" } });
    const s = (await signIn(email, "a-long-password-2", freshIp())).session;
    expect((await api("/api/me", { session: s })).status).toBe(200);
    const person = (await api(`/api/people?q=${encodeURIComponent(email)}`, { session: lead })).json.people[0];
    const off = await api(`/api/people/${person.membershipId}`, { session: lead, method: "PATCH", body: { active: false } });
    expect(off.status).toBe(200);
    expect(off.json.person.active).toBe(false);
    expect((await api("/api/me", { session: s })).status).toBe(401);
  });

  it("a signing PIN must be 4 to 8 digits and needs the account password", async () => {
    const s = await session("auditor@irongully.example");
    const bad = await api("/api/me/pin", { session: s, method: "PUT", body: { password: "demo-gusset-2026", pin: "12a" } });
    expect(bad.status).toBe(400);
    expect(bad.json.error.fields.pin).toBeDefined();
    const wrongPassword = await api("/api/me/pin", { session: s, method: "PUT", body: { password: "nope", pin: "1234" } });
    expect(wrongPassword.status).toBe(403);
    const ok = await api("/api/me/pin", { session: s, method: "PUT", body: { password: "demo-gusset-2026", pin: "97531" } });
    expect(ok.status).toBe(200);
    const stored = await withDb(async (c) =>
      (await c.query("select m.pin_hash from membership m join \"user\" u on u.id = m.user_id where u.email = 'auditor@irongully.example'")).rows[0],
    );
    expect(stored.pin_hash).toMatch(/^scrypt\$/);
    expect(stored.pin_hash).not.toContain("97531");
  });
});
