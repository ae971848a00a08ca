import { createHash } from "node:crypto";
import { NextResponse } from "next/server";
import { setDraftWeldMap, addImageToDraft, storeProcedureImage } from "@/db/queries/procedure-images";
import { createProcedure } from "@/db/queries/procedures";
import { shopRoute } from "@/lib/api/route";
import { AppError } from "@/lib/errors";
import { parseProcedureFile, problemFields, PROCEDURE_FILE_MAX_BYTES_WITH_IMAGES } from "@/lib/procedures/file";
import { versionHash } from "@/lib/procedures/hash";
import { processMapImage } from "@/lib/storage/images";
import { readBodyText } from "../_lib/params";

export const dynamic = "force-dynamic";

const CODES = { 400: "bad_request", 413: "payload_too_large", 422: "unprocessable" } as const;

// The body is the procedure file itself (formatVersion 1, or 2 with the weld map and its images). It becomes
// a new procedure with one draft; nothing is saved when anything in it is wrong, and every problem is listed.
export const POST = shopRoute({ action: "procedure:write" }, async ({ ctx, req }) => {
  const parsed = parseProcedureFile(await readBodyText(req, PROCEDURE_FILE_MAX_BYTES_WITH_IMAGES));
  if (!parsed.ok) throw new AppError(CODES[parsed.status], parsed.message, problemFields(parsed.problems), { problems: parsed.problems });
  const { file } = parsed;
  const map = file.formatVersion === 2 ? file.content.weldMap : undefined;
  // Images are checked and re-encoded before anything is saved: each must be the bytes the map names.
  const images = [];
  for (const [i, img] of (map?.images ?? []).entries()) {
    const carried = file.formatVersion === 2 ? file.images.find((x) => x.id === img.id) : undefined;
    const bytes = Buffer.from(carried?.data ?? "", "base64");
    const where = `content.weldMap.images[${i}]`;
    if (createHash("sha256").update(bytes).digest("hex") !== img.sha256) {
      throw new AppError("unprocessable", "The file is not a valid Gusset procedure file: a weld-map image is not the one its map names (SHA-256 differs). Nothing was saved.", { [where]: ["The image's bytes do not match its sha256."] });
    }
    images.push({ meta: img, processed: await processMapImage(bytes) });
  }
  const steps = { sections: file.content.sections };
  const body = { title: file.procedure.title, scope: file.procedure.scope, code: file.procedure.code, content: steps };
  const created = await createProcedure({ shopId: ctx.shopId, actorId: ctx.userId, ...body, via: "import" });
  if (map) {
    const ref = { shopId: ctx.shopId, procedureId: created.id, number: created.number };
    const ids = new Map<string, string>();
    for (const { meta, processed } of images) {
      const stored = await storeProcedureImage({ shopId: ctx.shopId, procedureId: created.id, actorId: ctx.userId, processed, source: meta.source, label: meta.label });
      ids.set(meta.id, stored.id);
      await addImageToDraft(ref, stored);
    }
    await setDraftWeldMap(ref, { imageIds: map.images.map((i) => ids.get(i.id)!), joints: map.joints.map((j) => ({ ...j, imageId: ids.get(j.imageId)! })) });
  }
  // The hash is of the content as the file carries it (its image ids and SHA-256s), as it was exported.
  const sourceHashMatches = file.source?.contentHash ? file.source.contentHash === versionHash({ ...body, content: file.content }) : null;
  return NextResponse.json(
    { procedure: { id: created.id, title: body.title }, version: { number: created.number, status: "draft" }, sourceHashMatches },
    { status: 201 },
  );
});
