import "server-only";
// Job photos: judged by content, re-encoded without metadata, stored under server-made keys, and served
// only to members of the job's shop. A retried upload (same idempotency key) never makes a second photo.
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { job, photo } from "@/db/schema";
import type { ShopContext } from "@/lib/auth/context";
import { db } from "@/lib/db";
import { AppError } from "@/lib/errors";
import { getObject, photoKeys, putObject } from "@/lib/storage";
import { processPhoto } from "@/lib/storage/images";
import type { JobWeldMap } from "@/lib/weld-map";
import { assertJobOpen, guarded, loadRecord, logActivity } from "./jobs-core";
import { findStep } from "./jobs-lookup";

async function existingUpload(shopId: string, idempotencyKey: string) {
  const [row] = await db()
    .select({ id: photo.id, jobId: photo.jobId, stepId: photo.stepId })
    .from(photo)
    .where(and(eq(photo.shopId, shopId), eq(photo.idempotencyKey, idempotencyKey)));
  return row ?? null;
}

export async function addPhoto(ctx: ShopContext, jobId: string, input: { bytes: Buffer; idempotencyKey: string; stepId?: string | undefined; caption: string }) {
  const again = await existingUpload(ctx.shopId, input.idempotencyKey);
  if (again) {
    if (again.jobId !== jobId) throw new AppError("conflict", "That upload key belongs to another job's photo.");
    return { record: await loadRecord(db(), ctx, jobId), photoId: again.id, created: false };
  }
  const pre = await loadRecord(db(), ctx, jobId);
  assertJobOpen(pre);
  if (input.stepId) {
    const step = findStep(pre, input.stepId);
    if (step.signed) throw new AppError("conflict", `"${step.title}" is signed; its photos are part of the signed record and cannot change.`);
    if (step.lockedBy) throw new AppError("locked", `"${step.title}" is locked behind the hold point "${step.lockedBy.title}".`);
  }
  const processed = await processPhoto(input.bytes);
  const keys = photoKeys(ctx.shopId, jobId, input.idempotencyKey);
  // Objects first, then the row: a row never points at a missing object, and a retry rewrites the same keys.
  await putObject(keys.key, processed.main, processed.contentType);
  await putObject(keys.thumbKey, processed.thumb, processed.contentType);
  try {
    return await guarded(
      () =>
        db().transaction(async (tx) => {
          const record = await loadRecord(tx, ctx, jobId, { lock: true });
          assertJobOpen(record);
          if (input.stepId && findStep(record, input.stepId).signed) throw new AppError("conflict", "That step was signed a moment ago; its photos cannot change.");
          const [row] = await tx
            .insert(photo)
            .values({
              shopId: ctx.shopId,
              jobId,
              stepId: input.stepId ?? null,
              key: keys.key,
              thumbKey: keys.thumbKey,
              sha256: processed.sha256,
              contentType: processed.contentType,
              size: processed.main.length,
              width: processed.width,
              height: processed.height,
              originalType: processed.originalType,
              originalSize: input.bytes.length,
              idempotencyKey: input.idempotencyKey,
              caption: input.caption,
              uploadedBy: ctx.userId,
            })
            .returning({ id: photo.id });
          await logActivity(tx, {
            shopId: ctx.shopId,
            jobId,
            actorId: ctx.userId,
            action: "photo.added",
            stepId: input.stepId ?? null,
            detail: { photoId: row!.id, sha256: processed.sha256, width: processed.width, height: processed.height, originalType: processed.originalType },
          });
          return { record: await loadRecord(tx, ctx, jobId), photoId: row!.id, created: true };
        }),
      "duplicate upload",
    );
  } catch (error) {
    // Two tries of one upload raced; the first one's row stands and is the answer to both.
    const raced = error instanceof AppError && error.code === "conflict" ? await existingUpload(ctx.shopId, input.idempotencyKey) : null;
    if (raced) return { record: await loadRecord(db(), ctx, jobId), photoId: raced.id, created: false };
    throw error;
  }
}

