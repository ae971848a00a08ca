// Photo uploads for the jobs tests: multipart, as the runner sends them.
import { randomUUID } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { expect } from "vitest";
import { api, BASE_URL, withDb, type Session } from "./support";

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

/** A current qualification (tested today) for a welder and process, added by the lead unless one is held. */
export async function ensureQualified(lead: Session, email: string, process: string) {
  const welderUserId = await withDb(async (c) => (await c.query<{ id: string }>(`select id from "user" where email = $1`, [email])).rows[0]!.id);
  const have = (await api(`/api/qualifications?welder=${welderUserId}&process=${process}&status=current`, { session: lead })).json.qualifications ?? [];
  if (have.length) return;
  const r = await api("/api/qualifications", {
    session: lead,
    body: { welderUserId, process, positions: ["1F", "2F", "3F", "4F"], thicknessMinMm: 3, thicknessMaxMm: 20, fillerFNumber: 6, testDate: new Date().toISOString().slice(0, 10), notes: "Test coupon." },
  });
  expect(r.status, r.text).toBe(201);
}
