// Photo uploads for the jobs tests: multipart, as the runner sends them.
import { randomUUID } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { BASE_URL, type Session } from "./support";

export const FIXTURE_JPEG = fs.readFileSync(path.resolve(import.meta.dirname, "../fixtures/jobs/bracket.jpg"));

export async function uploadBytes(who: Session, jobId: string, bytes: Uint8Array, opts: { stepId?: string; key?: string; name?: string; type?: string } = {}) {
  const form = new FormData();
  form.append("file", new Blob([new Uint8Array(bytes)], { type: opts.type ?? "image/jpeg" }), opts.name ?? "photo.jpg");
  form.append("idempotencyKey", opts.key ?? randomUUID());
  if (opts.stepId) form.append("stepId", opts.stepId);
  const res = await fetch(`${BASE_URL}/api/jobs/${jobId}/photos`, { method: "POST", headers: { cookie: who.cookie, "x-forwarded-for": who.ip, origin: BASE_URL }, body: form });
  const text = await res.text();
  let json: Record<string, any> = {};
  try {
    json = JSON.parse(text);
  } catch {
    json = {};
  }
  return { status: res.status, json, text };
}

export function uploadFixture(who: Session, jobId: string, opts: { stepId?: string; key?: string } = {}) {
  return uploadBytes(who, jobId, FIXTURE_JPEG, opts);
}
