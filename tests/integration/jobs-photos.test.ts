import fs from "node:fs";
import sharp from "sharp";
import { createHash } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { insertPublishedProcedure, jobBody, TEST_PROCEDURE_CONTENT } from "../fixtures/jobs/procedure";
import { FIXTURE_JPEG, uploadBytes, uploadFixture } from "./jobs-support";
import { api, BASE_URL, session, withDb, type Session } from "./support";

type Rec = Record<string, any>;
let lead: Session;
let welder: Session;
let auditor: Session;
let otherLead: Session;
let rec: Rec;
const step = (r: Rec, key: string) => r.steps.find((s: Rec) => s.key === key);

beforeAll(async () => {
  [lead, welder, auditor, otherLead] = await Promise.all([
    session("lead@irongully.example"),
    session("welder@irongully.example"),
    session("auditor@irongully.example"),
    session("lead@saltpan.example"),
  ]);
  const versionId = await withDb((c) => insertPublishedProcedure(c, { shopSlug: "iron-gully", ownerEmail: "lead@irongully.example", title: "Jobs photo procedure", content: TEST_PROCEDURE_CONTENT }));
  const created = await api("/api/jobs", { session: lead, body: jobBody(versionId) });
  rec = (await api(`/api/jobs/${created.json.job.id}`, { session: lead })).json;
});

async function fetchPhoto(who: Session, url: string) {
  const res = await fetch(`${BASE_URL}${url}`, { headers: { cookie: who.cookie, "x-forwarded-for": who.ip } });
  return { status: res.status, type: res.headers.get("content-type"), bytes: Buffer.from(await res.arrayBuffer()) };
}

describe("photos", () => {
  it("a JPEG is re-encoded without metadata, thumbnailed, stored under a server key and served to members only", async () => {
    expect((await sharp(FIXTURE_JPEG).metadata()).exif).toBeDefined(); // the fixture carries GPS on purpose
    const up = await uploadFixture(welder, rec.job.id, { stepId: step(rec, "p-fit").id });
    expect(up.status, up.text).toBe(201);
    const photo = up.json.record.photos.find((p: Rec) => p.id === up.json.photoId);
    expect(photo).toMatchObject({ stepId: step(rec, "p-fit").id, width: 1600, height: 1200 });
    const full = await fetchPhoto(welder, photo.url);
    expect(full.status).toBe(200);
    expect(full.type).toBe("image/jpeg");
    expect(createHash("sha256").update(full.bytes).digest("hex")).toBe(photo.sha256);
    const meta = await sharp(full.bytes).metadata();
    expect(meta.exif).toBeUndefined();
    expect(meta.icc).toBeUndefined();
    const thumb = await fetchPhoto(auditor, photo.thumbUrl);
    expect(thumb.status).toBe(200);
    expect((await sharp(thumb.bytes).metadata()).width).toBeLessThanOrEqual(360);
    expect((await fetchPhoto(otherLead, photo.url)).status).toBe(404);
    const anon = await fetch(`${BASE_URL}${photo.url}`);
    expect(anon.status).toBe(401);
    const row = await withDb(async (c) => (await c.query("select key, thumb_key, original_type from photo where id = $1", [photo.id])).rows[0]);
    expect(row.key).toMatch(new RegExp(`^shops/[0-9a-f-]{36}/jobs/${rec.job.id}/photos/[0-9a-f]{32}\\.jpg$`));
    expect(row.key).not.toContain("photo.jpg");
    expect(row.original_type).toBe("image/jpeg");
  });

  it("a retried upload with the same idempotency key makes no second photo", async () => {
    const key = `retry-${Date.now()}`;
    const first = await uploadFixture(welder, rec.job.id, { stepId: step(rec, "c-clean").id, key });
    expect(first.status).toBe(201);
    const again = await uploadFixture(welder, rec.job.id, { stepId: step(rec, "c-clean").id, key });
    expect(again.status).toBe(200);
    expect(again.json.photoId).toBe(first.json.photoId);
    const n = await withDb(async (c) => (await c.query("select count(*)::int as n from photo where idempotency_key = $1", [key])).rows[0].n);
    expect(n).toBe(1);
  });

  it("types are judged by content: a renamed executable and a text file are refused (415), a truncated JPEG (422)", async () => {
    const elf = fs.readFileSync("/bin/true");
    const program = await uploadBytes(welder, rec.job.id, elf, { name: "bracket.jpg", type: "image/jpeg" });
    expect(program.status).toBe(415);
    expect(program.json.error.message).toMatch(/a program, not a photo/);
    const text = await uploadBytes(welder, rec.job.id, Buffer.from("#!/bin/sh\necho not a photo\n"), { name: "photo.png", type: "image/png" });
    expect(text.status).toBe(415);
    const truncated = await uploadBytes(welder, rec.job.id, FIXTURE_JPEG.subarray(0, Math.floor(FIXTURE_JPEG.length / 2)));
    expect(truncated.status).toBe(422);
    expect(truncated.json.error.message).toMatch(/incomplete or damaged/);
    const after = (await api(`/api/jobs/${rec.job.id}`, { session: lead })).json;
    expect(after.photos.every((p: Rec) => p.width > 0)).toBe(true);
  });

  it("PNG and WebP are taken; over 20 MB is refused with 413", async () => {
    const png = await sharp({ create: { width: 64, height: 48, channels: 4, background: { r: 10, g: 200, b: 30, alpha: 0.5 } } }).png().toBuffer();
    const webp = await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 10, g: 20, b: 230 } } }).webp().toBuffer();
    const a = await uploadBytes(welder, rec.job.id, png, { name: "x.bin", type: "application/octet-stream" });
    expect(a.status, a.text).toBe(201);
    expect((await uploadBytes(welder, rec.job.id, webp, { name: "x.webp", type: "image/webp" })).status).toBe(201);
    const big = Buffer.concat([FIXTURE_JPEG, Buffer.alloc(20 * 1024 * 1024)]);
    const tooBig = await uploadBytes(welder, rec.job.id, big);
    expect(tooBig.status).toBe(413);
  });

  it("a signed step's photos are part of its record: no new photo, none taken off", async () => {
    const after = (await api(`/api/jobs/${rec.job.id}`, { session: lead })).json;
    const s = step(after, "c-clean");
    expect((await api(`/api/jobs/${rec.job.id}/steps/${s.id}/value`, { session: welder, method: "PUT", body: { baseVersion: s.version, value: { confirmed: true } } })).status).toBe(200);
    const fresh = step((await api(`/api/jobs/${rec.job.id}`, { session: lead })).json, "c-clean");
    expect((await api(`/api/jobs/${rec.job.id}/steps/${s.id}/sign`, { session: welder, body: { pin: "2468", baseVersion: fresh.version } })).status).toBe(201);
    expect((await uploadFixture(welder, rec.job.id, { stepId: s.id })).status).toBe(409);
    const photoId = fresh.photoIds[0];
    expect((await api(`/api/jobs/${rec.job.id}/photos/${photoId}`, { session: welder, method: "DELETE" })).status).toBe(409);
    await withDb(async (c) => {
      await expect(c.query("delete from photo where id = $1", [photoId])).rejects.toThrow(/kept/);
      await expect(c.query("update photo set removed_at = now() where id = $1", [photoId])).rejects.toThrow(/signed step/);
    });
  });
});
