import { certificateOf, qualificationExists, setCertificate } from "@/db/queries/qualifications";
import { readMultipart } from "@/lib/api/body";
import { shopRoute } from "@/lib/api/route";
import { AppError } from "@/lib/errors";
import { getObject, putObject } from "@/lib/storage";
import { qualificationIdParam } from "../../params";
import { CERTIFICATE_MAX_BYTES } from "@/lib/welding/qualification-schema";
import { certificateKey, cleanFileName, downloadName, prepareCertificate } from "./certificate";

export const dynamic = "force-dynamic";

// Room for the multipart framing around a file at the limit.
const MULTIPART_SLACK = 64 * 1024;

// Upload (lead): multipart/form-data with one `file` field, a PDF, JPEG or PNG of at most 20 MB.
export const POST = shopRoute({ action: "qualification:write" }, async ({ ctx, params, req }) => {
  const id = qualificationIdParam(params);
  await qualificationExists(ctx.shopId, id);
  if (!(req.headers.get("content-type") ?? "").toLowerCase().startsWith("multipart/form-data")) {
    throw new AppError("unsupported_media_type", "Send the certificate as multipart/form-data with a `file` field.");
  }
  const form = await readMultipart(req, CERTIFICATE_MAX_BYTES + MULTIPART_SLACK, "A certificate may be at most 20 MB.");
  const file = form.get("file");
  if (!(file instanceof Blob)) throw new AppError("bad_request", "Choose the certificate file.", { file: ["Choose the certificate file."] });
  if (file.size > CERTIFICATE_MAX_BYTES) throw new AppError("payload_too_large", "A certificate may be at most 20 MB.", { file: ["At most 20 MB."] });
  const prepared = await prepareCertificate(Buffer.from(await file.arrayBuffer()));
  const key = certificateKey(ctx.shopId, id, prepared);
  await putObject(key, prepared.bytes, prepared.contentType);
  const name = cleanFileName(file instanceof File ? file.name : null);
  await setCertificate({ shopId: ctx.shopId, id, actorId: ctx.userId, key, contentType: prepared.contentType, name, size: prepared.bytes.length, sha256: prepared.sha256 });
  return { certificate: { name, contentType: prepared.contentType, size: prepared.bytes.length, sha256: prepared.sha256 } };
});

// Download (any member of the shop).
export const GET = shopRoute({ action: "job:read" }, async ({ ctx, params }) => {
  const id = qualificationIdParam(params);
  const c = await certificateOf(ctx.shopId, id);
  if (!c.key || !c.contentType) throw new AppError("not_found", "No certificate has been uploaded for this qualification.");
  const bytes = await getObject(c.key);
  if (!bytes) throw new AppError("not_found", "The certificate file is missing from the store.");
  return new Response(new Uint8Array(bytes), {
    headers: {
      "content-type": c.contentType,
      "content-length": String(bytes.length),
      "content-disposition": `attachment; filename="${downloadName(c.welderName, c.process, c.contentType)}"`,
      "cache-control": "private, no-store",
      ...(c.sha256 ? { "x-content-sha256": c.sha256 } : {}),
    },
  });
});
