import fs from "node:fs";
import { beforeAll, describe, expect, it } from "vitest";
import { insertPublishedProcedure, jobBody, TEST_PROCEDURE_CONTENT } from "../fixtures/jobs/procedure";
import { api, BASE_URL, freshIp, session, signIn, waitFor, withDb, type Session } from "./support";

type Rec = Record<string, any>;
let lead: Session;
let versionId: string;

beforeAll(async () => {
  lead = await session("lead@irongully.example");
  versionId = await withDb((c) =>
    insertPublishedProcedure(c, { shopSlug: "iron-gully", ownerEmail: "lead@irongully.example", title: "Hostile requests procedure", content: TEST_PROCEDURE_CONTENT }),
  );
});

async function jobCount(): Promise<number> {
  return withDb(async (c) => Number((await c.query("select count(*)::int as n from job")).rows[0].n));
}

async function healthy() {
  const r = await fetch(`${BASE_URL}/api/health`);
  return r.status === 200 && (await r.json()).ok === true;
}

// The app's process: the one holding the listening socket of BASE_URL's port (Linux /proc).
function serverPid(): number | null {
  const port = Number(new URL(BASE_URL).port);
  const inodes = new Set<string>();
  for (const table of ["/proc/net/tcp", "/proc/net/tcp6"]) {
    if (!fs.existsSync(table)) continue;
    for (const line of fs.readFileSync(table, "utf8").split("\n").slice(1)) {
      const cols = line.trim().split(/\s+/);
      if (cols.length < 10 || cols[3] !== "0A") continue;
      if (parseInt(cols[1]!.split(":")[1]!, 16) === port) inodes.add(cols[9]!);
    }
  }
  for (const pid of fs.readdirSync("/proc").filter((d) => /^\d+$/.test(d))) {
    try {
      for (const fd of fs.readdirSync(`/proc/${pid}/fd`)) {
        const link = fs.readlinkSync(`/proc/${pid}/fd/${fd}`);
        const m = /^socket:\[(\d+)\]$/.exec(link);
        if (m && inodes.has(m[1]!)) return Number(pid);
      }
    } catch {
      // another user's process, or gone
    }
  }
  return null;
}

function rssBytes(pid: number): number {
  const kb = /VmRSS:\s+(\d+) kB/.exec(fs.readFileSync(`/proc/${pid}/status`, "utf8"))![1]!;
  return Number(kb) * 1024;
}

// A body with no Content-Length: sent in 64 KB chunks, as many as `total` allows.
function chunkedBody(total: number): { stream: ReadableStream<Uint8Array>; sent: () => number } {
  let sent = 0;
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (sent >= total) return controller.close();
      const n = Math.min(64 * 1024, total - sent);
      sent += n;
      controller.enqueue(new Uint8Array(n).fill(0x20));
    },
  });
  return { stream, sent: () => sent };
}

describe("cross-origin writes", () => {
  it("a POST from another site's page answers 403 and creates nothing; the app's own origin still works", async () => {
    const before = await jobCount();
    const evil = await api("/api/jobs", { session: lead, body: jobBody(versionId), headers: { origin: "http://evil.example" } });
    expect(evil.status).toBe(403);
    expect(evil.json.error.code).toBe("forbidden");
    const fetchMeta = await api("/api/jobs", { session: lead, body: jobBody(versionId), headers: { origin: "", "sec-fetch-site": "cross-site" } });
    expect(fetchMeta.status).toBe(403);
    const sibling = await api("/api/calc/dew-point", { body: { airTempC: 20, relativeHumidity: 50, surfaceTempC: 15 }, headers: { origin: "http://127.0.0.1:1" } });
    expect(sibling.status).toBe(403);
    expect(await jobCount()).toBe(before);
    const own = await api("/api/jobs", { session: lead, body: jobBody(versionId), headers: { origin: BASE_URL } });
    expect(own.status, own.text).toBe(201);
    const sameOrigin = await api("/api/calc/dew-point", { body: { airTempC: 20, relativeHumidity: 50, surfaceTempC: 15 }, headers: { origin: "", "sec-fetch-site": "same-origin" } });
    expect(sameOrigin.status).toBe(200);
  });

  it("a text/plain body (what a cross-site form can send without asking) answers 415", async () => {
    const before = await jobCount();
    for (const path of ["/api/jobs", "/api/calc/dew-point", "/api/procedures/import"]) {
      const r = await fetch(`${BASE_URL}${path}`, {
        method: "POST",
        headers: { "content-type": "text/plain", cookie: lead.cookie, "x-forwarded-for": lead.ip, origin: BASE_URL },
        body: JSON.stringify(path === "/api/jobs" ? jobBody(versionId) : { airTempC: 20, relativeHumidity: 50, surfaceTempC: 15 }),
      });
      expect(r.status, path).toBe(415);
      expect((await r.json()).error.code).toBe("unsupported_media_type");
    }
    expect(await jobCount()).toBe(before);
  });
});

