import fs from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { versionHash } from "@/lib/procedures/hash";
import { api, session, withDb, type Session } from "./support";

const HISTORY = "Visual inspection of bracket welds";
const STARTERS = [
  "Removing a welded lateral-link bracket from an axle tube",
  "Preparing an axle tube for welding",
  "Fitting and welding a weld-in lateral-link bracket at ride height",
  "Coating the repaired area",
  "Reassembly, torque, geometry check and road test",
  "Lateral-link bracket replacement, start to finish",
];

let lead: Session;
let welder: Session;

const content = (steps: unknown[] = [{ key: "ppe", kind: "caution", title: "PPE on", hazards: ["ppe"], acknowledgement: "PPE on." }, { key: "look", kind: "check", title: "Look it over" }]) => ({
  sections: [{ key: "main", title: "Main", steps }],
});

async function create(title = `Test procedure ${Date.now()}-${Math.random().toString(36).slice(2, 7)}`, body: Record<string, unknown> = {}) {
  const r = await api("/api/procedures", { session: lead, body: { title, code: "AWS D1.1", content: content(), ...body } });
  expect(r.status, r.text).toBe(201);
  return r.json.procedure.id as string;
}

// The seeded procedure of that title (one with a published or retired version), not a draft-only copy.
async function findByTitle(s: Session, title: string) {
  const r = await api(`/api/procedures?q=${encodeURIComponent(title)}&pageSize=100`, { session: s });
  const rows = (r.json.procedures as { id: string; title: string; versions: { number: number; status: string }[] }[]).filter((p) => p.title === title);
  return rows.find((p) => p.versions.some((v) => v.status !== "draft")) ?? rows[0];
}

// Imported copies are discarded again, so the demo shop keeps one procedure of each title.
async function discard(id: string) {
  const r = await api(`/api/procedures/${id}/versions/1`, { session: lead, method: "DELETE" });
  expect(r.json.procedureDeleted).toBe(true);
}

beforeAll(async () => {
  lead = await session("lead@irongully.example");
  welder = await session("welder@irongully.example");
});

describe("procedures list", () => {
  it("shows the demo shop's starter procedures, each with its versions' numbers and states", async () => {
    for (const title of STARTERS) {
      const p = await findByTitle(lead, title);
      expect(p?.versions, title).toEqual([{ number: 1, status: "published" }]);
    }
    const history = await findByTitle(welder, HISTORY);
    expect(history?.versions).toEqual([
      { number: 1, status: "retired" },
      { number: 2, status: "published" },
      { number: 3, status: "draft" },
    ]);
  });

  it("pages, sorts and filters on the server", async () => {
    const page1 = await api("/api/procedures?pageSize=2&sort=title&dir=asc", { session: lead });
    expect(page1.json.procedures).toHaveLength(2);
    expect(page1.json.total).toBeGreaterThanOrEqual(7);
    const all = await api("/api/procedures?pageSize=100&sort=title&dir=asc", { session: lead });
    const titles = all.json.procedures.map((p: { title: string }) => p.title);
    expect(titles).toEqual([...titles].sort((a: string, b: string) => a.toLowerCase().localeCompare(b.toLowerCase())));
    const page2 = await api("/api/procedures?pageSize=2&page=2&sort=title&dir=asc", { session: lead });
    expect(page2.json.procedures.map((p: { title: string }) => p.title)).toEqual(titles.slice(2, 4));
    const desc = await api("/api/procedures?pageSize=100&sort=title&dir=desc", { session: lead });
    expect(desc.json.procedures.map((p: { title: string }) => p.title)).toEqual([...titles].reverse());
    const drafts = await api("/api/procedures?state=draft&pageSize=100", { session: lead });
    expect(drafts.json.procedures.every((p: { versions: { status: string }[] }) => p.versions.some((v) => v.status === "draft"))).toBe(true);
    expect(drafts.json.procedures.map((p: { title: string }) => p.title)).toContain(HISTORY);
    const search = await api("/api/procedures?q=axle%20tube&pageSize=100", { session: lead });
    expect(search.json.procedures.map((p: { title: string }) => p.title)).toEqual(
      expect.arrayContaining(["Removing a welded lateral-link bracket from an axle tube", "Preparing an axle tube for welding"]),
    );
    expect((await api("/api/procedures?state=everything", { session: lead })).status).toBe(400);
  });

  it("another shop sees none of them, and each of them answers 404 there", async () => {
    const other = await session("lead@saltpan.example");
    const theirs = await api("/api/procedures?pageSize=100", { session: other });
    expect(theirs.json.procedures.map((p: { title: string }) => p.title)).not.toContain(HISTORY);
    const mine = (await findByTitle(lead, HISTORY))!;
    for (const [method, url] of [
      ["GET", `/api/procedures/${mine.id}`],
      ["GET", `/api/procedures/${mine.id}/versions/2`],
      ["GET", `/api/procedures/${mine.id}/versions/2/export`],
      ["PATCH", `/api/procedures/${mine.id}/versions/3`],
      ["POST", `/api/procedures/${mine.id}/versions/3/publish`],
      ["POST", `/api/procedures/${mine.id}/versions/2/retire`],
      ["POST", `/api/procedures/${mine.id}/versions`],
    ] as const) {
      const body = method === "PATCH" ? { title: "Taken over" } : method === "POST" && url.endsWith("publish") ? { changeNote: "Not my shop" } : undefined;
      const r = await api(url, { session: other, method, body });
      expect(r.status, `${method} ${url}`).toBe(404);
    }
    expect((await api("/api/procedures/not-a-uuid", { session: lead })).status).toBe(404);
    expect((await api(`/api/procedures/${mine.id}/versions/99`, { session: lead })).status).toBe(404);
  });
});

