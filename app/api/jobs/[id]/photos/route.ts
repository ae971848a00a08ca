import { NextResponse } from "next/server";
import { addPhoto } from "@/db/queries/jobs-photos";
import { getJobRecord } from "@/db/queries/jobs-core";
import { readMultipart } from "@/lib/api/body";
import { shopRoute } from "@/lib/api/route";
import { AppError } from "@/lib/errors";
import { PHOTO_MAX_BYTES, photoFieldsSchema } from "@/lib/jobs/schemas";
import { authorizeChecklistWork, idParam } from "../../_lib/params";

export const dynamic = "force-dynamic";

const TOO_BIG = `Photos are at most ${PHOTO_MAX_BYTES / 1024 / 1024} MB. Take it again at a lower resolution.`;

// GET /api/jobs/{id}/photos → { photos }
export const GET = shopRoute({ action: "job:read" }, async ({ ctx, params }) => {
  const record = await getJobRecord(ctx, idParam(params, "id", "Job"));
  return { photos: record.photos };
});

// POST /api/jobs/{id}/photos multipart: file, idempotencyKey, stepId?, caption? → 201 { photoId, record };
// 200 with the same photo when the idempotency key was seen. Refusals: 413 (over 20 MB), 415 (not a photo
// by its content), 422 (damaged or cut short), 409 (signed step), 503 (store down, retry).
export const POST = shopRoute({ action: "job:read" }, async ({ ctx, params, req }) => {
  authorizeChecklistWork(ctx);
  const jobId = idParam(params, "id", "Job");
  // Multipart adds a little around the file; the limit is counted while the upload streams in.
  const form = await readMultipart(req, PHOTO_MAX_BYTES + 64 * 1024, TOO_BIG);
  const file = form.get("file");
  if (!(file instanceof File) || file.size === 0) throw new AppError("bad_request", "No photo in the upload.", { file: ["Choose or take a photo."] });
  if (file.size > PHOTO_MAX_BYTES) throw new AppError("payload_too_large", TOO_BIG);
  const fields = photoFieldsSchema.parse({
    idempotencyKey: form.get("idempotencyKey") ?? undefined,
    stepId: form.get("stepId") || undefined,
    caption: form.get("caption") ?? undefined,
  });
  const result = await addPhoto(ctx, jobId, { bytes: Buffer.from(await file.arrayBuffer()), ...fields });
  return NextResponse.json({ photoId: result.photoId, record: result.record }, { status: result.created ? 201 : 200 });
});