describe("control characters", () => {
  it("a NUL in a job's customer answers 400 naming the field; nothing is saved", async () => {
    const before = await jobCount();
    const r = await api("/api/jobs", { session: lead, body: jobBody(versionId, { customerName: "Axle\u0000Works" }) });
    expect(r.status).toBe(400);
    expect(r.json.error.fields.customerName[0]).toMatch(/control character \(U\+0000\)/);
    expect(await jobCount()).toBe(before);
    const esc = await api("/api/jobs", { session: lead, body: jobBody(versionId, { axleDescription: "front\u001b[31m housing" }) });
    expect(esc.status).toBe(400);
    expect(esc.json.error.fields.axleDescription).toBeDefined();
  });

  it("a NUL in a search answers 400, not a database error", async () => {
    const r = await api(`/api/people?q=${encodeURIComponent("lead\u0000")}`, { session: lead });
    expect(r.status).toBe(400);
    expect(r.json.error.fields.q).toBeDefined();
  });

  it("a NUL in a photo caption answers 400", async () => {
    const job = await api("/api/jobs", { session: lead, body: jobBody(versionId) });
    const form = new FormData();
    form.append("file", new Blob([fs.readFileSync(new URL("../fixtures/jobs/bracket.jpg", import.meta.url))], { type: "image/jpeg" }), "photo.jpg");
    form.append("idempotencyKey", crypto.randomUUID());
    form.append("caption", "weld\u0000");
    const res = await fetch(`${BASE_URL}/api/jobs/${job.json.job.id}/photos`, { method: "POST", headers: { cookie: lead.cookie, "x-forwarded-for": lead.ip, origin: BASE_URL }, body: form });
    expect(res.status).toBe(400);
    expect((await res.json()).error.fields.caption).toBeDefined();
  });
});

describe("bodies that try to exhaust the server", () => {
  it("an import of 20,000 nested arrays answers 4xx within 5 s and the server stays healthy", async () => {
    const started = Date.now();
    const r = await api("/api/procedures/import", { session: lead, body: "[".repeat(20_000) + "]".repeat(20_000) });
    expect(Date.now() - started).toBeLessThan(5_000);
    expect(r.status).toBeGreaterThanOrEqual(400);
    expect(r.status).toBeLessThan(500);
    expect(r.json.error.message).toMatch(/nested more than/);
    expect(await healthy()).toBe(true);
  });

  it("deep nesting in any JSON body is refused before it is parsed", async () => {
    const r = await api("/api/calc/dew-point", { body: `{"airTempC":${"[".repeat(100_000)}${"]".repeat(100_000)}}` });
    expect(r.status).toBe(400);
    expect(r.json.error.message).toMatch(/nested more than/);
  });

  it("a 64 MB chunked body to a calculator answers 413; the server stays healthy and its memory does not grow by 100 MB", async () => {
    const pid = serverPid();
    expect(pid, "the app's process is found through /proc").not.toBeNull();
    // Warm the route first, so its code being loaded is not counted as the body's cost.
    expect((await api("/api/calc/dew-point", { body: { airTempC: 20, relativeHumidity: 50, surfaceTempC: 15 } })).status).toBe(200);
    const before = rssBytes(pid!);
    const body = chunkedBody(64 * 1024 * 1024);
    const controller = new AbortController();
    const res = await fetch(`${BASE_URL}/api/calc/dew-point`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: body.stream,
      duplex: "half",
      signal: controller.signal,
    } as RequestInit);
    expect(res.status).toBe(413);
    expect((await res.json()).error.code).toBe("payload_too_large");
    controller.abort();
    expect(await healthy()).toBe(true);
    const after = rssBytes(pid!);
    expect(after - before).toBeLessThan(100 * 1024 * 1024);
  });

  it("sign-in bodies have a limit too", async () => {
    const r = await fetch(`${BASE_URL}/api/auth/sign-in/email`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: BASE_URL, "x-forwarded-for": freshIp() },
      body: JSON.stringify({ email: "lead@irongully.example", password: "x".repeat(200_000) }),
    });
    expect(r.status).toBe(413);
  });
});

