import { randomBytes } from "node:crypto";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { currentQualification, getQualification, listQualifications, recordProcessUse } from "@/db/queries/qualifications";
import { db } from "@/lib/db";
import { addDays, addMonthsClamped, continuity } from "@/lib/welding";
import { api, BASE_URL, session, withDb, type Session } from "./support";

// Continuity sources (REFERENCES.md "Welder qualification continuity"):
//  ASME BPVC IX QW-322.1: lapses when the process is unused for 6 months or more → lapsed ON the anniversary.
//  AWS D1.1 (6.2.3.1 in the 2020 edition; clause number from memory): lapses when unused for a period
//  EXCEEDING six months → the anniversary still holds, lapsed from the day after.
//  Worked example there: last GTAW use 2025-01-10 → ASME expired on 2025-07-10; D1.1 expired from 2025-07-11.

type Shop = { id: string; slug: string };
let iron: Shop;
let salt: Shop;
let ironWelder: string;
let saltWelder: string;
let ironInspector: string;

async function addMember(shopId: string, roles: string[], name: string) {
  const id = randomBytes(16).toString("hex");
  const email = `q-${id.slice(0, 8)}@test.example`;
  await withDb(async (c) => {
    await c.query(`insert into "user" (id, name, email, email_verified, created_at, updated_at) values ($1, $2, $3, true, now(), now())`, [id, name, email]);
    await c.query(`insert into membership (shop_id, user_id, roles) values ($1, $2, $3)`, [shopId, id, roles]);
  });
  return id;
}

async function setCode(shopId: string, code: "asme-ix" | "aws-d1.1") {
  await withDb((c) => c.query("update shop set continuity_code = $1 where id = $2", [code, shopId]));
}

function qualification(welderUserId: string, process: string, testDate: string, extra: Record<string, unknown> = {}) {
  return { welderUserId, process, positions: ["1F", "2F", "3F", "4F"], thicknessMinMm: 1.5, thicknessMaxMm: 8, fillerFNumber: 6, testDate, ...extra };
}

async function add(lead: Session, body: Record<string, unknown>) {
  const r = await api("/api/qualifications", { session: lead, body });
  expect(r.status, r.text).toBe(201);
  return r.json.qualification;
}

beforeAll(async () => {
  const shops = await withDb(async (c) => (await c.query("select id, slug from shop where slug in ('iron-gully', 'saltpan')")).rows as Shop[]);
  iron = shops.find((s) => s.slug === "iron-gully")!;
  salt = shops.find((s) => s.slug === "saltpan")!;
  await setCode(iron.id, "aws-d1.1");
  await setCode(salt.id, "asme-ix");
  ironWelder = await addMember(iron.id, ["welder"], "Ivo Testwelder");
  saltWelder = await addMember(salt.id, ["welder"], "Sol Testwelder");
  ironInspector = await addMember(iron.id, ["inspector"], "Ines Testinspector");
});

afterAll(async () => {
  // The demo's own codes, whatever a test switched.
  await setCode(iron.id, "aws-d1.1");
  await setCode(salt.id, "asme-ix");
  await db().$client.end();
});

