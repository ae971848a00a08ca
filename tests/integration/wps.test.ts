import { randomBytes } from "node:crypto";
import { afterAll, describe, expect, it } from "vitest";
import { loadWpsRanges, publishedWpsByReference } from "@/db/queries/wps";
import { db } from "@/lib/db";
import { checkPassAgainstWps } from "@/lib/welding";
import { api, session, withDb, type Session } from "./support";

// Everything a publishable GMAW WPS needs, SI (mm, L/min, V, A, mm/min, kJ/mm, °C).
const COMPLETE = {
  baseMetals: "Carbon steel tube to carbon steel plate",
  thicknessMinMm: 3,
  thicknessMaxMm: 12,
  fillerClassification: "ER70S-6",
  fillerDiameterMm: 0.9,
  shieldingGas: "Argon 75 % / CO2 25 %",
  gasFlowLPerMin: 14,
  currentType: "DC",
  polarity: "EP",
  voltsMin: 17,
  voltsMax: 21,
  ampsMin: 110,
  ampsMax: 165,
  travelSpeedMinMmPerMin: 250,
  travelSpeedMaxMmPerMin: 450,
  heatInputMaxKJPerMm: 1.2,
  heatInputBasis: "arc-energy",
  preheatMinC: 10,
  interpassMaxC: 250,
  positions: ["2F", "1F"],
};

const uniqueRef = (prefix = "IT") => `${prefix}-${randomBytes(4).toString("hex").toUpperCase()}`;

async function createWps(lead: Session, extra: { process?: string; title?: string } = {}) {
  const reference = uniqueRef();
  const r = await api("/api/wps", { session: lead, body: { reference, title: extra.title ?? "Integration test fillets", process: extra.process ?? "GMAW" } });
  expect(r.status, r.text).toBe(201);
  return { id: r.json.wps.id as string, reference, revision: r.json.revision };
}

async function publishedWps(lead: Session) {
  const w = await createWps(lead);
  expect((await api(`/api/wps/${w.id}/revisions/1`, { session: lead, method: "PATCH", body: COMPLETE })).status).toBe(200);
  const pub = await api(`/api/wps/${w.id}/revisions/1/publish`, { session: lead, body: { changeNote: "First issue." } });
  expect(pub.status, pub.text).toBe(200);
  return w;
}

afterAll(async () => {
  await db().$client.end();
});

