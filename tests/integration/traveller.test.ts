// The traveller, its QR and the seal, end to end against the running app and its database.
import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import jsQR from "jsqr";
import { PNG } from "pngjs";
import { extractText, getDocumentProxy } from "unpdf";
import { beforeAll, describe, expect, it } from "vitest";
import { insertPublishedProcedure, jobBody, SHORT_PROCEDURE_CONTENT } from "../fixtures/jobs/procedure";
import { api, BASE_URL, session, waitFor, withDb, type Session } from "./support";

const PIN = "2468";
let lead: Session, welder: Session, inspector: Session, auditor: Session, otherLead: Session;
let versionId: string;

beforeAll(async () => {
  [lead, welder, inspector, auditor, otherLead] = await Promise.all([
    session("lead@irongully.example"),
    session("welder@irongully.example"),
    session("inspector@irongully.example"),
    session("auditor@irongully.example"),
    session("lead@saltpan.example"),
  ]);
  versionId = await withDb((c) => insertPublishedProcedure(c, { shopSlug: "iron-gully", ownerEmail: "lead@irongully.example", title: "Traveller test procedure", content: SHORT_PROCEDURE_CONTENT }));
});

async function signStep(who: Session, jobId: string, key: string, value?: Record<string, unknown>) {
  let rec = (await api(`/api/jobs/${jobId}`, { session: who })).json;
  let s = rec.steps.find((x: { key: string }) => x.key === key);
  if (value) {
    const saved = await api(`/api/jobs/${jobId}/steps/${s.id}/value`, { session: who, method: "PUT", body: { baseVersion: s.version, value } });
    expect(saved.status, saved.text).toBe(200);
    rec = (await api(`/api/jobs/${jobId}`, { session: who })).json;
    s = rec.steps.find((x: { key: string }) => x.key === key);
  }
  const signed = await api(`/api/jobs/${jobId}/steps/${s.id}/sign`, { session: who, body: { pin: PIN, baseVersion: s.version } });
  expect(signed.status, signed.text).toBe(201);
}

async function jobWithTwoSignOffs(customerEmail = "test@customer.example") {
  const body = jobBody(versionId, { customerEmail });
  const created = await api("/api/jobs", { session: lead, body });
  expect(created.status, created.text).toBe(201);
  const jobId = created.json.job.id as string;
  await signStep(welder, jobId, "c-one", { confirmed: true });
  await signStep(inspector, jobId, "h-one");
  return { jobId, customerName: body.customerName as string, axleTag: body.axleTag as string, number: created.json.job.number as string };
}

async function fetchPdf(jobId: string, who: Session, paper = "a4") {
  const res = await fetch(`${BASE_URL}/api/jobs/${jobId}/traveller?paper=${paper}`, { headers: { cookie: who.cookie, "x-forwarded-for": who.ip } });
  return { status: res.status, type: res.headers.get("content-type"), bytes: new Uint8Array(await res.arrayBuffer()) };
}

function qrFromFirstPage(pdf: Uint8Array): string | null {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "gusset-qr-"));
  fs.writeFileSync(path.join(dir, "t.pdf"), pdf);
  execFileSync("pdftoppm", ["-r", "200", "-png", "-f", "1", "-l", "1", path.join(dir, "t.pdf"), path.join(dir, "page")]);
  const file = fs.readdirSync(dir).find((f) => f.endsWith(".png"))!;
  const png = PNG.sync.read(fs.readFileSync(path.join(dir, file)));
  fs.rmSync(dir, { recursive: true, force: true });
  return jsQR(new Uint8ClampedArray(png.data), png.width, png.height)?.data ?? null;
}

