// WOFF 1.0 → plain OpenType (SFNT). fontkit 2 misreads some WOFF 1.0 files: with the IBM Plex Mono latin
// subset in public/fonts every empty glyph (the space) throws "Offset is outside the bounds of the
// DataView" during layout, while the same tables as a plain TTF lay out fine. Unwrapping is cheap: each
// table is stored zlib-compressed (or as is), per the W3C WOFF File Format 1.0, section 5.
import { inflateSync } from "node:zlib";

const WOFF_SIGNATURE = 0x774f4646; // "wOFF"

export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.length < 44 || woff.readUInt32BE(0) !== WOFF_SIGNATURE) throw new Error("not a WOFF 1.0 file");
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables: { tag: string; checksum: number; data: Buffer; offset: number }[] = [];
  let offset = 12 + 16 * numTables;
  for (let i = 0; i < numTables; i++) {
    const dir = 44 + i * 20;
    const tag = woff.toString("latin1", dir, dir + 4);
    const at = woff.readUInt32BE(dir + 4);
    const compLength = woff.readUInt32BE(dir + 8);
    const origLength = woff.readUInt32BE(dir + 12);
    const checksum = woff.readUInt32BE(dir + 16);
    const stored = woff.subarray(at, at + compLength);
    const data = compLength < origLength ? inflateSync(stored) : Buffer.from(stored);
    if (data.length !== origLength) throw new Error(`WOFF table ${tag}: expected ${origLength} bytes, got ${data.length}`);
    tables.push({ tag, checksum, data, offset });
    offset += (data.length + 3) & ~3; // tables start on 4-byte boundaries
  }
  const out = Buffer.alloc(offset);
  const log2 = Math.floor(Math.log2(numTables));
  const searchRange = 16 * 2 ** log2;
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(searchRange, 6);
  out.writeUInt16BE(log2, 8);
  out.writeUInt16BE(numTables * 16 - searchRange, 10);
  tables.forEach((t, i) => {
    const dir = 12 + i * 16;
    out.write(t.tag, dir, "latin1");
    out.writeUInt32BE(t.checksum, dir + 4);
    out.writeUInt32BE(t.offset, dir + 8);
    out.writeUInt32BE(t.data.length, dir + 12);
    t.data.copy(out, t.offset);
  });
  return out;
}