describe("roles", () => {
  it("everyone in the shop reads; only a lead creates, edits, publishes, retires or imports", async () => {
    const history = (await findByTitle(lead, HISTORY))!;
    for (const who of ["welder@irongully.example", "inspector@irongully.example", "auditor@irongully.example"]) {
      const s = await session(who);
      expect((await api(`/api/procedures/${history.id}/versions/2`, { session: s })).status, who).toBe(200);
      const post = await api("/api/procedures", { session: s, body: { title: "Not allowed", content: content() } });
      expect(post.status, who).toBe(403);
      expect(post.json.error).toEqual({ code: "forbidden", message: "Only a lead may do this." });
      expect((await api(`/api/procedures/${history.id}/versions/3`, { session: s, method: "PATCH", body: { title: "Mine now" } })).status, who).toBe(403);
      expect((await api(`/api/procedures/${history.id}/versions/3/publish`, { session: s, body: { changeNote: "I publish" } })).status, who).toBe(403);
      expect((await api(`/api/procedures/${history.id}/versions/2/retire`, { session: s, body: {} })).status, who).toBe(403);
      expect((await api("/api/procedures/import", { session: s, body: "{}" })).status, who).toBe(403);
    }
    expect((await api("/api/procedures")).status).toBe(401);
  });
});

