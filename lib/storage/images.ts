import "server-only";
// Photos are judged by their bytes, never by name or declared type, then re-encoded: the stored JPEG has no
// metadata at all (no location, no camera serial), is turned upright, and gets a thumbnail beside it.
import { createHash } from "node:crypto";
import { fileTypeFromBuffer } from "file-type";
import sharp, { type OutputInfo } from "sharp";
import { AppError } from "@/lib/errors";

const ACCEPTED_TYPES = ["image/jpeg", "image/png", "image/webp", "image/avif"] as const;
const HEIC_TYPES = new Set(["image/heic", "image/heif", "image/heic-sequence", "image/heif-sequence"]);
const MAX_SIDE = 2560;
const THUMB_SIDE = 360;
// Decompression bombs: a small file that unpacks to gigapixels is refused before it is decoded.
const MAX_PIXELS = 60_000_000;

type ProcessedPhoto = {
  main: Buffer;
  thumb: Buffer;
  width: number;
  height: number;
  sha256: string;
  originalType: string;
  contentType: "image/jpeg";
};

async function sniffImageType(bytes: Buffer): Promise<string | null> {
  const found = await fileTypeFromBuffer(bytes);
  return found?.mime ?? null;
}

export async function processPhoto(bytes: Buffer): Promise<ProcessedPhoto> {
  const type = await sniffImageType(bytes);
  if (!type) throw new AppError("unsupported_media_type", "This file is not a photo Gusset can read: its content matches no image type. Take the photo as JPEG or PNG.");
  if (HEIC_TYPES.has(type)) {
    // The prebuilt image library decodes AVIF but not HEVC-coded HEIC, so say how to get a JPEG instead.
    if (!(await decodes(bytes))) {
      throw new AppError(
        "unsupported_media_type",
        "HEIC photos cannot be read here yet. Set the camera to its most compatible format (JPEG), or share the photo as JPEG.",
      );
    }
  } else if (!(ACCEPTED_TYPES as readonly string[]).includes(type)) {
    throw new AppError("unsupported_media_type", `This file is ${describe(type)}, not a photo. Gusset takes JPEG, PNG, WebP or AVIF photos.`);
  }

  let main: { data: Buffer; info: OutputInfo };
  let thumb: Buffer;
  try {
    const input = () => sharp(bytes, { failOn: "warning", limitInputPixels: MAX_PIXELS, sequentialRead: true }).rotate();
    main = await input()
      .resize({ width: MAX_SIDE, height: MAX_SIDE, fit: "inside", withoutEnlargement: true })
      .flatten({ background: "#ffffff" })
      .jpeg({ quality: 85, mozjpeg: true })
      .toBuffer({ resolveWithObject: true });
    thumb = await sharp(main.data).resize({ width: THUMB_SIDE, height: THUMB_SIDE, fit: "inside", withoutEnlargement: true }).jpeg({ quality: 75 }).toBuffer();
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    if (/pixel limit/i.test(message)) throw new AppError("payload_too_large", "This image has too many pixels to process (over 60 megapixels).");
    if (/premature end|truncated|corrupt|bad huffman|invalid|unexpected end|read error/i.test(message)) {
      throw new AppError("unprocessable", "This photo is incomplete or damaged (the file ends early). Take it again or upload it again.");
    }
    throw new AppError("unprocessable", "This photo could not be read. Take it again, as JPEG or PNG.");
  }
  return {
    main: main.data,
    thumb,
    width: main.info.width,
    height: main.info.height,
    sha256: createHash("sha256").update(main.data).digest("hex"),
    originalType: type,
    contentType: "image/jpeg",
  };
}

async function decodes(bytes: Buffer): Promise<boolean> {
  try {
    await sharp(bytes, { failOn: "warning", limitInputPixels: MAX_PIXELS }).stats();
    return true;
  } catch {
    return false;
  }
}

function describe(mime: string): string {
  if (mime === "application/x-elf" || mime === "application/x-msdownload" || mime === "application/x-mach-binary") return "a program";
  if (mime === "application/pdf") return "a PDF document";
  if (mime.startsWith("video/")) return "a video";
  if (mime === "application/zip" || mime.includes("compressed")) return "an archive";
  return `of type ${mime}`;
}