describe("security headers", () => {
  it("pages carry a CSP with a fresh nonce that their scripts use, and the camera only where it is used", async () => {
    const a = await fetch(`${BASE_URL}/sign-in`);
    const b = await fetch(`${BASE_URL}/sign-in`);
    const csp = a.headers.get("content-security-policy")!;
    const nonce = /'nonce-([^']+)'/.exec(csp)?.[1];
    expect(nonce).toBeTruthy();
    expect(csp).toContain("frame-ancestors 'none'");
    expect(b.headers.get("content-security-policy")).not.toContain(nonce);
    const html = await a.text();
    expect(html).toContain(`nonce="${nonce}"`);
    expect(a.headers.get("permissions-policy")).toContain("camera=()");
    expect(a.headers.get("x-content-type-options")).toBe("nosniff");
    expect(a.headers.get("referrer-policy")).toBe("same-origin");
    expect(a.headers.get("strict-transport-security")).toBeNull();
    const scan = await fetch(`${BASE_URL}/scan`);
    expect(scan.headers.get("permissions-policy")).toContain("camera=(self)");
  });

  it("API answers carry a locked-down CSP, and HSTS when reached over HTTPS", async () => {
    const r = await api("/api/calc/dew-point", { body: { airTempC: 20, relativeHumidity: 50, surfaceTempC: 15 } });
    expect(r.headers.get("content-security-policy")).toContain("default-src 'none'");
    expect(r.headers.get("permissions-policy")).toContain("camera=()");
    expect(r.headers.get("strict-transport-security")).toBeNull();
    const overTls = await fetch(`${BASE_URL}/api/health`, { headers: { "x-forwarded-proto": "https" } });
    expect(overTls.headers.get("strict-transport-security")).toMatch(/max-age=\d+/);
    const page = await fetch(`${BASE_URL}/sign-in`, { headers: { "x-forwarded-proto": "https" } });
    expect(page.headers.get("strict-transport-security")).toMatch(/max-age=\d+/);
  });
});

async function invitePerson(roles: string[], password: string) {
  const email = `h-${Date.now()}-${Math.random().toString(36).slice(2, 6)}@irongully.example`;
  const inv = await api("/api/people/invitations", { session: lead, body: { email, roles } });
  expect(inv.status, inv.text).toBe(201);
  const mail = await waitFor(() => withDb(async (c) => (await c.query("select text_body from caught_mail where to_address like $1", [`%${email}%`])).rows[0]));
  const token = /\/invite\/([A-Za-z0-9_-]+)/.exec(mail.text_body)![1]!;
  expect((await api(`/api/invitations/${token}/accept`, { body: { name: "Robin Testfield", password } })).status).toBe(201);
  return email;
}

async function sessionUser(s: Session): Promise<string | null> {
  const r = await api("/api/auth/get-session", { session: s });
  return r.json?.user?.email ?? null;
}

