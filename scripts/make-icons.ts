// Draws Gusset's app icons (a gusset plate with its weld bead, primer yellow-green on graphite) into
// public/icons and app/favicon.ico. Run once when the mark changes: `npx tsx scripts/make-icons.ts`.
import fs from "node:fs";
import path from "node:path";
import sharp from "sharp";

const root = path.resolve(import.meta.dirname, "..");
const GRAPHITE = "#171b1a";
const PRIMER = "#c3d543";

// `inset` leaves the margin a maskable icon needs: launchers may crop to a circle of 80 % of the side.
function mark(size: number, opts: { rounded: boolean; inset: number }) {
  const s = size;
  const p = s * opts.inset;
  const w = s - 2 * p;
  const radius = opts.rounded ? s * 0.18 : 0;
  const x0 = p + w * 0.18;
  const y0 = p + w * 0.18;
  const x1 = p + w * 0.82;
  const y1 = p + w * 0.82;
  const bead = Math.max(1, w * 0.07);
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${s}" height="${s}" viewBox="0 0 ${s} ${s}">
  <rect width="${s}" height="${s}" rx="${radius}" fill="${GRAPHITE}"/>
  <path d="M ${x0} ${y0} L ${x0} ${y1} L ${x1} ${y1} Z" fill="${PRIMER}"/>
  <path d="M ${x0 + bead * 1.4} ${y0 + w * 0.2} L ${x1 - w * 0.2} ${y1 - bead * 1.4}" stroke="${GRAPHITE}" stroke-width="${bead}" stroke-linecap="round" stroke-dasharray="${bead * 0.2} ${bead * 1.3}"/>
  <rect x="${x0 - bead}" y="${y0 - bead}" width="${bead}" height="${y1 - y0 + 2 * bead}" fill="#e7e9e8"/>
  <rect x="${x0 - bead}" y="${y1}" width="${x1 - x0 + 2 * bead}" height="${bead}" fill="#e7e9e8"/>
</svg>`;
}

async function png(size: number, opts: { rounded: boolean; inset: number }) {
  return sharp(Buffer.from(mark(size, opts))).png().toBuffer();
}

// An .ico file is a directory of images; each may be a PNG as it is (Windows Vista and later, every browser).
function ico(images: { size: number; data: Buffer }[]) {
  const header = Buffer.alloc(6 + 16 * images.length);
  header.writeUInt16LE(0, 0);
  header.writeUInt16LE(1, 2);
  header.writeUInt16LE(images.length, 4);
  let offset = header.length;
  images.forEach((img, i) => {
    const e = 6 + 16 * i;
    header.writeUInt8(img.size >= 256 ? 0 : img.size, e);
    header.writeUInt8(img.size >= 256 ? 0 : img.size, e + 1);
    header.writeUInt8(0, e + 2);
    header.writeUInt8(0, e + 3);
    header.writeUInt16LE(1, e + 4);
    header.writeUInt16LE(32, e + 6);
    header.writeUInt32LE(img.data.length, e + 8);
    header.writeUInt32LE(offset, e + 12);
    offset += img.data.length;
  });
  return Buffer.concat([header, ...images.map((i) => i.data)]);
}

async function main() {
  const out = path.join(root, "public/icons");
  fs.mkdirSync(out, { recursive: true });
  fs.writeFileSync(path.join(out, "icon-192.png"), await png(192, { rounded: true, inset: 0 }));
  fs.writeFileSync(path.join(out, "icon-512.png"), await png(512, { rounded: true, inset: 0 }));
  fs.writeFileSync(path.join(out, "maskable-512.png"), await png(512, { rounded: false, inset: 0.12 }));
  fs.writeFileSync(path.join(root, "app/apple-icon.png"), await png(180, { rounded: false, inset: 0.06 }));
  const small = await Promise.all([16, 32, 48].map(async (size) => ({ size, data: await png(size, { rounded: true, inset: 0 }) })));
  fs.writeFileSync(path.join(root, "app/favicon.ico"), ico(small));
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
