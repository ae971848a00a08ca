import { describe, expect, it } from "vitest";
import { comparePaperSeal, normalisePaperSeal, sealFromScan, verifyPath, verifyUrlWithSeal } from "@/lib/records/paper-seal";
import { buildChain } from "@/lib/seal";

// Three chained entries, hashed with the project's own chain (lib/seal, checked elsewhere against node:crypto).
const hashes = buildChain([{ n: 1 }, { n: 2 }, { n: 3 }]);
const head = hashes[2]!;

describe("the seal on the paper against the record", () => {
  it("agrees when the record is intact and its seal begins with the paper's digits", () => {
    const r = comparePaperSeal(head.slice(0, 16), { intact: true, seal: head, entryHashes: hashes });
    expect(r).toMatchObject({ verdict: "agrees", agrees: true });
    expect(r.message).toMatch(/agree/);
  });

  it("names an earlier print of a growing record by its entry count", () => {
    expect(comparePaperSeal(hashes[0]!.slice(0, 16), { intact: true, seal: head, entryHashes: hashes })).toMatchObject({ verdict: "earlier", printedAtEntries: 1, agrees: false });
  });

  it("disagrees when no entry carries the paper's seal, or when the record no longer verifies", () => {
    const other = "f".repeat(16);
    expect(comparePaperSeal(other, { intact: true, seal: head, entryHashes: hashes })).toMatchObject({ verdict: "disagrees", agrees: false });
    expect(comparePaperSeal(head.slice(0, 16), { intact: false, seal: null, entryHashes: hashes }).verdict).toBe("disagrees");
  });

  it("reads a typed seal whatever its spacing and case, and refuses what is not 16–64 hex digits", () => {
    expect(normalisePaperSeal("3F9A 07c1 5BE2 d468")).toBe("3f9a07c15be2d468");
    expect(normalisePaperSeal("3f9a07c1")).toBeNull();
    expect(normalisePaperSeal("zz".repeat(10))).toBeNull();
    expect(normalisePaperSeal("a".repeat(65))).toBeNull();
  });

  it("puts the seal's first 16 digits into the QR's URL, and a scan of it back into the verify path", () => {
    const url = verifyUrlWithSeal("https://shop.example/verify/AbCdEfGhIjKlMnOpQrStUvWxYz0", head);
    expect(url).toBe(`https://shop.example/verify/AbCdEfGhIjKlMnOpQrStUvWxYz0?seal=${head.slice(0, 16)}`);
    expect(sealFromScan(url)).toBe(head.slice(0, 16));
    expect(verifyPath("AbCdEfGhIjKlMnOpQrStUvWxYz0", sealFromScan(url))).toBe(`/verify/AbCdEfGhIjKlMnOpQrStUvWxYz0?seal=${head.slice(0, 16)}`);
    expect(verifyPath("AbCdEfGhIjKlMnOpQrStUvWxYz0", null)).toBe("/verify/AbCdEfGhIjKlMnOpQrStUvWxYz0");
  });
});
