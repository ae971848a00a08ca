import { NextResponse } from "next/server";
import { addImageToDraft, storeProcedureImage } from "@/db/queries/procedure-images";
import { getVersion } from "@/db/queries/procedures";
import { shopRoute } from "@/lib/api/route";
import { AppError } from "@/lib/errors";
import { PHOTO_MAX_BYTES } from "@/lib/jobs/schemas";
import { processMapImage, renderDrawing } from "@/lib/storage/images";
import { drawingSchema, drawingSvg } from "@/lib/weld-map";
import { procedureIdFrom, versionNumberFrom } from "../../../../../_lib/params";

export const dynamic = "force-dynamic";

const TOO_BIG = `An image is at most ${PHOTO_MAX_BYTES / 1024 / 1024} MB.`;

// POST /api/procedures/{id}/versions/{n}/weld-map/images → 201 { image, version }
// multipart `file` (PNG, JPEG, WebP, or a PDF whose first page is taken; SVG refused with 415), or JSON
// { drawing } made in Gusset.
// Only a draft takes images (409 otherwise).
export const POST = shopRoute({ action: "procedure:write" }, async ({ ctx, params, req }) => {
  const ref = { shopId: ctx.shopId, procedureId: procedureIdFrom(params), number: versionNumberFrom(params) };
  const current = await getVersion(ref.shopId, ref.procedureId, ref.number);
  if (current.status !== "draft") throw new AppError("conflict", `Version ${ref.number} is ${current.status}: it never changes. Start a new version to change its weld map.`);
  if (Number(req.headers.get("content-length") ?? "0") > PHOTO_MAX_BYTES + 64 * 1024) throw new AppError("payload_too_large", TOO_BIG);
  const type = req.headers.get("content-type") ?? "";
  let processed;
  let source: "upload" | "pdf" | "drawing";
  let label = "";
  if (type.startsWith("application/json")) {
    let json: unknown;
    try {
      json = await req.json();
    } catch {
      throw new AppError("bad_request", "The body is not JSON.");
    }
    const drawing = drawingSchema.parse((json as { drawing?: unknown } | null)?.drawing);
    processed = await renderDrawing(drawingSvg(drawing).svg);
    source = "drawing";
    label = drawing.title;
  } else {
    let form: FormData;
    try {
      form = await req.formData();
    } catch {
      throw new AppError("bad_request", "Send the image as multipart form data with a `file` field, or JSON with a `drawing`.");
    }
    const file = form.get("file");
    if (!(file instanceof File) || file.size === 0) throw new AppError("bad_request", "No image in the upload.", { file: ["Choose an image."] });
    if (file.size > PHOTO_MAX_BYTES) throw new AppError("payload_too_large", TOO_BIG);
    processed = await processMapImage(Buffer.from(await file.arrayBuffer()));
    source = processed.originalType === "application/pdf" ? "pdf" : "upload";
    label = String(form.get("label") ?? "").trim().slice(0, 120);
  }
  const image = await storeProcedureImage({ shopId: ctx.shopId, procedureId: ref.procedureId, actorId: ctx.userId, processed, source, label });
  await addImageToDraft(ref, image);
  return NextResponse.json({ image, version: await getVersion(ref.shopId, ref.procedureId, ref.number) }, { status: 201 });
});