describe("traveller PDF", () => {
  it("prints the job number, the signers with role and meaning, and marks an unreleased job as work in progress", async () => {
    const job = await jobWithTwoSignOffs();
    const pdf = await fetchPdf(job.jobId, lead);
    expect(pdf.status).toBe(200);
    expect(pdf.type).toBe("application/pdf");
    const { text } = await extractText(await getDocumentProxy(pdf.bytes), { mergePages: true });
    expect(text).toContain(job.number);
    expect(text).toContain(job.axleTag);
    expect(text).toContain("Mick Tamsin");
    expect(text).toContain("Ines Lindqvist");
    expect(text).toMatch(/performed/i);
    expect(text).toMatch(/inspected/i);
    expect(text).toMatch(/WORK IN PROGRESS/);
    expect(text).toMatch(/never replace/i);
  });

  it("carries a QR code (read back from the printed page) whose URL answers with that job", async () => {
    const job = await jobWithTwoSignOffs();
    const url = qrFromFirstPage((await fetchPdf(job.jobId, lead, "letter")).bytes);
    // The public address other devices can open (the harness's LAN address), never this computer's loopback one;
    // it carries the first digits of the seal printed on the paper.
    expect(url).toMatch(new RegExp(`^${process.env.LAN_URL}/verify/[A-Za-z0-9_-]{27}\\?seal=[0-9a-f]{16}$`));
    const token = new URL(url!).pathname.split("/verify/")[1]!;
    const anon = await api(`/api/verify/${token}`);
    expect(anon.status).toBe(200);
    expect(anon.json).toMatchObject({ jobNumber: job.number, shop: "Iron Gully 4x4 Fabrication", status: expect.any(String), integrity: { intact: true, entries: 2 } });
    expect(anon.json.integrity.seal).toMatch(/^[0-9a-f]{64}$/);
    const page = await fetch(`${BASE_URL}/verify/${token}`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain("Record intact");
  });

  it("is for members of the shop only", async () => {
    const job = await jobWithTwoSignOffs();
    expect((await fetchPdf(job.jobId, otherLead)).status).toBe(404);
    expect((await fetch(`${BASE_URL}/api/jobs/${job.jobId}/traveller`)).status).toBe(401);
    expect((await api(`/api/jobs/${job.jobId}/traveller?paper=legal`, { session: lead })).status).toBe(400);
  });
});

describe("verify and the seal", () => {
  async function tokenOf(jobId: string) {
    await fetchPdf(jobId, lead); // printing the traveller issues the token
    return withDb(async (c) => (await c.query("select token from job_token where job_id = $1", [jobId])).rows[0].token as string);
  }

  it("anonymous visitors see no customer, vehicle or people; members of the shop also get the record", async () => {
    const job = await jobWithTwoSignOffs();
    const token = await tokenOf(job.jobId);
    const anon = await api(`/api/verify/${token}`);
    expect(Object.keys(anon.json).sort()).toEqual(["axleTag", "integrity", "jobNumber", "releasedAt", "shop", "status", "vinLast6"]);
    // The housing's tag and the VIN's tail let anyone see a traveller moved to another axle; nothing personal.
    expect(anon.json.axleTag).toBe(job.axleTag);
    expect(anon.json.vinLast6).toBe("042788");
    for (const secret of [job.customerName, "test@customer.example", "1M8GDM9AXKP042788", "Mick Tamsin", "Ines Lindqvist"]) {
      expect(anon.text).not.toContain(secret);
    }
    const page = await (await fetch(`${BASE_URL}/verify/${token}`)).text();
    expect(page).not.toContain(job.customerName);
    expect(page).not.toContain("Mick Tamsin");
    const member = await api(`/api/verify/${token}`, { session: auditor });
    expect(member.json.job.job.customerName).toBe(job.customerName);
    const stranger = await api(`/api/verify/${token}`, { session: otherLead });
    expect(stranger.json.job).toBeUndefined();
  });

  it("an unknown or malformed token answers 404", async () => {
    expect((await api("/api/verify/AAAAAAAAAAAAAAAAAAAAAAAAAAA")).status).toBe(404);
    expect((await api("/api/verify/not-a-token")).status).toBe(404);
  });

  it("the chain tables refuse UPDATE and DELETE, even for the superuser", async () => {
    const job = await jobWithTwoSignOffs();
    await tokenOf(job.jobId);
    await withDb(async (c) => {
      const { rowCount } = await c.query("select 1 from record_entry where job_id = $1", [job.jobId]);
      expect(rowCount).toBe(2);
      await expect(c.query("update record_entry set hash = repeat('0', 64) where job_id = $1", [job.jobId])).rejects.toThrow(/append-only/);
      await expect(c.query("delete from record_entry where job_id = $1", [job.jobId])).rejects.toThrow(/append-only/);
      await expect(c.query("update job_token set token = 'x' where job_id = $1", [job.jobId])).rejects.toThrow(/append-only/);
    }, process.env.ADMIN_DATABASE_URL);
  });

  it("a sign-off changed directly in SQL by the superuser is reported as altered at its entry", async () => {
    const job = await jobWithTwoSignOffs();
    const token = await tokenOf(job.jobId);
    expect((await api(`/api/verify/${token}`)).json.integrity.intact).toBe(true);
    const seq = await withDb(async (c) => {
      const { rows } = await c.query("select r.seq, r.sign_off_id from record_entry r where r.job_id = $1 order by seq", [job.jobId]);
      // A superuser can switch the triggers off for a session: exactly the tampering the seal must reveal.
      await c.query("set session_replication_role = replica");
      await c.query("update sign_off set printed_name = 'Someone Else' where id = $1", [rows[1].sign_off_id]);
      await c.query("set session_replication_role = origin");
      return rows[1].seq as number;
    }, process.env.ADMIN_DATABASE_URL);
    const after = await api(`/api/verify/${token}`);
    expect(after.status).toBe(200);
    expect(after.json.integrity.intact).toBe(false);
    expect(after.json.integrity.firstBrokenEntry).toBe(seq);
    const page = await (await fetch(`${BASE_URL}/verify/${token}`)).text();
    expect(page).toContain(`Record altered at entry ${seq}`);
  });

  it("a signed value changed in SQL is caught by its content hash", async () => {
    const job = await jobWithTwoSignOffs();
    const token = await tokenOf(job.jobId);
    await withDb(async (c) => {
      await c.query("set session_replication_role = replica");
      await c.query(`update sign_off set content = jsonb_set(content, '{value,confirmed}', 'false') where job_id = $1 and meaning = 'performed'`, [job.jobId]);
      await c.query("set session_replication_role = origin");
    }, process.env.ADMIN_DATABASE_URL);
    const after = await api(`/api/verify/${token}`);
    expect(after.json.integrity).toMatchObject({ intact: false, firstBrokenEntry: 1 });
    expect(after.json.integrity.reason).toMatch(/signed content/);
  });
});

describe("release", () => {
  it("a released job's traveller is mailed to the customer as a PDF attachment", async () => {
    const email = `owner-${Date.now()}@customer.example`;
    const job = await jobWithTwoSignOffs(email);
    const released = await api(`/api/jobs/${job.jobId}/release`, { session: lead, body: { pin: PIN } });
    expect(released.status, released.text).toBe(200);
    expect(released.json.travellerMailed).toBe(true);
    const mail = await waitFor(() => withDb(async (c) => (await c.query("select subject, attachments, text_body from caught_mail where to_address like $1", [`%${email}%`])).rows[0]));
    expect(mail.subject).toContain(job.number);
    expect(mail.attachments).toEqual([expect.objectContaining({ filename: `${job.number}-traveller.pdf`, contentType: "application/pdf" })]);
    const pdf = await fetchPdf(job.jobId, lead);
    const { text } = await extractText(await getDocumentProxy(pdf.bytes), { mergePages: true });
    expect(text).not.toMatch(/WORK IN PROGRESS/);
    const token = await withDb(async (c) => (await c.query("select token from job_token where job_id = $1", [job.jobId])).rows[0].token);
    const v = await api(`/api/verify/${token}`);
    expect(v.json.status).toBe("released");
    expect(v.json.releasedAt).toMatch(/^\d{4}-\d{2}-\d{2}T/);
    expect(v.json.integrity).toMatchObject({ intact: true, entries: 3 });
  });
});

describe("traveller: steering geometry of the released demo job", () => {
  it("prints the before and the after capture from their separate steps, the steering-wheel chart and the road-test note", async () => {
    // The seeded released job (axle tag AX-0318), not one a test released.
    const list = await api("/api/jobs?status=released&q=AX-0318&pageSize=100", { session: lead });
    const released = (list.json.jobs as { id: string; number: string }[])[0];
    expect(released).toBeDefined();
    const rec = (await api(`/api/jobs/${released!.id}`, { session: lead })).json;
    const geo = rec.steps.filter((s: { kind: string }) => s.kind === "geometry");
    // The seeded bracket procedure captures before and after in two steps, both signed.
    expect(geo.length).toBeGreaterThanOrEqual(2);
    expect(geo.every((s: { signed: boolean }) => s.signed)).toBe(true);
    const pdf = await fetchPdf(released!.id, lead);
    expect(pdf.status).toBe(200);
    const { text } = await extractText(await getDocumentProxy(pdf.bytes), { mergePages: true });
    expect(text).toMatch(/Steering geometry/);
    expect(text).not.toMatch(/not captured/);
    // Axle end of the lateral link: 120 mm high before, 180 mm after (the seeded captures, y / z mm).
    expect(text).toMatch(/480\.0 \/ 120\.0/);
    expect(text).toMatch(/480\.0 \/ 180\.0/);
    expect(text).toMatch(/Steering-wheel angle over the travel range/i);
    expect(text).toMatch(/Road test: by the measured geometry/);
  });
});