describe("versions: numbering, publishing and immutability through the API", () => {
  it("a procedure starts as draft 1; publishing seals it; the next version is a draft copy numbered 2", async () => {
    const id = await create();
    const v1 = await api(`/api/procedures/${id}/versions/1`, { session: lead });
    expect(v1.json.version).toMatchObject({ number: 1, status: "draft", contentHash: null, publishedAt: null });

    const noNote = await api(`/api/procedures/${id}/versions/1/publish`, { session: lead, body: {} });
    expect(noNote.status).toBe(400);
    expect(noNote.json.error.fields.changeNote).toBeDefined();

    const pub = await api(`/api/procedures/${id}/versions/1/publish`, { session: lead, body: { changeNote: "First issue for the shop." } });
    expect(pub.status, pub.text).toBe(200);
    const sealed = (await api(`/api/procedures/${id}/versions/1`, { session: lead })).json.version;
    expect(sealed).toMatchObject({ status: "published", changeNote: "First issue for the shop.", publisherName: "Nell Corrigan" });
    // The stored hash is the SHA-256 of the RFC 8785 form of what the API returns.
    expect(sealed.contentHash).toBe(versionHash({ title: sealed.title, scope: sealed.scope, code: sealed.code, content: sealed.content }));
    expect(pub.json.version.contentHash).toBe(sealed.contentHash);

    const next = await api(`/api/procedures/${id}/versions`, { session: lead, body: {} });
    expect(next.status).toBe(201);
    expect(next.json.version).toEqual({ number: 2, status: "draft", copiedFrom: 1 });
    const v2 = (await api(`/api/procedures/${id}/versions/2`, { session: lead })).json.version;
    expect(v2.content).toEqual(sealed.content);
    const again = await api(`/api/procedures/${id}/versions`, { session: lead, body: {} });
    expect(again.status).toBe(409);
    expect(again.json.error.message).toMatch(/still a draft/);

    const edited = await api(`/api/procedures/${id}/versions/2`, {
      session: lead,
      method: "PATCH",
      body: { content: content([{ key: "ppe", kind: "caution", title: "PPE and fume extraction", hazards: ["ppe", "ventilation"], acknowledgement: "PPE on." }]) },
    });
    expect(edited.status).toBe(200);
    const pub2 = await api(`/api/procedures/${id}/versions/2/publish`, { session: lead, body: { changeNote: "Fume extraction named." } });
    expect(pub2.json.retired).toEqual([1]);
    const list = await findByTitle(lead, (await api(`/api/procedures/${id}`, { session: lead })).json.procedure.title);
    expect(list?.versions).toEqual([
      { number: 1, status: "retired" },
      { number: 2, status: "published" },
    ]);
    const v3 = await api(`/api/procedures/${id}/versions`, { session: lead, body: {} });
    expect(v3.json.version.number).toBe(3);
  });

  it("published and retired versions answer 409 to every change, and their content stays as it was", async () => {
    const history = (await findByTitle(lead, HISTORY))!;
    const before = (await api(`/api/procedures/${history.id}/versions/2`, { session: lead })).json.version;
    for (const n of [1, 2]) {
      const patch = await api(`/api/procedures/${history.id}/versions/${n}`, { session: lead, method: "PATCH", body: { title: "Quietly changed" } });
      expect(patch.status, `PATCH v${n}`).toBe(409);
      expect(patch.json.error.message).toMatch(/never changes/);
      expect((await api(`/api/procedures/${history.id}/versions/${n}/publish`, { session: lead, body: { changeNote: "Again please" } })).status, `publish v${n}`).toBe(409);
      expect((await api(`/api/procedures/${history.id}/versions/${n}`, { session: lead, method: "DELETE" })).status, `DELETE v${n}`).toBe(409);
    }
    expect((await api(`/api/procedures/${history.id}/versions/1/retire`, { session: lead, body: {} })).status).toBe(409);
    expect((await api(`/api/procedures/${history.id}/versions/3/retire`, { session: lead, body: {} })).status).toBe(409);
    const after = (await api(`/api/procedures/${history.id}/versions/2`, { session: lead })).json.version;
    expect(after).toEqual(before);
  });

  it("retiring keeps a version readable but takes it out of use", async () => {
    const id = await create();
    await api(`/api/procedures/${id}/versions/1/publish`, { session: lead, body: { changeNote: "First issue." } });
    const r = await api(`/api/procedures/${id}/versions/1/retire`, { session: lead, body: {} });
    expect(r.status).toBe(200);
    const v = await api(`/api/procedures/${id}/versions/1`, { session: welder });
    expect(v.status).toBe(200);
    expect(v.json.version.status).toBe("retired");
    expect(v.json.version.retiredAt).not.toBeNull();
    const retiredList = await api("/api/procedures?state=retired&pageSize=100", { session: lead });
    expect(retiredList.json.procedures.map((p: { id: string }) => p.id)).toContain(id);
    const inUse = await api("/api/procedures?state=published&pageSize=100", { session: lead });
    expect(inUse.json.procedures.map((p: { id: string }) => p.id)).not.toContain(id);
  });

  it("a draft with hot work and no caution before it cannot be published (422, with the reason)", async () => {
    const id = await create(undefined, {
      content: content([{ key: "w1", kind: "weld", title: "W1", jointId: "W1", jointType: "fillet", sizeMm: 5, lengthMm: 40, position: "2F", process: "GMAW", wpsRef: "WPS-1", filler: "ER70S-6", minPreheatC: 20 }]),
    });
    const r = await api(`/api/procedures/${id}/versions/1/publish`, { session: lead, body: { changeNote: "Try it." } });
    expect(r.status).toBe(422);
    expect(r.json.error.message).toMatch(/caution step before the first weld/);
  });

  it("a draft's bad content answers 400 naming the field; a draft can be discarded", async () => {
    const id = await create();
    const bad = await api(`/api/procedures/${id}/versions/1`, { session: lead, method: "PATCH", body: { content: content([{ key: "x", kind: "laser", title: "Zap" }]) } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.error.fields)).toContain("content.sections.0.steps.0.kind");
    const gone = await api(`/api/procedures/${id}/versions/1`, { session: lead, method: "DELETE" });
    expect(gone.json).toEqual({ discarded: { number: 1 }, procedureDeleted: true });
    expect((await api(`/api/procedures/${id}`, { session: lead })).status).toBe(404);
  });

  it("the diff of the demo history lists what version 2 changed", async () => {
    const history = (await findByTitle(lead, HISTORY))!;
    const r = await api(`/api/procedures/${history.id}/diff?from=1&to=2`, { session: welder });
    expect(r.status).toBe(200);
    expect(r.json.diff.summary).toMatchObject({ added: 2, removed: 0, changed: 2 });
    const rows = r.json.diff.sections.flatMap((s: { rows: unknown[] }) => s.rows) as { key: string; type: string; changes?: { field: string; before: string; after: string }[] }[];
    expect(rows.find((x) => x.key === "vi-photo")?.changes).toEqual(expect.arrayContaining([{ field: "photos.min", label: "Photos (at least)", before: "1", after: "2" }]));
  });
});

