import "server-only";
// Weld-map images of procedures: stored like job photos (judged by content, re-encoded, server-made keys),
// never changed, served only to members of the shop. A draft's map names them by id and SHA-256.
import { randomUUID } from "node:crypto";
import { and, eq, inArray } from "drizzle-orm";
import { procedureImage } from "@/db/schema";
import { db } from "@/lib/db";
import { AppError } from "@/lib/errors";
import { weldJointIds, type VersionContent } from "@/lib/procedures/schema";
import { getObject, procedureImageKeys, putObject } from "@/lib/storage";
import type { ProcessedPhoto } from "@/lib/storage/images";
import { type MapJoint, type ProcedureMapImage } from "@/lib/weld-map";
import { changeDraft } from "./procedures";

type Source = ProcedureMapImage["source"];

/** Stores one processed image of a procedure and returns how a map names it. */
export async function storeProcedureImage(args: { shopId: string; procedureId: string; actorId: string; processed: ProcessedPhoto; source: Source; label?: string }): Promise<ProcedureMapImage> {
  const id = randomUUID();
  const keys = procedureImageKeys(args.shopId, args.procedureId, id);
  // Objects first, then the row: a row never points at a missing object.
  await putObject(keys.key, args.processed.main, args.processed.contentType);
  await putObject(keys.thumbKey, args.processed.thumb, args.processed.contentType);
  await db().insert(procedureImage).values({
    id,
    shopId: args.shopId,
    procedureId: args.procedureId,
    key: keys.key,
    thumbKey: keys.thumbKey,
    sha256: args.processed.sha256,
    contentType: args.processed.contentType,
    size: args.processed.main.length,
    width: args.processed.width,
    height: args.processed.height,
    source: args.source,
    originalType: args.processed.originalType,
    uploadedBy: args.actorId,
  });
  return { id, sha256: args.processed.sha256, width: args.processed.width, height: args.processed.height, source: args.source, label: args.label ?? "" };
}

/** Adds an image to a draft's weld map (its markers stay as they are). */
export async function addImageToDraft(ref: { shopId: string; procedureId: string; number: number }, image: ProcedureMapImage) {
  return changeDraft(ref, (current) => {
    const map = current.content.weldMap ?? { images: [], joints: [] };
    return { content: { ...current.content, weldMap: { images: [...map.images, image], joints: map.joints } } };
  });
}

/** Sets a draft's markers (and which of its images stay on the map, in order). */
export async function setDraftWeldMap(ref: { shopId: string; procedureId: string; number: number }, input: { imageIds: string[]; joints: MapJoint[] }) {
  return changeDraft(ref, (current) => {
    const known = new Map((current.content.weldMap?.images ?? []).map((i) => [i.id, i]));
    const images = input.imageIds.map((id) => {
      const img = known.get(id);
      if (!img) throw new AppError("bad_request", "That image is not on this draft's weld map; upload it first.", { imageIds: ["Unknown image."] });
      return img;
    });
    const ids = new Set(weldJointIds(current.content));
    const stray = input.joints.find((j) => !ids.has(j.jointId));
    if (stray) throw new AppError("bad_request", `No weld step of this draft has the joint ${stray.jointId}.`, { joints: [`Unknown joint ${stray.jointId}.`] });
    const content: VersionContent = { ...current.content };
    if (images.length === 0 && input.joints.length === 0) delete content.weldMap;
    else content.weldMap = { images, joints: input.joints };
    return { content };
  });
}

/** The stored bytes of a procedure image of this shop, or not found (also for another shop's image). */
export async function procedureImageForServing(shopId: string, imageId: string, size: "full" | "thumb") {
  const [row] = await db()
    .select({ key: procedureImage.key, thumbKey: procedureImage.thumbKey, contentType: procedureImage.contentType, sha256: procedureImage.sha256 })
    .from(procedureImage)
    .where(and(eq(procedureImage.id, imageId), eq(procedureImage.shopId, shopId)));
  if (!row) throw new AppError("not_found", "Image not found.");
  const bytes = await getObject(size === "thumb" ? row.thumbKey : row.key);
  if (!bytes) throw new AppError("not_found", "The image's file is missing from the store.");
  return { bytes, contentType: row.contentType, sha256: row.sha256 };
}

/** Bytes of several images of this shop (for export and the traveller); a missing one is left out. */
export async function procedureImageBytes(shopId: string, ids: readonly string[]): Promise<Map<string, { bytes: Buffer; contentType: string; sha256: string }>> {
  const out = new Map<string, { bytes: Buffer; contentType: string; sha256: string }>();
  if (!ids.length) return out;
  const rows = await db()
    .select({ id: procedureImage.id, key: procedureImage.key, contentType: procedureImage.contentType, sha256: procedureImage.sha256 })
    .from(procedureImage)
    .where(and(eq(procedureImage.shopId, shopId), inArray(procedureImage.id, [...ids])));
  for (const r of rows) {
    const bytes = await getObject(r.key);
    if (bytes) out.set(r.id, { bytes, contentType: r.contentType, sha256: r.sha256 });
  }
  return out;
}