describe("sessions", () => {
  it("a password change ends the person's other sessions, even when the request did not ask", async () => {
    const email = await invitePerson(["welder"], "first-password-1");
    const tablet = (await signIn(email, "first-password-1")).session;
    const office = (await signIn(email, "first-password-1")).session;
    expect(await sessionUser(tablet)).toBe(email);
    const change = await fetch(`${BASE_URL}/api/auth/change-password`, {
      method: "POST",
      headers: { "content-type": "application/json", cookie: office.cookie, origin: BASE_URL, "x-forwarded-for": office.ip },
      body: JSON.stringify({ currentPassword: "first-password-1", newPassword: "second-password-2", revokeOtherSessions: false }),
    });
    expect(change.status, await change.clone().text()).toBe(200);
    expect(await sessionUser(tablet)).toBeNull();
    // The session that changed the password continues with the fresh cookie it was given.
    const renewed: Session = { cookie: change.headers.getSetCookie().map((c) => c.split(";")[0]).join("; "), ip: office.ip };
    expect(await sessionUser(renewed)).toBe(email);
    expect((await signIn(email, "second-password-2")).res.status).toBe(200);
  });

  it("deactivating a member ends their sessions at once", async () => {
    const email = await invitePerson(["welder"], "third-password-3");
    const s = (await signIn(email, "third-password-3")).session;
    expect(await sessionUser(s)).toBe(email);
    const person = (await api(`/api/people?q=${encodeURIComponent(email)}`, { session: lead })).json.people[0];
    expect((await api(`/api/people/${person.membershipId}`, { session: lead, method: "PATCH", body: { active: false } })).status).toBe(200);
    expect(await sessionUser(s)).toBeNull();
    const left = await withDb(async (c) => (await c.query(`select count(*)::int as n from session s join "user" u on u.id = s.user_id where u.email = $1`, [email])).rows[0].n);
    expect(left).toBe(0);
  });
});

describe("signing PIN under parallel attempts", () => {
  it("40 wrong PINs at once compare no more guesses than the lock allows", async () => {
    const email = await invitePerson(["welder"], "pin-password-4");
    const pat = (await signIn(email, "pin-password-4")).session;
    expect((await api("/api/me/pin", { session: pat, method: "PUT", body: { password: "pin-password-4", pin: "8642" } })).status).toBe(200);
    const created = await api("/api/jobs", { session: lead, body: jobBody(versionId) });
    const rec: Rec = (await api(`/api/jobs/${created.json.job.id}`, { session: pat })).json;
    const clean = rec.steps.find((s: Rec) => s.key === "c-clean");
    const saved = await api(`/api/jobs/${rec.job.id}/steps/${clean.id}/value`, { session: pat, method: "PUT", body: { baseVersion: clean.version, value: { confirmed: true } } });
    expect(saved.status, saved.text).toBe(200);
    const results = await Promise.all(
      Array.from({ length: 40 }, (_, i) =>
        api(`/api/jobs/${rec.job.id}/steps/${clean.id}/sign`, { session: pat, body: { pin: String(1000 + i), baseVersion: saved.json.record?.steps?.find((s: Rec) => s.key === "c-clean")?.version ?? clean.version + 1 } }),
      ),
    );
    // A compared guess answers "Wrong PIN…"; an attempt refused because tries ran out never compared one.
    const compared = results.filter((r) => /^Wrong PIN/.test(r.json?.error?.message ?? ""));
    const refused = results.filter((r) => r.status === 423 && /locked after/.test(r.json.error.message));
    expect(compared.length).toBe(5);
    expect(compared.length + refused.length).toBe(40);
    const row = await withDb(async (c) => (await c.query(`select m.pin_failures, m.pin_locked_at from membership m join "user" u on u.id = m.user_id where u.email = $1`, [email])).rows[0]);
    expect(row.pin_failures).toBe(5);
    expect(row.pin_locked_at).not.toBeNull();
  });
});