describe("continuity at the edge dates, through the queries", () => {
  it("AWS D1.1 shop: last GTAW use 2025-01-10 still holds on 2025-07-10 and is refused from 2025-07-11, with the reason and the date", async () => {
    const lead = await session("lead@irongully.example");
    const q = await add(lead, qualification(ironWelder, "GTAW", "2024-12-02"));
    await db().transaction((tx) => recordProcessUse(tx, { shopId: iron.id, welderUserId: ironWelder, process: "GTAW", date: "2025-01-10" }));

    const holds = await currentQualification({ shopId: iron.id, welderUserId: ironWelder, process: "GTAW", onDate: "2025-07-10" });
    expect(holds).toMatchObject({ ok: true, status: "lapsing", lastUsedOn: "2025-01-10", lastValidOn: "2025-07-10", expiresOn: "2025-07-11", daysLeft: 1, code: "aws-d1.1" });
    expect(holds.lapsedOn).toBeUndefined();
    expect(holds.qualifications.map((x) => x.id)).toEqual([q.id]);

    const refused = await currentQualification({ shopId: iron.id, welderUserId: ironWelder, process: "GTAW", onDate: "2025-07-11" });
    expect(refused).toMatchObject({ ok: false, lapsedOn: "2025-07-11", status: "lapsed", daysLeft: 0 });
    expect(refused.reason).toContain("Ivo Testwelder's GTAW qualification lapsed on 2025-07-11");
    expect(refused.reason).toContain("last used on 2025-01-10");
    expect(refused.reason).toContain("AWS D1.1");

    // The list query's SQL filter agrees with lib/welding continuity() on both sides of the edge.
    const on10 = await listQualifications(iron.id, { welderUserId: ironWelder, status: "lapsing", page: 1, pageSize: 10, today: "2025-07-10" });
    expect(on10.rows.map((r) => [r.id, r.continuity.daysLeft])).toEqual([[q.id, 1]]);
    expect((await listQualifications(iron.id, { welderUserId: ironWelder, status: "lapsed", page: 1, pageSize: 10, today: "2025-07-10" })).total).toBe(0);
    const on11 = await listQualifications(iron.id, { welderUserId: ironWelder, status: "lapsed", page: 1, pageSize: 10, today: "2025-07-11" });
    expect(on11.rows.map((r) => r.continuity.expiresOn)).toEqual(["2025-07-11"]);
  });

  it("ASME IX shop: the same last use lapses on 2025-07-10 itself (QW-322.1, '6 months or more')", async () => {
    const lead = await session("lead@saltpan.example");
    await add(lead, qualification(saltWelder, "GTAW", "2024-12-02"));
    await recordProcessUse(db(), { shopId: salt.id, welderUserId: saltWelder, process: "GTAW", date: "2025-01-10" });
    const holds = await currentQualification({ shopId: salt.id, welderUserId: saltWelder, process: "GTAW", onDate: "2025-07-09" });
    expect(holds).toMatchObject({ ok: true, lastValidOn: "2025-07-09", expiresOn: "2025-07-10", daysLeft: 1, code: "asme-ix" });
    const refused = await currentQualification({ shopId: salt.id, welderUserId: saltWelder, process: "GTAW", onDate: "2025-07-10" });
    expect(refused).toMatchObject({ ok: false, lapsedOn: "2025-07-10" });
    expect(refused.reason).toContain("lapsed on 2025-07-10");
    expect(refused.reason).toContain("ASME BPVC Section IX");
    const lapsed = await listQualifications(salt.id, { welderUserId: saltWelder, status: "lapsed", page: 1, pageSize: 10, today: "2025-07-10" });
    expect(lapsed.total).toBe(1);
    expect(lapsed.code).toBe("asme-ix");
  });

  it("month ends clamp the same way in SQL and in lib/welding: last use 2025-08-31 → 2026-02-28 (ASME) / 2026-03-01 (D1.1)", async () => {
    const lead = await session("lead@irongully.example");
    const q = await add(lead, qualification(ironWelder, "FCAW", "2025-08-31"));
    for (const [code, lastDay, lapsedFrom] of [
      ["aws-d1.1", "2026-02-28", "2026-03-01"],
      ["asme-ix", "2026-02-27", "2026-02-28"],
    ] as const) {
      await setCode(iron.id, code);
      expect(continuity(code, "2025-08-31", lastDay).status).toBe("lapsing");
      const before = await listQualifications(iron.id, { welderUserId: ironWelder, process: "FCAW", status: "lapsing", page: 1, pageSize: 5, today: lastDay });
      expect(before.rows.map((r) => [r.id, r.continuity.expiresOn]), code).toEqual([[q.id, lapsedFrom]]);
      const after = await listQualifications(iron.id, { welderUserId: ironWelder, process: "FCAW", status: "lapsed", page: 1, pageSize: 5, today: lapsedFrom });
      expect(after.total, code).toBe(1);
      expect((await currentQualification({ shopId: iron.id, welderUserId: ironWelder, process: "FCAW", onDate: lapsedFrom })).lapsedOn).toBe(lapsedFrom);
    }
    await setCode(iron.id, "aws-d1.1");
  });

  it("a lead's switch of the shop's code (PUT /api/qualifications/continuity-code) moves the edge by a day", async () => {
    const lead = await session("lead@irongully.example");
    const welder = await session("welder@irongully.example");
    expect((await api("/api/qualifications/continuity-code", { session: welder, method: "PUT", body: { code: "asme-ix" } })).status).toBe(403);
    expect((await api("/api/qualifications/continuity-code", { session: lead, method: "PUT", body: { code: "iso-9606" } })).status).toBe(400);
    try {
      const put = await api("/api/qualifications/continuity-code", { session: lead, method: "PUT", body: { code: "asme-ix" } });
      expect(put.status).toBe(200);
      expect(put.json.continuity.code).toBe("asme-ix");
      expect((await api("/api/qualifications/continuity-code", { session: welder })).json.continuity.code).toBe("asme-ix");
      const r = await currentQualification({ shopId: iron.id, welderUserId: ironWelder, process: "GTAW", onDate: "2025-07-10" });
      expect(r).toMatchObject({ ok: false, lapsedOn: "2025-07-10", code: "asme-ix" });
    } finally {
      expect((await api("/api/qualifications/continuity-code", { session: lead, method: "PUT", body: { code: "aws-d1.1" } })).status).toBe(200);
    }
    expect((await currentQualification({ shopId: iron.id, welderUserId: ironWelder, process: "GTAW", onDate: "2025-07-10" })).ok).toBe(true);
  });

  it("every logged use moves the last use forward only; a later use carries the qualification on", async () => {
    expect((await recordProcessUse(db(), { shopId: iron.id, welderUserId: ironWelder, process: "GTAW", date: "2025-03-01" })).lastUsedOn).toBe("2025-03-01");
    expect((await recordProcessUse(db(), { shopId: iron.id, welderUserId: ironWelder, process: "GTAW", date: new Date("2025-02-01T10:00:00Z") })).lastUsedOn).toBe("2025-03-01");
    const r = await currentQualification({ shopId: iron.id, welderUserId: ironWelder, process: "GTAW", onDate: "2025-07-11" });
    expect(r).toMatchObject({ ok: true, lastUsedOn: "2025-03-01", expiresOn: "2025-09-02" });
    // Asked about a day before a later recorded use, the use counts no later than that day.
    expect((await currentQualification({ shopId: iron.id, welderUserId: ironWelder, process: "GTAW", onDate: "2025-02-15" })).lastUsedOn).toBe("2025-02-15");
    await expect(recordProcessUse(db(), { shopId: iron.id, welderUserId: ironWelder, process: "OFW", date: "2025-03-01" })).rejects.toMatchObject({ code: "bad_request" });
    await expect(recordProcessUse(db(), { shopId: iron.id, welderUserId: ironWelder, process: "GTAW", date: "2025-02-30" })).rejects.toMatchObject({ code: "bad_request" });
  });

  it("refuses with a reason: no qualification for the process, not a welder, not yet tested", async () => {
    const none = await currentQualification({ shopId: iron.id, welderUserId: ironWelder, process: "SAW", onDate: "2025-07-01" });
    expect(none).toMatchObject({ ok: false, reason: "Ivo Testwelder holds no SAW qualification in this shop." });
    const inspector = await currentQualification({ shopId: iron.id, welderUserId: ironInspector, process: "GTAW", onDate: "2025-07-01" });
    expect(inspector).toMatchObject({ ok: false, reason: "Ines Testinspector is not an active welder of this shop." });
    const otherShop = await currentQualification({ shopId: salt.id, welderUserId: ironWelder, process: "GTAW", onDate: "2025-07-01" });
    expect(otherShop.ok).toBe(false);
    const early = await currentQualification({ shopId: iron.id, welderUserId: ironWelder, process: "GTAW", onDate: "2024-11-01" });
    expect(early).toMatchObject({ ok: false, reason: "Ivo Testwelder's GTAW qualification was tested on 2024-12-02, after 2024-11-01." });
  });
});