describe("WPS library: drafts, publishing, revisions", () => {
  it("a lead starts a draft, fills it in and publishes it with a change note", async () => {
    const lead = await session("lead@irongully.example");
    const w = await createWps(lead);
    expect(w.reference).toMatch(/^IT-/);
    expect(w.revision).toMatchObject({ number: 1, status: "draft", content: { process: "GMAW", iso4063: 135, title: "Integration test fillets" } });
    const patch = await api(`/api/wps/${w.id}/revisions/1`, { session: lead, method: "PATCH", body: COMPLETE });
    expect(patch.status, patch.text).toBe(200);
    expect(patch.json.revision.content.positions).toEqual(["1F", "2F"]);
    const pub = await api(`/api/wps/${w.id}/revisions/1/publish`, { session: lead, body: { changeNote: "First issue for the bracket line." } });
    expect(pub.status, pub.text).toBe(200);
    expect(pub.json.revision).toMatchObject({ number: 1, status: "published", changeNote: "First issue for the bracket line.", publisherName: "Nell Corrigan" });
    expect(pub.json.superseded).toBeNull();
    const got = await api(`/api/wps/${w.id}`, { session: lead });
    expect(got.json.wps).toMatchObject({ reference: w.reference, state: "published", publishedNumber: 1, draftNumber: null });
    expect(got.json.current.content.ampsMax).toBe(165);
  });

  it("a published revision never changes through the API (409); a new revision starts as a draft copy, numbered on", async () => {
    const lead = await session("lead@irongully.example");
    const w = await publishedWps(lead);
    const change = await api(`/api/wps/${w.id}/revisions/1`, { session: lead, method: "PATCH", body: { ampsMax: 300 } });
    expect(change.status).toBe(409);
    expect(change.json.error).toMatchObject({ code: "conflict", status: "published" });
    expect((await api(`/api/wps/${w.id}/revisions/1/publish`, { session: lead, body: { changeNote: "Again." } })).status).toBe(409);
    expect((await api(`/api/wps/${w.id}/revisions/1`, { session: lead })).json.revision.content.ampsMax).toBe(165);

    const rev2 = await api(`/api/wps/${w.id}/revisions`, { session: lead, method: "POST" });
    expect(rev2.status, rev2.text).toBe(201);
    expect(rev2.json.revision).toMatchObject({ number: 2, status: "draft", changeNote: null });
    expect(rev2.json.revision.content).toEqual((await api(`/api/wps/${w.id}/revisions/1`, { session: lead })).json.revision.content);
    const twice = await api(`/api/wps/${w.id}/revisions`, { session: lead, method: "POST" });
    expect(twice.status).toBe(409);
    expect(twice.json.error.draftNumber).toBe(2);

    expect((await api(`/api/wps/${w.id}/revisions/2`, { session: lead, method: "PATCH", body: { ampsMax: 150, notes: "Cut for thin wall." } })).status).toBe(200);
    const pub2 = await api(`/api/wps/${w.id}/revisions/2/publish`, { session: lead, body: { changeNote: "Maximum current cut to 150 A." } });
    expect(pub2.status, pub2.text).toBe(200);
    expect(pub2.json.superseded).toBe(1);

    const rev3 = await api(`/api/wps/${w.id}/revisions`, { session: lead, method: "POST" });
    expect(rev3.json.revision.number).toBe(3);
    expect(rev3.json.revision.content.ampsMax).toBe(150);

    const got = await api(`/api/wps/${w.id}`, { session: lead });
    expect(got.json.revisions.map((r: any) => [r.number, r.status])).toEqual([
      [3, "draft"],
      [2, "published"],
      [1, "retired"],
    ]);
    expect(got.json.revisions[2].retireNote).toBe("Superseded by revision 2.");
    expect(got.json.current.number).toBe(2);
    expect(got.json.wps).toMatchObject({ state: "published", publishedNumber: 2, draftNumber: 3 });
    // The first revision is still readable as it was, for the welds made to it.
    expect((await api(`/api/wps/${w.id}/revisions/1`, { session: lead })).json.revision.content.ampsMax).toBe(165);
  });

  it("publishing refuses an incomplete draft (422 naming the fields) and a missing change note (400)", async () => {
    const lead = await session("lead@irongully.example");
    const w = await createWps(lead, { process: "GTAW" });
    const noNote = await api(`/api/wps/${w.id}/revisions/1/publish`, { session: lead, body: {} });
    expect(noNote.status).toBe(400);
    expect(noNote.json.error.fields.changeNote).toBeDefined();
    const early = await api(`/api/wps/${w.id}/revisions/1/publish`, { session: lead, body: { changeNote: "First issue." } });
    expect(early.status).toBe(422);
    expect(Object.keys(early.json.error.fields)).toEqual(expect.arrayContaining(["baseMetals", "voltsMin", "positions", "shieldingGas", "preheatMinC"]));
    expect((await api(`/api/wps/${w.id}`, { session: lead })).json.wps.state).toBe("draft");
  });

  it("bad values answer 400 with field errors; a reference already in the library answers 409", async () => {
    const lead = await session("lead@irongully.example");
    const w = await createWps(lead);
    const bad = await api(`/api/wps/${w.id}/revisions/1`, { session: lead, method: "PATCH", body: { voltsMin: 30, voltsMax: 20, iso4063: 141, ampsMax: -5 } });
    expect(bad.status).toBe(400);
    expect(bad.json.error.fields.ampsMax).toBeDefined();
    const cross = await api(`/api/wps/${w.id}/revisions/1`, { session: lead, method: "PATCH", body: { voltsMin: 30, voltsMax: 20, iso4063: 141 } });
    expect(cross.status).toBe(400);
    expect(Object.keys(cross.json.error.fields).sort()).toEqual(["iso4063", "voltsMin"]);
    const unknown = await api(`/api/wps/${w.id}/revisions/1`, { session: lead, method: "PATCH", body: { status: "published" } });
    expect(unknown.status).toBe(400);
    const notJson = await api(`/api/wps/${w.id}/revisions/1`, { session: lead, method: "PATCH", body: "{nope" });
    expect(notJson.status).toBe(400);
    const dup = await api("/api/wps", { session: lead, body: { reference: w.reference.toLowerCase(), title: "Same again", process: "GMAW" } });
    expect(dup.status).toBe(409);
    expect(dup.json.error.fields.reference).toBeDefined();
    const badRef = await api("/api/wps", { session: lead, body: { reference: "no spaces allowed", title: "x", process: "OFW" } });
    expect(badRef.status).toBe(400);
    expect(Object.keys(badRef.json.error.fields)).toEqual(expect.arrayContaining(["reference", "title", "process"]));
  });

  it("retiring takes the WPS out of use with a reason; a draft cannot be retired; a retired WPS can come back as a new revision", async () => {
    const lead = await session("lead@irongully.example");
    const w = await publishedWps(lead);
    expect((await api(`/api/wps/${w.id}/revisions/1/retire`, { session: lead, body: {} })).status).toBe(400);
    const ret = await api(`/api/wps/${w.id}/revisions/1/retire`, { session: lead, body: { reason: "Filler no longer stocked." } });
    expect(ret.status, ret.text).toBe(200);
    expect(ret.json.revision).toMatchObject({ status: "retired", retireNote: "Filler no longer stocked.", retiredByName: "Nell Corrigan" });
    expect((await api(`/api/wps/${w.id}/revisions/1/retire`, { session: lead, body: { reason: "Again." } })).status).toBe(409);
    expect((await api(`/api/wps/${w.id}`, { session: lead })).json.wps.state).toBe("retired");
    expect(await publishedWpsByReference((await shopIdOf("iron-gully")), w.reference)).toBeNull();

    const rev2 = await api(`/api/wps/${w.id}/revisions`, { session: lead, method: "POST" });
    expect(rev2.json.revision.number).toBe(2);
    const draftRetire = await api(`/api/wps/${w.id}/revisions/2/retire`, { session: lead, body: { reason: "Not yet in use." } });
    expect(draftRetire.status).toBe(409);
    expect((await api(`/api/wps/${w.id}/revisions/2/publish`, { session: lead, body: { changeNote: "Back with the new filler." } })).status).toBe(200);
    expect((await api(`/api/wps/${w.id}`, { session: lead })).json.wps.state).toBe("published");
  });
});

