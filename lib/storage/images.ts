import "server-only";
// Photos are judged by their bytes, never by name or declared type, then re-encoded: the stored JPEG has no
// metadata at all (no location, no camera serial), is turned upright, and gets a thumbnail beside it.
import { execFile, type ExecFileException } from "node:child_process";
import { createHash } from "node:crypto";
import { mkdtemp, readFile, rm, stat, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileTypeFromBuffer } from "file-type";
import sharp, { type OutputInfo } from "sharp";
import { AppError } from "@/lib/errors";

const ACCEPTED_TYPES = ["image/jpeg", "image/png", "image/webp", "image/avif"] as const;
const HEIC_TYPES = new Set(["image/heic", "image/heif", "image/heic-sequence", "image/heif-sequence"]);
const MAX_SIDE = 2560;
const THUMB_SIDE = 360;
// Decompression bombs: a small file that unpacks to gigapixels is refused before it is decoded.
const MAX_PIXELS = 60_000_000;

export type ProcessedPhoto = {
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

/**
 * A weld-map image: a photo or drawing judged and re-encoded like a job photo. SVG is refused (it can carry
 * script and outside references); a PDF's first page is rendered to PNG by poppler's pdftoppm (see README).
 */
export async function processMapImage(bytes: Buffer): Promise<ProcessedPhoto> {
  const head = bytes.subarray(0, 512).toString("utf8").replace(/^\uFEFF/, "").trimStart().toLowerCase();
  if (head.startsWith("<") && (head.includes("<svg") || head.startsWith("<?xml"))) {
    throw new AppError("unsupported_media_type", "SVG drawings are not taken (they can carry scripts). Save the drawing as PNG or JPEG, or draw it in Gusset.");
  }
  if ((await sniffImageType(bytes)) === "application/pdf") {
    const processed = await processPhoto(await pdfFirstPage(bytes));
    return { ...processed, originalType: "application/pdf" };
  }
  return processPhoto(bytes);
}

// Rendering a PDF page runs a parser over untrusted bytes: in a child process, killed after PDF_TIMEOUT_MS,
// with the page scaled so its longer side is PDF_PAGE_SIDE pixels whatever size the page claims.
const PDF_TIMEOUT_MS = 20_000;
const PDF_PAGE_SIDE = 2000;
const PDF_MAX_OUTPUT = 40 * 1024 * 1024;

/** Page 1 of a PDF as PNG bytes, or a 415/422 that says why not. */
export async function pdfFirstPage(bytes: Buffer): Promise<Buffer> {
  const dir = await mkdtemp(path.join(tmpdir(), "gusset-pdf-"));
  try {
    const input = path.join(dir, "in.pdf");
    await writeFile(input, bytes);
    const failure = await new Promise<ExecFileException | null>((resolve) => {
      execFile(
        "pdftoppm",
        ["-q", "-f", "1", "-l", "1", "-singlefile", "-png", "-scale-to", String(PDF_PAGE_SIDE), input, path.join(dir, "page")],
        { timeout: PDF_TIMEOUT_MS, killSignal: "SIGKILL", maxBuffer: 64 * 1024, windowsHide: true },
        (error) => resolve(error),
      );
    });
    if (failure?.code === "ENOENT") {
      throw new AppError("unsupported_media_type", "PDF drawings cannot be read on this computer (poppler's pdftoppm is not installed). Save the drawing's first page as PNG or JPEG and upload that.");
    }
    if (failure?.killed) {
      throw new AppError("unprocessable", "This PDF took too long to draw. Save its first page as PNG or JPEG and upload that.");
    }
    const out = path.join(dir, "page.png");
    const size = await stat(out).then((s) => s.size).catch(() => 0);
    if (failure || size === 0) throw new AppError("unprocessable", "The first page of this PDF could not be read (it may be damaged or password-protected). Save it as PNG or JPEG and upload that.");
    if (size > PDF_MAX_OUTPUT) throw new AppError("payload_too_large", "The first page of this PDF makes too large an image. Save it as PNG or JPEG and upload that.");
    return await readFile(out);
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

/** A drawing made in Gusset: SVG text built by lib/weld-map drawingSvg from checked shapes, rendered and re-encoded. */
export async function renderDrawing(svg: string): Promise<ProcessedPhoto> {
  const png = await sharp(Buffer.from(svg), { limitInputPixels: MAX_PIXELS }).png().toBuffer();
  const processed = await processPhoto(png);
  return { ...processed, originalType: "image/svg+xml" };
}