describe("qualifications API", () => {
  it("leads add and edit; every member reads; a welder's POST answers 403", async () => {
    const lead = await session("lead@irongully.example");
    const q = await add(lead, qualification(ironWelder, "SMAW", addDays(new Date().toISOString().slice(0, 10), -10), { fillerFNumber: 4, diameterMinMm: 73, notes: "3G plate" }));
    expect(q).toMatchObject({ welderName: "Ivo Testwelder", process: "SMAW", thicknessMaxMm: 8, diameterMinMm: 73, continuity: { status: "current", code: "aws-d1.1" }, certificate: null });
    for (const who of ["welder@irongully.example", "inspector@irongully.example", "auditor@irongully.example"]) {
      const s = await session(who);
      expect((await api(`/api/qualifications/${q.id}`, { session: s })).status, who).toBe(200);
      expect((await api("/api/qualifications", { session: s })).status, who).toBe(200);
      expect((await api("/api/qualifications", { session: s, body: qualification(ironWelder, "SAW", "2025-01-01") })).status, who).toBe(403);
      expect((await api(`/api/qualifications/${q.id}`, { session: s, method: "PATCH", body: { fillerFNumber: 5 } })).status, who).toBe(403);
    }
    expect((await api("/api/qualifications")).status).toBe(401);
    const patch = await api(`/api/qualifications/${q.id}`, { session: lead, method: "PATCH", body: { thicknessMaxMm: null, positions: ["4F", "1F"], lastUsedOn: addDays(new Date().toISOString().slice(0, 10), -2) } });
    expect(patch.status, patch.text).toBe(200);
    expect(patch.json.qualification).toMatchObject({ thicknessMaxMm: null, positions: ["1F", "4F"] });
    expect(patch.json.qualification.lastJobUseOn).toBe(addDays(new Date().toISOString().slice(0, 10), -2));
  });

  it("bad input answers 400 with field errors; someone who is not a welder, or a WPS of another process, 422", async () => {
    const lead = await session("lead@irongully.example");
    const bad = await api("/api/qualifications", { session: lead, body: qualification(ironWelder, "GTAW", "2999-01-01", { thicknessMinMm: 9, positions: [] }) });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.error.fields)).toEqual(expect.arrayContaining(["testDate", "positions", "thicknessMinMm"]));
    expect((await api("/api/qualifications", { session: lead, body: { ...qualification(ironWelder, "GTAW", "2025-01-01"), grade: "A" } })).status).toBe(400);
    const inspector = await api("/api/qualifications", { session: lead, body: qualification(ironInspector, "GTAW", "2025-01-01") });
    expect(inspector.status).toBe(422);
    expect(inspector.json.error.fields.welderUserId).toBeDefined();
    const otherShopWelder = await api("/api/qualifications", { session: lead, body: qualification(saltWelder, "GTAW", "2025-01-01") });
    expect(otherShopWelder.status).toBe(422);
    const gmawWps = (await api("/api/wps?q=GUS-GMAW-02", { session: lead })).json.wps[0];
    const wrongWps = await api("/api/qualifications", { session: lead, body: qualification(ironWelder, "GTAW", "2025-01-01", { wpsId: gmawWps.id }) });
    expect(wrongWps.status).toBe(422);
    expect(wrongWps.json.error.fields.wpsId).toBeDefined();
  });

  it("another shop's qualification answers 404, both ways", async () => {
    const lead = await session("lead@irongully.example");
    const other = await session("lead@saltpan.example");
    const mine = (await api("/api/qualifications?pageSize=1", { session: lead })).json.qualifications[0];
    const theirs = (await api("/api/qualifications?pageSize=1", { session: other })).json.qualifications[0];
    expect((await api(`/api/qualifications/${mine.id}`, { session: other })).status).toBe(404);
    expect((await api(`/api/qualifications/${mine.id}`, { session: other, method: "PATCH", body: { fillerFNumber: 1 } })).status).toBe(404);
    expect((await api(`/api/qualifications/${mine.id}/certificate`, { session: other })).status).toBe(404);
    expect((await api(`/api/qualifications/${theirs.id}`, { session: lead })).status).toBe(404);
    expect((await api("/api/qualifications/not-a-uuid", { session: lead })).status).toBe(404);
    const names = (await api("/api/qualifications?pageSize=100", { session: other })).json.qualifications.map((q: any) => q.welderName);
    expect(names).not.toContain("Mick Tamsin");
  });

  it("the list filters 'lapsing within 30 days' on the server and pages", async () => {
    const s = await session("auditor@irongully.example");
    const lapsing = await api("/api/qualifications?status=lapsing&pageSize=100", { session: s });
    expect(lapsing.status).toBe(200);
    const rows = lapsing.json.qualifications as any[];
    // The demo seed: Priya Okafor's GTAW was last used a little under six months ago.
    expect(rows.map((r) => `${r.welderName} ${r.process}`)).toContain("Priya Okafor GTAW");
    for (const r of rows) {
      expect(r.continuity.status).toBe("lapsing");
      expect(r.continuity.daysLeft).toBeGreaterThanOrEqual(1);
      expect(r.continuity.daysLeft).toBeLessThanOrEqual(30);
    }
    const lapsed = (await api("/api/qualifications?status=lapsed&pageSize=100", { session: s })).json.qualifications as any[];
    expect(lapsed.map((r) => `${r.welderName} ${r.process}`)).toContain("Mick Tamsin FCAW");
    expect(lapsed.every((r) => r.continuity.status === "lapsed")).toBe(true);
    const current = (await api("/api/qualifications?status=current&pageSize=100", { session: s })).json.qualifications as any[];
    expect(current.map((r) => `${r.welderName} ${r.process}`)).toContain("Mick Tamsin GMAW");
    const all = await api("/api/qualifications?pageSize=2", { session: s });
    expect(all.json.qualifications).toHaveLength(2);
    expect(all.json.total).toBe(rows.length + lapsed.length + current.length);
    const page2 = await api("/api/qualifications?pageSize=2&page=2", { session: s });
    expect(page2.json.qualifications.map((q: any) => q.id)).not.toContain(all.json.qualifications[0].id);
    // Sorted by the day each lapses: soonest first.
    const days = (await api("/api/qualifications?pageSize=100", { session: s })).json.qualifications.map((q: any) => q.continuity.expiresOn);
    expect([...days].sort()).toEqual(days);
    expect((await api("/api/qualifications?status=soon", { session: s })).status).toBe(400);
  });

  it("the seeded dates are worked out from today: one current, one lapsing within 30 days, one lapsed", async () => {
    const today = new Date().toISOString().slice(0, 10);
    const all = (await listQualifications(iron.id, { page: 1, pageSize: 100 })).rows;
    const by = (name: string, process: string) => all.find((r) => r.welderName === name && r.process === process)!;
    // Seeded 20 days ago; the seeded jobs' passes and any pass logged since only move it later.
    expect(by("Mick Tamsin", "GMAW").lastUsedOn >= addDays(today, -20)).toBe(true);
    expect(by("Mick Tamsin", "GMAW").continuity.status).toBe("current");
    expect(by("Priya Okafor", "GTAW").lastUsedOn).toBe(addDays(addMonthsClamped(today, -6), 12));
    expect(by("Priya Okafor", "GTAW").continuity.status).toBe("lapsing");
    expect(by("Mick Tamsin", "FCAW").continuity.status).toBe("lapsed");
    expect((await getQualification(iron.id, by("Mick Tamsin", "FCAW").id)).wpsReference).toBe("GUS-FCAW-01");
  });
});