async function shopIdOf(slug: string): Promise<string> {
  return withDb(async (c) => (await c.query("select id from shop where slug = $1", [slug])).rows[0].id);
}

describe("WPS immutability in the database, whoever asks", () => {
  it("a superuser cannot change or delete a published or retired revision, nor rename a WPS; a draft still saves", async () => {
    const admin = process.env.ADMIN_DATABASE_URL;
    expect(admin, "the test stack provides ADMIN_DATABASE_URL").toBeTruthy();
    const lead = await session("lead@irongully.example");
    const w = await publishedWps(lead);
    await api(`/api/wps/${w.id}/revisions`, { session: lead, method: "POST" });
    await withDb(async (c) => {
      const su = (await c.query("select rolsuper from pg_roles where rolname = current_user")).rows[0];
      expect(su.rolsuper).toBe(true);
      const refused = async (text: string, params: unknown[]) => {
        await c.query("savepoint s");
        try {
          await c.query(text, params);
          throw new Error(`not refused: ${text}`);
        } catch (error: any) {
          expect(error.code, `${text}: ${error.message}`).toBe("23000");
          await c.query("rollback to savepoint s");
          return error.message as string;
        }
      };
      await c.query("begin");
      expect(await refused("update wps_revision set amps_max = 999 where wps_id = $1 and number = 1", [w.id])).toMatch(/published and never changes/);
      await refused("update wps_revision set change_note = 'rewritten' where wps_id = $1 and number = 1", [w.id]);
      // Retiring may touch only status and who/when/why: sneaking in another change is refused too.
      await refused("update wps_revision set status = 'retired', retired_at = now(), amps_max = 999 where wps_id = $1 and number = 1", [w.id]);
      await refused("delete from wps_revision where wps_id = $1 and number = 1", [w.id]);
      await refused("update wps set reference = 'RENAMED' where id = $1", [w.id]);
      await refused("update wps_revision set status = 'retired', retired_at = now() where wps_id = $1 and number = 2", [w.id]);
      const draft = await c.query("update wps_revision set amps_max = 140 where wps_id = $1 and number = 2 returning amps_max", [w.id]);
      expect(draft.rows[0].amps_max).toBe(140);
      const retire = await c.query("update wps_revision set status = 'retired', retired_at = now(), retire_note = 'by hand' where wps_id = $1 and number = 1 returning status", [w.id]);
      expect(retire.rows[0].status).toBe("retired");
      await refused("update wps_revision set retire_note = 'changed my mind' where wps_id = $1 and number = 1", [w.id]);
      await refused("update wps_revision set status = 'published' where wps_id = $1 and number = 1", [w.id]);
      await c.query("rollback");
    }, admin);
    expect((await api(`/api/wps/${w.id}/revisions/1`, { session: lead })).json.revision).toMatchObject({ status: "published", content: { ampsMax: 165 } });
  });
});

