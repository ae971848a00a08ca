// Who a sign-off names, and the seal leaving the building: the QR carries it, verify compares the paper's
// seal with the database, the release mails it outside the database, and stored rows are held to it.
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
let lead: Session, welder2: Session, inspector: Session;
let versionId: string;

beforeAll(async () => {
  [lead, welder2, inspector] = await Promise.all([session("lead@irongully.example"), session("welder2@irongully.example"), session("inspector@irongully.example")]);
  versionId = await withDb((c) => insertPublishedProcedure(c, { shopSlug: "iron-gully", ownerEmail: "lead@irongully.example", title: "Record trust procedure", content: SHORT_PROCEDURE_CONTENT }));
});

async function stepOf(who: Session, jobId: string, key: string) {
  const rec = (await retrying(() => api(`/api/jobs/${jobId}`, { session: who }))).json;
  return rec.steps.find((x: { key: string }) => x.key === key);
}

async function signStep(who: Session, jobId: string, key: string, value?: Record<string, unknown>) {
  let s = await stepOf(who, jobId, key);
  if (value) {
    const saved = await api(`/api/jobs/${jobId}/steps/${s.id}/value`, { session: who, method: "PUT", body: { baseVersion: s.version, value } });
    expect(saved.status, saved.text).toBe(200);
    s = await stepOf(who, jobId, key);
  }
  const signed = await api(`/api/jobs/${jobId}/steps/${s.id}/sign`, { session: who, body: { pin: PIN, baseVersion: s.version } });
  expect(signed.status, signed.text).toBe(201);
}

async function newJob(customerEmail = "trust@customer.example") {
  const created = await api("/api/jobs", { session: lead, body: jobBody(versionId, { customerEmail }) });
  expect(created.status, created.text).toBe(201);
  return { jobId: created.json.job.id as string, number: created.json.job.number as string };
}

async function signedJob(customerEmail?: string) {
  const job = await newJob(customerEmail);
  await signStep(welder2, job.jobId, "c-one", { confirmed: true });
  await signStep(inspector, job.jobId, "h-one");
  return job;
}

async function fetchPdf(jobId: string) {
  const res = await retrying(() => fetch(`${BASE_URL}/api/jobs/${jobId}/traveller?paper=a4`, { headers: { cookie: lead.cookie, "x-forwarded-for": lead.ip } }));
  expect(res.status).toBe(200);
  return new Uint8Array(await res.arrayBuffer());
}

// The QR read back from the printed page, as a phone would see it.
function qrFromFirstPage(pdf: Uint8Array): string | null {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "gusset-qr-"));
  fs.writeFileSync(path.join(dir, "t.pdf"), pdf);
  execFileSync("pdftoppm", ["-r", "200", "-png", "-f", "1", "-l", "1", path.join(dir, "t.pdf"), path.join(dir, "page")]);
  const file = fs.readdirSync(dir).find((f) => f.endsWith(".png"))!;
  const png = PNG.sync.read(fs.readFileSync(path.join(dir, file)));
  fs.rmSync(dir, { recursive: true, force: true });
  return jsQR(new Uint8ClampedArray(png.data), png.width, png.height)?.data ?? null;
}

// The app closes an idle keep-alive socket after 5 s, about as long as a page render and pdftoppm take;
// a request that meets the closing socket is sent again, as a browser would.
async function retrying<T>(fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (error) {
    if ((error as { cause?: { code?: string } }).cause?.code !== "UND_ERR_SOCKET") throw error;
    return fn();
  }
}
const verifyApi = (p: string) => retrying(() => api(`/api${p}`));
const verifyPage = (p: string) => retrying(async () => (await fetch(`${BASE_URL}${p}`)).text());

async function membershipOf(email: string) {
  return withDb(async (c) => (await c.query("select m.id from membership m join \"user\" u on u.id = m.user_id join shop s on s.id = m.shop_id where u.email = $1 and s.slug = 'iron-gully'", [email])).rows[0].id as string);
}

