// Demo photos for the seeded jobs: drawn here (a labelled card, not a picture of anyone's work), encoded as
// the app stores photos (metadata-free JPEG plus a thumbnail) and put in the object store through the S3 SDK,
// under the same keys the app would use. The seed runs after the object store is up.
import { createHash } from "node:crypto";
import { PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import sharp from "sharp";

export type SeedStorage = { endpoint?: string | undefined; region: string; bucket: string; accessKeyId: string; secretAccessKey: string; forcePathStyle: boolean };

type StoredSeedPhoto = { key: string; thumbKey: string; sha256: string; size: number; width: number; height: number; contentType: "image/jpeg"; originalType: string; originalSize: number };

/** Storage settings from the environment the app reads (lib/env.ts); null when no object store is configured. */
export function seedStorageFromEnv(env: NodeJS.ProcessEnv): SeedStorage | null {
  if (!env.S3_ENDPOINT && !env.S3_BUCKET) return null;
  return {
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION ?? "us-east-1",
    bucket: env.S3_BUCKET ?? "gusset-photos",
    accessKeyId: env.S3_ACCESS_KEY_ID ?? "S3RVER",
    secretAccessKey: env.S3_SECRET_ACCESS_KEY ?? "S3RVER",
    forcePathStyle: (env.S3_FORCE_PATH_STYLE ?? "on") === "on",
  };
}

const escape = (s: string) => s.replace(/[&<>"]/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;" })[c]!);

function card(title: string, lines: readonly string[], hue: number): string {
  const text = lines.map((l, i) => `<text x="60" y="${250 + i * 56}" font-size="38" fill="#e9ece9" font-family="sans-serif">${escape(l)}</text>`).join("");
  return `<svg xmlns="http://www.w3.org/2000/svg" width="1280" height="960">
    <defs><linearGradient id="g" x1="0" y1="0" x2="1" y2="1"><stop offset="0" stop-color="hsl(${hue},8%,30%)"/><stop offset="1" stop-color="hsl(${hue},10%,16%)"/></linearGradient></defs>
    <rect width="1280" height="960" fill="url(#g)"/>
    <rect x="40" y="40" width="1200" height="880" fill="none" stroke="#aec22b" stroke-width="6" rx="18"/>
    <text x="60" y="150" font-size="64" font-weight="700" fill="#ffffff" font-family="sans-serif">${escape(title)}</text>
    ${text}
    <text x="60" y="880" font-size="28" fill="#c7ccc9" font-family="sans-serif">Gusset demo photo · invented scenario</text>
  </svg>`;
}

export function seedPhotoStore(storage: SeedStorage) {
  const s3 = new S3Client({
    region: storage.region,
    ...(storage.endpoint ? { endpoint: storage.endpoint } : {}),
    forcePathStyle: storage.forcePathStyle,
    credentials: { accessKeyId: storage.accessKeyId, secretAccessKey: storage.secretAccessKey },
  });
  let n = 0;
  return {
    /** Draws, encodes and stores one photo; the keys follow lib/storage photoKeys for this idempotency key. */
    async put(args: { shopId: string; jobId: string; idempotencyKey: string; title: string; lines: readonly string[] }): Promise<StoredSeedPhoto> {
      const png = await sharp(Buffer.from(card(args.title, args.lines, (n++ * 47) % 360))).png().toBuffer();
      const main = await sharp(png).jpeg({ quality: 85, mozjpeg: true }).toBuffer({ resolveWithObject: true });
      const thumb = await sharp(main.data).resize({ width: 360, height: 360, fit: "inside" }).jpeg({ quality: 75 }).toBuffer();
      const name = createHash("sha256").update(`${args.shopId}:${args.idempotencyKey}`).digest("hex").slice(0, 32);
      const base = `shops/${args.shopId}/jobs/${args.jobId}/photos/${name}`;
      const key = `${base}.jpg`;
      const thumbKey = `${base}-thumb.jpg`;
      for (const [k, body] of [[key, main.data], [thumbKey, thumb]] as const) {
        await s3.send(new PutObjectCommand({ Bucket: storage.bucket, Key: k, Body: body, ContentType: "image/jpeg", ContentLength: body.length }));
      }
      return {
        key,
        thumbKey,
        sha256: createHash("sha256").update(main.data).digest("hex"),
        size: main.data.length,
        width: main.info.width,
        height: main.info.height,
        contentType: "image/jpeg",
        originalType: "image/png",
        originalSize: png.length,
      };
    },
    /** Renders a drawing (SVG made by lib/weld-map drawingSvg), encodes it as the app stores procedure images, and stores it. */
    async putProcedureImage(args: { shopId: string; procedureId: string; imageId: string; svg: string }) {
      const png = await sharp(Buffer.from(args.svg)).png().toBuffer();
      const main = await sharp(png).jpeg({ quality: 85, mozjpeg: true }).toBuffer({ resolveWithObject: true });
      const thumb = await sharp(main.data).resize({ width: 360, height: 360, fit: "inside" }).jpeg({ quality: 75 }).toBuffer();
      const base = `shops/${args.shopId}/procedures/${args.procedureId}/images/${args.imageId}`;
      const key = `${base}.jpg`;
      const thumbKey = `${base}-thumb.jpg`;
      for (const [k, body] of [[key, main.data], [thumbKey, thumb]] as const) {
        await s3.send(new PutObjectCommand({ Bucket: storage.bucket, Key: k, Body: body, ContentType: "image/jpeg", ContentLength: body.length }));
      }
      return { key, thumbKey, sha256: createHash("sha256").update(main.data).digest("hex"), size: main.data.length, width: main.info.width, height: main.info.height };
    },
  };
}
export type SeedPhotoStore = ReturnType<typeof seedPhotoStore>;