describe("WPS roles and shops", () => {
  it("everyone in the shop reads the library; only a lead writes (a welder's POST is 403)", async () => {
    const lead = await session("lead@irongully.example");
    const w = await publishedWps(lead);
    for (const who of ["welder@irongully.example", "welder2@irongully.example", "inspector@irongully.example", "auditor@irongully.example"]) {
      const s = await session(who);
      expect((await api("/api/wps", { session: s })).status, who).toBe(200);
      expect((await api(`/api/wps/${w.id}`, { session: s })).status, who).toBe(200);
      expect((await api(`/api/wps/${w.id}/revisions/1`, { session: s })).status, who).toBe(200);
      const post = await api("/api/wps", { session: s, body: { reference: uniqueRef(), title: "Not mine to write", process: "GMAW" } });
      expect(post.status, who).toBe(403);
      expect(post.json.error.code).toBe("forbidden");
      expect((await api(`/api/wps/${w.id}/revisions`, { session: s, method: "POST" })).status, who).toBe(403);
      expect((await api(`/api/wps/${w.id}/revisions/1/retire`, { session: s, body: { reason: "Because." } })).status, who).toBe(403);
    }
    expect((await api("/api/wps")).status).toBe(401);
  });

  it("another shop's WPS answers 404 to every route, both ways", async () => {
    const lead = await session("lead@irongully.example");
    const other = await session("lead@saltpan.example");
    const w = await publishedWps(lead);
    const theirs = (await api("/api/wps", { session: other })).json.wps[0];
    expect(theirs.reference).toBe("SP-WPS-01");
    const paths = [`/api/wps/${w.id}`, `/api/wps/${w.id}/revisions/1`];
    for (const p of paths) expect((await api(p, { session: other })).status, p).toBe(404);
    expect((await api(`/api/wps/${w.id}/revisions/1`, { session: other, method: "PATCH", body: { ampsMax: 100 } })).status).toBe(404);
    expect((await api(`/api/wps/${w.id}/revisions/1/retire`, { session: other, body: { reason: "Not ours." } })).status).toBe(404);
    expect((await api(`/api/wps/${w.id}/revisions`, { session: other, method: "POST" })).status).toBe(404);
    expect((await api(`/api/wps/${theirs.id}`, { session: lead })).status).toBe(404);
    expect((await api("/api/wps?q=SP-WPS", { session: lead })).json.total).toBe(0);
    expect((await api("/api/wps/not-a-uuid", { session: lead })).status).toBe(404);
    expect((await api(`/api/wps/${w.id}/revisions/zero`, { session: lead })).status).toBe(404);
    expect((await api(`/api/wps/${w.id}/revisions/99`, { session: lead })).status).toBe(404);
  });

  it("the list pages on the server and filters by state, process and search", async () => {
    const lead = await session("lead@irongully.example");
    const tag = `Paging ${randomBytes(3).toString("hex")}`;
    for (let i = 0; i < 3; i++) await createWps(lead, { title: `${tag} ${i}`, process: i === 2 ? "SMAW" : "GMAW" });
    const page1 = await api(`/api/wps?q=${encodeURIComponent(tag)}&pageSize=2`, { session: lead });
    expect(page1.json).toMatchObject({ total: 3, page: 1, pageSize: 2 });
    expect(page1.json.wps).toHaveLength(2);
    const page2 = await api(`/api/wps?q=${encodeURIComponent(tag)}&pageSize=2&page=2`, { session: lead });
    expect(page2.json.wps).toHaveLength(1);
    const all = [...page1.json.wps, ...page2.json.wps].map((r: any) => r.id);
    expect(new Set(all).size).toBe(3);
    expect((await api(`/api/wps?q=${encodeURIComponent(tag)}&process=SMAW`, { session: lead })).json.total).toBe(1);
    expect((await api(`/api/wps?q=${encodeURIComponent(tag)}&state=draft`, { session: lead })).json.total).toBe(3);
    expect((await api(`/api/wps?q=${encodeURIComponent(tag)}&state=published`, { session: lead })).json.total).toBe(0);
    const seeded = await api("/api/wps?state=published&process=GTAW", { session: lead });
    expect(seeded.json.wps.map((r: any) => r.reference)).toContain("GUS-GTAW-01");
    expect((await api("/api/wps?state=nonsense", { session: lead })).status).toBe(400);
    expect((await api("/api/wps?pageSize=1000", { session: lead })).status).toBe(400);
  });
});