async function performedNames(jobId: string) {
  return withDb(async (c) => (await c.query("select printed_name from sign_off where job_id = $1 and meaning = 'performed' order by signed_at", [jobId])).rows.map((r) => r.printed_name as string));
}

describe("the name printed on sign-offs", () => {
  it("a welder's self-service rename is refused and does not change the name printed on their next sign-off", async () => {
    const renamed = await api("/api/auth/update-user", { session: welder2, body: { name: "Nell Corrigan" } });
    expect(renamed.status).toBe(403);
    expect(renamed.text).toMatch(/set by a lead/);
    const job = await newJob();
    await signStep(welder2, job.jobId, "c-one", { confirmed: true });
    expect(await performedNames(job.jobId)).toEqual(["Priya Okafor"]);
    const account = await withDb(async (c) => (await c.query("select name from \"user\" where email = 'welder2@irongully.example'")).rows[0].name);
    expect(account).toBe("Priya Okafor");
  });

  it("a lead's change of the legal name is logged and prints on later sign-offs only", async () => {
    const membershipId = await membershipOf("welder2@irongully.example");
    const first = await newJob();
    await signStep(welder2, first.jobId, "c-one", { confirmed: true });
    try {
      const set = await api(`/api/people/${membershipId}`, { session: lead, method: "PATCH", body: { legalName: "Priya A. Okafor" } });
      expect(set.status, set.text).toBe(200);
      expect(set.json.person.legalName).toBe("Priya A. Okafor");
      const refused = await api(`/api/people/${membershipId}`, { session: welder2, method: "PATCH", body: { legalName: "Nell Corrigan" } });
      expect(refused.status).toBe(403);
      const second = await newJob();
      await signStep(welder2, second.jobId, "c-one", { confirmed: true });
      expect(await performedNames(second.jobId)).toEqual(["Priya A. Okafor"]);
      // The earlier sign-off keeps the name it was signed with, and its record still verifies.
      expect(await performedNames(first.jobId)).toEqual(["Priya Okafor"]);
      const logged = await withDb(async (c) => (await c.query("select detail from shop_activity where action = 'person.legal_name_set' order by at desc limit 1")).rows[0].detail);
      expect(logged).toMatchObject({ from: "Priya Okafor", to: "Priya A. Okafor" });
    } finally {
      await api(`/api/people/${membershipId}`, { session: lead, method: "PATCH", body: { legalName: "Priya Okafor" } });
    }
  });
});