describe("export and import of procedure files", () => {
  const count = () => withDb(async (c) => Number((await c.query("select count(*) from procedure")).rows[0].count));

  it("export writes the Gusset file; importing it creates a new draft with the same content", async () => {
    const history = (await findByTitle(lead, HISTORY))!;
    const ex = await api(`/api/procedures/${history.id}/versions/2/export`, { session: welder });
    expect(ex.status).toBe(200);
    expect(ex.headers.get("content-disposition")).toBe('attachment; filename="visual-inspection-of-bracket-welds-v2.gusset-procedure.json"');
    expect(ex.json).toMatchObject({ format: "gusset-procedure", formatVersion: 1, source: { version: 2, status: "published" } });
    const imported = await api("/api/procedures/import", { session: lead, body: ex.text });
    expect(imported.status).toBe(201);
    expect(imported.json.sourceHashMatches).toBe(true);
    const copy = (await api(`/api/procedures/${imported.json.procedure.id}/versions/1`, { session: lead })).json.version;
    expect(copy.status).toBe("draft");
    expect(copy.content).toEqual(ex.json.content);
    await discard(imported.json.procedure.id);
  });

  it.each(fs.readdirSync(path.resolve(import.meta.dirname, "../../templates")).filter((f) => f.endsWith(".json")))("imports the starter file %s", async (file) => {
    const text = fs.readFileSync(path.resolve(import.meta.dirname, "../../templates", file), "utf8");
    const r = await api("/api/procedures/import", { session: lead, body: text });
    expect(r.status, r.text).toBe(201);
    expect(r.json.version).toEqual({ number: 1, status: "draft" });
    await discard(r.json.procedure.id);
  });

  it("refuses malformed files with every problem and where it is, and saves nothing", async () => {
    const before = await count();
    const notJson = await api("/api/procedures/import", { session: lead, body: "format: gusset" });
    expect(notJson.status).toBe(400);
    expect(notJson.json.error.problems[0].message).toMatch(/Not valid JSON/);

    const unknownKind = await api("/api/procedures/import", {
      session: lead,
      body: { format: "gusset-procedure", formatVersion: 1, procedure: { title: "Bad file" }, content: { sections: [{ key: "a", title: "A", steps: [{ key: "s", kind: "laser", title: "Zap" }, { key: "s", kind: "check", title: "Again" }] }] } },
    });
    expect(unknownKind.status).toBe(422);
    expect(unknownKind.json.error.problems).toEqual(
      expect.arrayContaining([expect.objectContaining({ path: "content.sections[0].steps[0].kind", where: "section 1 “A”, step 1 “Zap”, kind" })]),
    );
    expect(unknownKind.json.error.fields["content.sections[0].steps[0].kind"]).toBeDefined();

    const big = await api("/api/procedures/import", { session: lead, body: `{"pad":"${"x".repeat(1024 * 1024)}"}` });
    expect(big.status).toBe(413);
    expect(big.json.error.code).toBe("payload_too_large");
    expect(await count()).toBe(before);
  });
});