describe("certificates", () => {
  const pdf = Buffer.from("%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n");

  async function upload(s: Session | undefined, id: string, bytes: Buffer, name: string, type = "application/octet-stream") {
    const form = new FormData();
    form.set("file", new Blob([new Uint8Array(bytes)], { type }), name);
    const res = await fetch(`${BASE_URL}/api/qualifications/${id}/certificate`, {
      method: "POST",
      headers: s ? { cookie: s.cookie, "x-forwarded-for": s.ip, origin: BASE_URL } : { origin: BASE_URL },
      body: form,
    });
    return { status: res.status, json: (await res.json()) as any };
  }

  it("a lead uploads a PDF or a photo (judged by content); members download it; other types and sizes are refused", async () => {
    const lead = await session("lead@irongully.example");
    const q = await add(lead, qualification(ironWelder, "GMAW", "2025-02-01"));
    const welder = await session("welder@irongully.example");
    expect((await api(`/api/qualifications/${q.id}/certificate`, { session: welder })).status).toBe(404);

    // Named .png and sent as an image, but it is a PDF: stored as one.
    const up = await upload(lead, q.id, pdf, "scan.png", "image/png");
    expect(up.status, JSON.stringify(up.json)).toBe(200);
    expect(up.json.certificate).toMatchObject({ name: "scan.png", contentType: "application/pdf", size: pdf.length });
    const down = await fetch(`${BASE_URL}/api/qualifications/${q.id}/certificate`, { headers: { cookie: welder.cookie, "x-forwarded-for": welder.ip } });
    expect(down.status).toBe(200);
    expect(down.headers.get("content-type")).toBe("application/pdf");
    expect(down.headers.get("content-disposition")).toContain('filename="certificate-ivo-testwelder-gmaw.pdf"');
    expect(Buffer.from(await down.arrayBuffer()).equals(pdf)).toBe(true);

    const png = await sharp({ create: { width: 40, height: 30, channels: 3, background: "#aec22b" } }).png().toBuffer();
    const photo = await upload(lead, q.id, png, "photo.pdf", "application/pdf");
    expect(photo.status).toBe(200);
    expect(photo.json.certificate.contentType).toBe("image/png");
    expect((await api(`/api/qualifications/${q.id}`, { session: welder })).json.qualification.certificate).toMatchObject({ contentType: "image/png", name: "photo.pdf" });

    const text = await upload(lead, q.id, Buffer.from("a certificate, honest"), "cert.pdf", "application/pdf");
    expect(text.status).toBe(415);
    expect(text.json.error.fields.file).toBeDefined();
    const gif = await upload(lead, q.id, Buffer.from("GIF89a\x01\x00\x01\x00\x00\x00\x00;", "latin1"), "cert.gif");
    expect(gif.status).toBe(415);
    const big = Buffer.concat([pdf, Buffer.alloc(20 * 1024 * 1024 + 1)]);
    expect((await upload(lead, q.id, big, "big.pdf")).status).toBe(413);
    expect((await upload(lead, q.id, Buffer.alloc(0), "empty.pdf")).status).toBe(400);
    expect((await upload(welder, q.id, pdf, "mine.pdf")).status).toBe(403);
    expect((await upload(undefined, q.id, pdf, "anon.pdf")).status).toBe(401);
    const raw = await api(`/api/qualifications/${q.id}/certificate`, { session: lead, body: { file: "x" } });
    expect(raw.status).toBe(415);
    // The refused uploads left the stored photo as it was.
    expect((await api(`/api/qualifications/${q.id}`, { session: lead })).json.qualification.certificate.contentType).toBe("image/png");
  });
});
