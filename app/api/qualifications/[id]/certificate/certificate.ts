import "server-only";
// A certificate is judged by its bytes, never its name or declared type: PDF, JPEG or PNG, at most 20 MB.
// Photos of a certificate are re-encoded in their own format so no metadata (location, camera) is kept;
// a PDF is stored as it came, since it is the issuer's document.
import { createHash } from "node:crypto";
import { fileTypeFromBuffer } from "file-type";
import sharp from "sharp";
import { CERTIFICATE_MAX_BYTES, CERTIFICATE_TYPES } from "@/lib/welding/qualification-schema";
import { AppError } from "@/lib/errors";

const EXTENSIONS: Record<(typeof CERTIFICATE_TYPES)[number], string> = { "application/pdf": "pdf", "image/jpeg": "jpg", "image/png": "png" };
const MAX_PIXELS = 60_000_000;

type PreparedCertificate = { bytes: Buffer; contentType: (typeof CERTIFICATE_TYPES)[number]; extension: string; sha256: string };

export async function prepareCertificate(input: Buffer): Promise<PreparedCertificate> {
  if (input.length === 0) throw new AppError("bad_request", "The file is empty.", { file: ["Choose the certificate file."] });
  if (input.length > CERTIFICATE_MAX_BYTES) throw new AppError("payload_too_large", "A certificate may be at most 20 MB.", { file: ["At most 20 MB."] });
  const found = await fileTypeFromBuffer(input);
  const type = CERTIFICATE_TYPES.find((t) => t === found?.mime);
  if (!type) {
    throw new AppError(
      "unsupported_media_type",
      `This file is ${found ? `of type ${found.mime}` : "not a type Gusset recognises"}: a certificate is a PDF, or a JPEG or PNG photo of it.`,
      { file: ["PDF, JPEG or PNG only."] },
    );
  }
  let bytes = input;
  if (type !== "application/pdf") {
    try {
      const image = sharp(input, { failOn: "error", limitInputPixels: MAX_PIXELS }).rotate();
      bytes = type === "image/jpeg" ? await image.jpeg({ quality: 90, mozjpeg: true }).toBuffer() : await image.png().toBuffer();
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      if (/pixel limit/i.test(message)) throw new AppError("payload_too_large", "This image has too many pixels (over 60 megapixels).", { file: ["Too many pixels."] });
      throw new AppError("unprocessable", "This image could not be read: it may be damaged. Photograph the certificate again.", { file: ["Unreadable image."] });
    }
  }
  return { bytes, contentType: type, extension: EXTENSIONS[type], sha256: createHash("sha256").update(bytes).digest("hex") };
}

/** A file name as given by the browser, reduced to something safe to show. */
export function cleanFileName(name: string | undefined | null): string | null {
  if (!name) return null;
  const base = name.split(/[\\/]/).pop()!.replace(/[\u0000-\u001f\u007f]/g, "").trim();
  return base ? base.slice(0, 200) : null;
}

export function certificateKey(shopId: string, qualificationId: string, c: PreparedCertificate): string {
  return `shops/${shopId}/qualifications/${qualificationId}/certificate-${c.sha256.slice(0, 24)}.${c.extension}`;
}

export function downloadName(welderName: string, process: string, contentType: string): string {
  const slug = welderName.normalize("NFKD").replace(/[^\w\s-]/g, "").trim().replace(/\s+/g, "-").toLowerCase() || "welder";
  const ext = EXTENSIONS[contentType as (typeof CERTIFICATE_TYPES)[number]] ?? "bin";
  return `certificate-${slug}-${process.toLowerCase()}.${ext}`;
}