describe("for the jobs side: a published WPS's ranges for checkPassAgainstWps", () => {
  it("loads by reference (published only) and by revision id, and the check reads them", async () => {
    const shopId = await shopIdOf("iron-gully");
    const seeded = await publishedWpsByReference(shopId, "gus-gtaw-01");
    expect(seeded).not.toBeNull();
    expect(seeded!).toMatchObject({ reference: "GUS-GTAW-01", status: "published", process: "GTAW" });
    expect(seeded!.number).toBeGreaterThanOrEqual(2);
    expect(seeded!.ranges).toMatchObject({ process: "GTAW", preheatMinC: 20 });
    // Below the WPS's minimum preheat the pass is refused outright (lib/welding wps-check).
    expect(checkPassAgainstWps(seeded!.ranges, { volts: 12, amps: 100, travelSpeedMmPerMin: 100, preheatC: 12 }).blocked).toBe(true);
    expect(checkPassAgainstWps(seeded!.ranges, { volts: 12, amps: 100, travelSpeedMmPerMin: 100, preheatC: 22 }).ok).toBe(true);
    const again = await loadWpsRanges(shopId, seeded!.revisionId);
    expect(again).toEqual(seeded);
    const saltId = await shopIdOf("saltpan");
    await expect(loadWpsRanges(saltId, seeded!.revisionId)).rejects.toMatchObject({ code: "not_found" });
    expect(await publishedWpsByReference(saltId, "GUS-GTAW-01")).toBeNull();
  });
});
