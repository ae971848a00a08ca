import "server-only";
// Object storage through the S3 SDK: the local S3-compatible store on one machine, real object storage
// when S3_* say so. Keys are made here, never taken from a request.
import { createHash } from "node:crypto";
import { GetObjectCommand, NoSuchKey, PutObjectCommand, S3Client, S3ServiceException } from "@aws-sdk/client-s3";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";

const globalForS3 = globalThis as unknown as { gussetS3?: S3Client };

function client(): S3Client {
  if (!globalForS3.gussetS3) {
    const e = env();
    globalForS3.gussetS3 = new S3Client({
      region: e.S3_REGION,
      ...(e.S3_ENDPOINT ? { endpoint: e.S3_ENDPOINT } : {}),
      forcePathStyle: e.S3_FORCE_PATH_STYLE === "on",
      credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
      // One quick retry; the client retries the whole upload with its idempotency key.
      maxAttempts: 2,
    });
  }
  return globalForS3.gussetS3;
}

function unavailable(error: unknown): AppError {
  console.error("[storage]", error instanceof Error ? error.message : error);
  return new AppError("unavailable", "The photo store is not answering. Nothing was lost: try again in a moment.");
}

export async function putObject(key: string, body: Buffer, contentType: string): Promise<void> {
  try {
    await client().send(new PutObjectCommand({ Bucket: env().S3_BUCKET, Key: key, Body: body, ContentType: contentType, ContentLength: body.length }));
  } catch (error) {
    throw unavailable(error);
  }
}

/** The object's bytes, or null when the key is not in the store. */
export async function getObject(key: string): Promise<Buffer | null> {
  try {
    const res = await client().send(new GetObjectCommand({ Bucket: env().S3_BUCKET, Key: key }));
    if (!res.Body) return null;
    return Buffer.from(await res.Body.transformToByteArray());
  } catch (error) {
    if (error instanceof NoSuchKey || (error instanceof S3ServiceException && error.$metadata.httpStatusCode === 404)) return null;
    throw unavailable(error);
  }
}

/**
 * Keys of a job photo and its thumbnail. Derived from the shop and the upload's idempotency key, so a
 * retried upload writes the same objects again instead of leaving orphans beside them.
 */
export function photoKeys(shopId: string, jobId: string, idempotencyKey: string): { key: string; thumbKey: string } {
  const name = createHash("sha256").update(`${shopId}:${idempotencyKey}`).digest("hex").slice(0, 32);
  const base = `shops/${shopId}/jobs/${jobId}/photos/${name}`;
  return { key: `${base}.jpg`, thumbKey: `${base}-thumb.jpg` };
}

/** Keys of a procedure's weld-map image and its thumbnail (one image id, one pair of objects). */
export function procedureImageKeys(shopId: string, procedureId: string, imageId: string): { key: string; thumbKey: string } {
  const base = `shops/${shopId}/procedures/${procedureId}/images/${imageId}`;
  return { key: `${base}.jpg`, thumbKey: `${base}-thumb.jpg` };
}