export async function removePhoto(ctx: ShopContext, jobId: string, photoId: string) {
  return guarded(
    () =>
      db().transaction(async (tx) => {
        const record = await loadRecord(tx, ctx, jobId, { lock: true });
        assertJobOpen(record);
        const p = record.photos.find((x) => x.id === photoId);
        if (!p) throw new AppError("not_found", "Photo not found on this job.");
        if (p.removed) return record;
        if (p.stepId && findStep(record, p.stepId).signed) throw new AppError("conflict", "This photo is part of a signed step and stays on it.");
        if (p.nonconformanceId) throw new AppError("conflict", "This photo is evidence of a nonconformance and stays with it.");
        if (p.uploadedBy.id !== ctx.userId && !ctx.roles.includes("lead")) throw new AppError("forbidden", `Only ${p.uploadedBy.name}, who took it, or a lead can take this photo off.`);
        await tx
          .update(photo)
          .set({ removedAt: new Date(), removedBy: ctx.userId })
          .where(and(eq(photo.id, photoId), eq(photo.shopId, ctx.shopId)));
        await logActivity(tx, { shopId: ctx.shopId, jobId, actorId: ctx.userId, action: "photo.removed", stepId: p.stepId, detail: { photoId } });
        return loadRecord(tx, ctx, jobId);
      }),
    "This photo changed a moment ago.",
  );
}

/** The stored bytes of a photo of this shop, or not found (also for another shop's photo). */
export async function photoForServing(shopId: string, photoId: string, size: "full" | "thumb") {
  const [row] = await db()
    .select({ key: photo.key, thumbKey: photo.thumbKey, contentType: photo.contentType, sha256: photo.sha256, jobNumber: job.number })
    .from(photo)
    .innerJoin(job, eq(job.id, photo.jobId))
    .where(and(eq(photo.id, photoId), eq(photo.shopId, shopId)));
  if (!row) throw new AppError("not_found", "Photo not found.");
  const bytes = await getObject(size === "thumb" ? row.thumbKey : row.key);
  if (!bytes) throw new AppError("not_found", "The photo's file is missing from the store.");
  return { bytes, contentType: row.contentType, sha256: row.sha256, name: `${row.jobNumber}-${photoId.slice(0, 8)}${size === "thumb" ? "-thumb" : ""}.jpg` };
}

/**
 * Moves the job's weld map onto a photo of this axle (taken on the runner): one image, every weld joint's
 * marker placed on it by tap. Only while the job is open; the release then seals the map as it stands.
 */
export async function rebaseWeldMap(ctx: ShopContext, jobId: string, input: { photoId: string; joints: { jointId: string; x: number; y: number; path?: { x: number; y: number }[] | undefined }[] }) {
  return guarded(
    () =>
      db().transaction(async (tx) => {
        const record = await loadRecord(tx, ctx, jobId, { lock: true });
        assertJobOpen(record);
        const p = record.photos.find((x) => x.id === input.photoId && !x.removed);
        if (!p) throw new AppError("bad_request", "Choose a photo of this job to put the weld map on.", { photoId: ["Not a photo of this job."] });
        const jointIds = record.steps.flatMap((s) => (s.spec.kind === "weld" ? [s.spec.jointId] : []));
        const given = new Set(input.joints.map((j) => j.jointId));
        const stray = input.joints.find((j) => !jointIds.includes(j.jointId));
        if (stray) throw new AppError("bad_request", `This job has no weld joint ${stray.jointId}.`, { joints: [`Unknown joint ${stray.jointId}.`] });
        if (given.size !== input.joints.length) throw new AppError("bad_request", "A joint is placed twice; a joint has one marker.", { joints: ["Duplicate joint."] });
        const missing = jointIds.filter((id) => !given.has(id));
        if (missing.length) throw new AppError("bad_request", `Place every weld joint on the photo: ${missing.join(", ")} ${missing.length === 1 ? "is" : "are"} not placed.`, { joints: [`Not placed: ${missing.join(", ")}.`] });
        const [row] = await tx.select({ sha256: photo.sha256 }).from(photo).where(and(eq(photo.id, p.id), eq(photo.shopId, ctx.shopId)));
        const imageId = randomUUID();
        const map: JobWeldMap = {
          images: [{ id: imageId, photoId: p.id, sha256: row!.sha256, width: p.width, height: p.height }],
          joints: input.joints.map((j) => ({ jointId: j.jointId, imageId, x: j.x, y: j.y, ...(j.path ? { path: j.path } : {}) })),
          rebasedAt: new Date().toISOString(),
          rebasedBy: ctx.userId,
        };
        await tx.update(job).set({ weldMap: map, updatedAt: new Date() }).where(and(eq(job.id, jobId), eq(job.shopId, ctx.shopId)));
        await logActivity(tx, { shopId: ctx.shopId, jobId, actorId: ctx.userId, action: "weldmap.rebased", detail: { photoId: p.id, sha256: row!.sha256, joints: map.joints.length } });
        return loadRecord(tx, ctx, jobId);
      }),
    "The job changed a moment ago; reload and place the joints again.",
  );
}