describe("the seal on the paper", () => {
  it("a released traveller's QR carries the seal printed on the page; verify says the paper and the record agree", async () => {
    const job = await signedJob();
    const released = await api(`/api/jobs/${job.jobId}/release`, { session: lead, body: { pin: PIN } });
    expect(released.status, released.text).toBe(200);
    const pdf = await fetchPdf(job.jobId);
    const qr = qrFromFirstPage(pdf);
    expect(qr).toMatch(/\/verify\/[A-Za-z0-9_-]{27}\?seal=[0-9a-f]{16}$/);
    const url = new URL(qr!);
    const paperSeal = url.searchParams.get("seal")!;
    const v = await verifyApi(`${url.pathname}${url.search}`);
    expect(v.status).toBe(200);
    const seal = v.json.integrity.seal as string;
    expect(seal).toMatch(/^[0-9a-f]{64}$/);
    expect(paperSeal).toBe(seal.slice(0, 16));
    // The same seal is printed on the page (in groups of four), read back from the PDF's text.
    const { text } = await extractText(await getDocumentProxy(pdf), { mergePages: true });
    expect(text.replace(/\s+/g, "")).toContain(seal);
    expect(v.json.paper).toMatchObject({ verdict: "agrees", agrees: true, seal: paperSeal });
    const page = await verifyPage(`${url.pathname}${url.search}`);
    expect(page).toContain("Paper and record agree");
  });

  it("given a different seal, the verify API and page say the paper and the record disagree", async () => {
    const job = await signedJob();
    const qr = new URL(qrFromFirstPage(await fetchPdf(job.jobId))!);
    const real = qr.searchParams.get("seal")!;
    const other = real.replace(/^./, (c) => (c === "0" ? "1" : "0"));
    const v = await verifyApi(`${qr.pathname}?seal=${other}`);
    expect(v.status).toBe(200);
    expect(v.json.integrity.intact).toBe(true);
    expect(v.json.paper).toMatchObject({ verdict: "disagrees", agrees: false, seal: other });
    expect(v.json.paper.message).toMatch(/paper and the record disagree/);
    const page = await verifyPage(`${qr.pathname}?seal=${other}`);
    expect(page).toContain("Paper and record disagree");
    // A typed seal with spaces and capitals reads the same as the QR's.
    const typed = await verifyApi(`${qr.pathname}?seal=${encodeURIComponent(real.toUpperCase().replace(/(.{4})/g, "$1 "))}`);
    expect(typed.json.paper.verdict).toBe("agrees");
    expect((await verifyApi(`${qr.pathname}?seal=xyz`)).status).toBe(400);
  });

  it("a paper printed before later sign-offs is named as an earlier print, not as a forgery", async () => {
    const job = await newJob();
    await signStep(welder2, job.jobId, "c-one", { confirmed: true });
    const early = new URL(qrFromFirstPage(await fetchPdf(job.jobId))!);
    await signStep(inspector, job.jobId, "h-one");
    const v = await verifyApi(`${early.pathname}${early.search}`);
    expect(v.json.paper).toMatchObject({ verdict: "earlier", printedAtEntries: 1 });
  });

  it("a rewritten database disagrees with the paper, and a signed step's value changed in SQL is caught", async () => {
    const job = await signedJob();
    const qr = new URL(qrFromFirstPage(await fetchPdf(job.jobId))!);
    await withDb(async (c) => {
      await c.query("set session_replication_role = replica");
      await c.query("update job_step set value = '{\"confirmed\": false}' where job_id = $1 and step_key = 'c-one'", [job.jobId]);
      await c.query("set session_replication_role = origin");
    }, process.env.ADMIN_DATABASE_URL);
    const v = await verifyApi(`${qr.pathname}${qr.search}`);
    expect(v.json.integrity).toMatchObject({ intact: false, firstBrokenEntry: 1 });
    expect(v.json.integrity.reason).toMatch(/stored value .* differs from the value that was signed/);
    expect(v.json.paper.verdict).toBe("disagrees");
    // What the job view shows as signed is the sealed value, not the edited row.
    const step = await stepOf(lead, job.jobId, "c-one");
    expect(step.effectiveValue).toEqual({ confirmed: true });
  });

  it("release mails the seal to the shop's archive address and to the customer", async () => {
    const archive = `archive-${Date.now()}@irongully.example`;
    const set = await api("/api/shop/archive-address", { session: lead, method: "PUT", body: { email: archive } });
    expect(set.status, set.text).toBe(200);
    expect((await api("/api/shop/archive-address", { session: welder2, method: "PUT", body: { email: "x@y.example" } })).status).toBe(403);
    try {
      const customer = `owner-${Date.now()}@customer.example`;
      const job = await signedJob(customer);
      const released = await api(`/api/jobs/${job.jobId}/release`, { session: lead, body: { pin: PIN } });
      expect(released.status, released.text).toBe(200);
      const token = await withDb(async (c) => (await c.query("select token from job_token where job_id = $1", [job.jobId])).rows[0].token);
      const seal = (await api(`/api/verify/${token}`)).json.integrity.seal as string;
      const toArchive = await waitFor(() => withDb(async (c) => (await c.query("select subject, text_body from caught_mail where to_address like $1", [`%${archive}%`])).rows[0]));
      expect(toArchive.text_body).toContain(seal);
      expect(toArchive.subject).toContain(job.number);
      const toCustomer = await waitFor(() => withDb(async (c) => (await c.query("select text_body from caught_mail where to_address like $1", [`%${customer}%`])).rows[0]));
      expect(toCustomer.text_body).toContain(seal);
    } finally {
      await api("/api/shop/archive-address", { session: lead, method: "PUT", body: { email: null } });
    }
  });
});
