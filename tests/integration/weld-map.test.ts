// The weld map end to end: placed on a procedure draft, sealed with the version, carried by the procedure file
// (formatVersion 2) and back, copied onto jobs, printed on the traveller, and sealed with the release.
import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { jobBody } from "../fixtures/jobs/procedure";
import { uploadFixture } from "./jobs-support";
import { drawingPdf } from "../fixtures/weld-map/pdf";
import { api, BASE_URL, session, withDb, type Session } from "./support";

type Joint = { jointId: string; imageId: string; x: number; y: number; path?: { x: number; y: number }[] };
type Step = { key: string; spec: { kind: string; jointId?: string } };

let lead: Session, welder: Session;
const cleanup: string[] = [];

beforeAll(async () => {
  [lead, welder] = await Promise.all([session("lead@irongully.example"), session("welder@irongully.example")]);
});

afterAll(async () => {
  for (const id of cleanup) await api(`/api/procedures/${id}/versions/1`, { session: lead, method: "DELETE" });
});

/** The text of each page of a PDF, as poppler's pdftotext reads it. */
function pdfPages(pdf: Uint8Array): string[] {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "gusset-map-"));
  try {
    fs.writeFileSync(path.join(dir, "t.pdf"), pdf);
    return execFileSync("pdftotext", ["-enc", "UTF-8", path.join(dir, "t.pdf"), "-"], { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 }).split("\f");
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

const weldJoints = (steps: Step[]) => steps.flatMap((s) => (s.spec.kind === "weld" && s.spec.jointId ? [s.spec.jointId] : []));
const word = (id: string) => new RegExp(`(^|[^A-Za-z0-9])${id}([^0-9]|$)`);

async function upload(base: string, body: Buffer, name: string, type: string) {
  const form = new FormData();
  form.set("file", new File([new Uint8Array(body)], name, { type }));
  const res = await fetch(`${BASE_URL}${base}/weld-map/images`, { method: "POST", headers: { cookie: lead.cookie, origin: BASE_URL }, body: form });
  return { status: res.status, json: (await res.json()) as Record<string, any> };
}

/** Markers keyed by joint, with each image named by its place on the map (ids differ between copies). */
function markers(map: { images: { id: string }[]; joints: Joint[] }) {
  const at = new Map(map.images.map((i, n) => [i.id, n]));
  return Object.fromEntries(map.joints.map((j) => [j.jointId, { image: at.get(j.imageId), x: j.x, y: j.y, path: j.path ?? null }]));
}

// The demo's jobs were made days before the run; jobs other tests make and release are left out.
describe("released demo jobs", () => {
  it("each record's weld map places every weld joint, and each traveller has a weld map page listing them", async () => {
    const jobs = await withDb(async (c) =>
      (await c.query<{ id: string; number: string }>("select j.id, j.number from job j join shop s on s.id = j.shop_id where s.slug = 'iron-gully' and j.status = 'released' and j.created_at < now() - interval '1 day' order by j.number")).rows,
    );
    expect(jobs.length).toBeGreaterThan(0);
    for (const job of jobs) {
      const rec = await api(`/api/jobs/${job.id}`, { session: lead });
      expect(rec.status, rec.text).toBe(200);
      const joints = weldJoints(rec.json.steps);
      expect(joints.length, job.number).toBeGreaterThan(0);
      const map = rec.json.weldMap as { images: { id: string; procedureImageId?: string; photoId?: string; width: number; height: number }[]; joints: Joint[] };
      expect(map, job.number).not.toBeNull();
      expect(map.joints.map((j) => j.jointId).sort(), job.number).toEqual(expect.arrayContaining(joints));
      for (const img of map.images) {
        expect(img.procedureImageId ?? img.photoId).toMatch(/^[0-9a-f-]{36}$/);
        expect(img.width).toBeGreaterThan(0);
      }
      for (const j of map.joints) expect(map.images.some((i) => i.id === j.imageId)).toBe(true);

      const pdf = await fetch(`${BASE_URL}/api/jobs/${job.id}/traveller`, { headers: { cookie: lead.cookie } });
      expect(pdf.status).toBe(200);
      const pages = pdfPages(new Uint8Array(await pdf.arrayBuffer()));
      const mapPage = pages.find((p) => /Weld map/.test(p) && /Weld joints on the map/.test(p));
      expect(mapPage, `${job.number}: no weld map page`).toBeDefined();
      for (const id of joints) expect(mapPage, `${job.number} ${id}`).toMatch(word(id));
    }
  }, 120_000); // renders a full traveller per released job

  it("a marker moved in the database after release breaks the record's verification; put back, it verifies again", async () => {
    const [row] = await withDb(async (c) =>
      (await c.query<{ id: string; weld_map: { joints: Joint[] }; token: string | null }>(
        "select j.id, j.weld_map, t.token from job j join shop s on s.id = j.shop_id left join job_token t on t.job_id = j.id where s.slug = 'iron-gully' and j.status = 'released' and j.created_at < now() - interval '1 day' and j.weld_map is not null order by j.number limit 1",
      )).rows,
    );
    expect(row?.token, "the traveller of the first test made a token").toBeTruthy();
    const verify = async () => (await api(`/api/verify/${row!.token}`)).json.integrity as { intact: boolean; reason?: string };
    expect(await verify()).toMatchObject({ intact: true });
    const moved = structuredClone(row!.weld_map);
    moved.joints[0]!.x = Math.round((1 - moved.joints[0]!.x) * 10_000) / 10_000;
    const write = (map: unknown) =>
      withDb(async (c) => {
        await c.query("set session_replication_role = replica");
        await c.query("update job set weld_map = $2 where id = $1", [row!.id, JSON.stringify(map)]);
        await c.query("set session_replication_role = origin");
      }, process.env.ADMIN_DATABASE_URL);
    try {
      await write(moved);
      const broken = await verify();
      expect(broken.intact).toBe(false);
      expect(broken.reason).toMatch(/weld map differs from the one sealed at release/);
    } finally {
      await write(row!.weld_map);
    }
    expect(await verify()).toMatchObject({ intact: true });
  });
});

describe("a procedure's weld map", () => {
  let procId: string;
  let base: string;
  let png: { id: string };
  let pdfImage: { id: string; width: number; height: number; source: string };

  it("a version-1 file still imports, as a draft without a map", async () => {
    const file = JSON.parse(fs.readFileSync(path.resolve(import.meta.dirname, "../../templates/03-fit-weld-lateral-link-bracket.gusset-procedure.json"), "utf8"));
    expect(file.formatVersion).toBe(1);
    file.procedure.title = `Weld map test ${Date.now()}`;
    const r = await api("/api/procedures/import", { session: lead, body: JSON.stringify(file) });
    expect(r.status, r.text).toBe(201);
    procId = r.json.procedure.id;
    base = `/api/procedures/${procId}/versions/1`;
    const v = (await api(base, { session: lead })).json.version;
    expect(v.content.weldMap).toBeUndefined();
    expect(weldJoints(v.content.sections.flatMap((s: { steps: { kind: string; jointId?: string }[] }) => s.steps.map((t) => ({ key: "", spec: t }))))).toEqual(["W1", "W2", "W3"]);
  });

  it("takes a PNG and a PDF's first page as images, and refuses SVG with 415", async () => {
    const photo = await sharp({ create: { width: 800, height: 600, channels: 3, background: "#9aa09c" } }).png().toBuffer();
    const a = await upload(base, photo, "bracket.png", "image/png");
    expect(a.status, JSON.stringify(a.json)).toBe(201);
    expect(a.json.image).toMatchObject({ width: 800, height: 600, source: "upload" });
    png = a.json.image;
    const b = await upload(base, drawingPdf({ width: 600, height: 400 }), "drawing.pdf", "application/pdf");
    expect(b.status, JSON.stringify(b.json)).toBe(201);
    pdfImage = b.json.image;
    expect(pdfImage.source).toBe("pdf");
    expect(pdfImage.width / pdfImage.height).toBeCloseTo(600 / 400, 2);
    const svg = await upload(base, Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"><rect width="10" height="10"/></svg>'), "drawing.png", "image/png");
    expect(svg.status).toBe(415);
    expect(svg.json.error.message).toMatch(/SVG drawings are not taken/);
    const served = await fetch(`${BASE_URL}/api/procedure-images/${pdfImage.id}`, { headers: { cookie: welder.cookie } });
    expect(served.status).toBe(200);
    expect(served.headers.get("content-type")).toBe("image/jpeg");
  });

  it("keeps the markers the lead places, and refuses a joint no weld step has", async () => {
    const joints: Joint[] = [
      { jointId: "W1", imageId: png.id, x: 0.25, y: 0.5, path: [{ x: 0.2, y: 0.5 }, { x: 0.3, y: 0.52 }] },
      { jointId: "W2", imageId: png.id, x: 0.75, y: 0.5 },
      { jointId: "W3", imageId: pdfImage.id, x: 0.1234, y: 0.9 },
    ];
    const bad = await api(`${base}/weld-map`, { session: lead, method: "PUT", body: { imageIds: [png.id, pdfImage.id], joints: [...joints, { jointId: "W9", imageId: png.id, x: 0.5, y: 0.5 }] } });
    expect(bad.status).toBe(400);
    expect(bad.json.error.message).toMatch(/W9/);
    const off = await api(`${base}/weld-map`, { session: lead, method: "PUT", body: { imageIds: [png.id], joints: [{ jointId: "W1", imageId: png.id, x: 1.2, y: 0.5 }] } });
    expect(off.status).toBe(400);
    expect((await api(`${base}/weld-map`, { session: welder, method: "PUT", body: { imageIds: [png.id], joints: [] } })).status).toBe(403);
    const ok = await api(`${base}/weld-map`, { session: lead, method: "PUT", body: { imageIds: [png.id, pdfImage.id], joints } });
    expect(ok.status, ok.text).toBe(200);
    expect(markers(ok.json.version.content.weldMap)).toEqual(markers({ images: [png, pdfImage], joints }));
  });

  it("exported with its map (formatVersion 2, images carried) and imported again, gives the same markers", async () => {
    const ex = await api(`${base}/export`, { session: welder });
    expect(ex.status).toBe(200);
    expect(ex.json).toMatchObject({ formatVersion: 2, $schema: expect.stringMatching(/gusset-procedure-2\.schema\.json$/) });
    expect(ex.json.images).toHaveLength(2);
    ex.json.procedure.title = `${ex.json.procedure.title} (copy)`;
    const imported = await api("/api/procedures/import", { session: lead, body: JSON.stringify(ex.json) });
    expect(imported.status, imported.text).toBe(201);
    cleanup.push(imported.json.procedure.id);
    const copy = (await api(`/api/procedures/${imported.json.procedure.id}/versions/1`, { session: lead })).json.version;
    expect(copy.content.weldMap.images).toHaveLength(2);
    expect(copy.content.weldMap.images.map((i: { width: number; height: number; source: string }) => [i.width, i.height, i.source])).toEqual(
      ex.json.content.weldMap.images.map((i: { width: number; height: number; source: string }) => [i.width, i.height, i.source]),
    );
    expect(markers(copy.content.weldMap)).toEqual(markers(ex.json.content.weldMap));
    expect(copy.content.sections).toEqual(ex.json.content.sections);
  });

  it("an image in the file that is not the one its map names is refused, and nothing is saved", async () => {
    const ex = (await api(`${base}/export`, { session: lead })).json;
    ex.procedure.title = `${ex.procedure.title} (swapped)`;
    ex.images[0].data = (await sharp({ create: { width: 10, height: 10, channels: 3, background: "#000" } }).png().toBuffer()).toString("base64");
    const before = await withDb(async (c) => Number((await c.query("select count(*) from procedure")).rows[0].count));
    const r = await api("/api/procedures/import", { session: lead, body: JSON.stringify(ex) });
    expect(r.status).toBe(422);
    expect(r.json.error.message).toMatch(/SHA-256 differs/);
    expect(await withDb(async (c) => Number((await c.query("select count(*) from procedure")).rows[0].count))).toBe(before);
  });

  it("published, the markers are sealed: the version refuses changes, and a marker changed in its file no longer matches the sealed hash", async () => {
    const pub = await api(`${base}/publish`, { session: lead, body: { changeNote: "Weld map placed." } });
    expect(pub.status, pub.text).toBe(200);
    const again = await api(`${base}/weld-map`, { session: lead, method: "PUT", body: { imageIds: [png.id], joints: [] } });
    expect(again.status).toBe(409);
    const ex = (await api(`${base}/export`, { session: lead })).json;
    expect(ex.source.contentHash).toMatch(/^[0-9a-f]{64}$/);
    const same = await api("/api/procedures/import", { session: lead, body: JSON.stringify(ex) });
    expect(same.status, same.text).toBe(201);
    cleanup.push(same.json.procedure.id);
    expect(same.json.sourceHashMatches).toBe(true);
    ex.content.weldMap.joints[0].x = 0.26;
    const moved = await api("/api/procedures/import", { session: lead, body: JSON.stringify(ex) });
    expect(moved.status, moved.text).toBe(201);
    cleanup.push(moved.json.procedure.id);
    expect(moved.json.sourceHashMatches).toBe(false);
  });

  it("a job made from the version carries its map, every weld step's joint placed on the procedure's images", async () => {
    const v = (await api(base, { session: lead })).json.version;
    const created = await api("/api/jobs", { session: lead, body: jobBody(v.id) });
    expect(created.status, created.text).toBe(201);
    const rec = (await api(`/api/jobs/${created.json.job.id}`, { session: welder })).json;
    expect(rec.weldMap.images.map((i: { procedureImageId: string }) => i.procedureImageId)).toEqual([png.id, pdfImage.id]);
    expect(rec.weldMap.joints.map((j: Joint) => j.jointId).sort()).toEqual(weldJoints(rec.steps).sort());
    expect(rec.weldMap.rebasedAt).toBeNull();

    // On the job, the map moves onto a photo of this axle, every joint placed anew by tap.
    const up = await uploadFixture(welder, rec.job.id);
    expect(up.status, up.text).toBe(201);
    const photoId = up.json.photoId as string;
    const missing = await api(`/api/jobs/${rec.job.id}/weld-map`, { session: welder, method: "PUT", body: { photoId, joints: [{ jointId: "W1", x: 0.2, y: 0.3 }] } });
    expect(missing.status).toBe(400);
    expect(missing.json.error.message).toMatch(/W2, W3 are not placed/);
    const placed = [
      { jointId: "W1", x: 0.2, y: 0.3 },
      { jointId: "W2", x: 0.5, y: 0.35, path: [{ x: 0.45, y: 0.35 }, { x: 0.55, y: 0.36 }] },
      { jointId: "W3", x: 0.8, y: 0.3 },
    ];
    const rebased = await api(`/api/jobs/${rec.job.id}/weld-map`, { session: welder, method: "PUT", body: { photoId, joints: placed } });
    expect(rebased.status, rebased.text).toBe(200);
    const map = rebased.json.record.weldMap;
    expect(map.images).toHaveLength(1);
    expect(map.images[0]).toMatchObject({ photoId, url: expect.stringContaining(photoId) });
    expect(map.rebasedAt).toEqual(expect.any(String));
    expect(markers(map)).toEqual(markers({ images: map.images, joints: placed.map((j) => ({ ...j, imageId: map.images[0].id })) }));
  });
});
