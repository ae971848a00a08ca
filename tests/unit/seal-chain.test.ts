import { describe, expect, it } from "vitest";

import {
  type ChainRow,
  GENESIS_HASH,
  buildChain,
  buildChainRows,
  chainHash,
  chainPreimage,
  sha256Hex,
  verifyChain,
  verifyChainWith,
} from "@/lib/seal";

// The chain makes 21 CFR 11.10(e) "changes never obscure earlier entries" and ISO 9001:2015 7.5.3
// "protection from alteration" checkable (REFERENCES.md, Electronic records): any edit, deletion or
// reordering changes a recomputed hash.

const entries = [
  { kind: "step", step: "fit-up", by: "W-014", at: "2025-03-03T08:10:00Z" },
  { kind: "weld", process: "GMAW", wps: "WPS-7", heatInputKJmm: 1.02 },
  { kind: "inspection", result: "accept", undercutMm: 0.5 },
  { kind: "coating", dewPointC: 9.26, marginC: 5.74 },
  { kind: "torque", fastener: "M12", torqueNm: 96 },
];

function chain(): ChainRow[] {
  return buildChainRows(entries);
}

describe("hash definition", () => {
  it("genesis is 64 zeros", () => {
    expect(GENESIS_HASH).toBe("0000000000000000000000000000000000000000000000000000000000000000");
  });

  it("entry hash = SHA-256 hex of (previous hash hex ‖ canonical JSON)", () => {
    // Expected digest computed independently: printf '%s' "$(printf '0%.0s' {1..64}){\"a\":1}" | sha256sum
    expect(chainHash(GENESIS_HASH, { a: 1 })).toBe("fc6cee09194dd2578bd7664604fcb72a539066fd34544cea0009c43eb6cdc289");
    expect(chainPreimage(GENESIS_HASH, { b: 2, a: 1 })).toBe(`${GENESIS_HASH}{"a":1,"b":2}`);
  });

  it("each hash chains to the one before", () => {
    const hashes = buildChain(entries);
    expect(hashes).toHaveLength(5);
    expect(hashes[0]).toBe(chainHash(GENESIS_HASH, entries[0]));
    expect(hashes[3]).toBe(sha256Hex(`${hashes[2]}${JSON.stringify({ dewPointC: 9.26, kind: "coating", marginC: 5.74 })}`));
    expect(new Set(hashes).size).toBe(5);
  });

  it("refuses a malformed previous hash", () => {
    expect(() => chainHash("abc", {})).toThrow(TypeError);
    expect(() => chainHash(GENESIS_HASH.toUpperCase().replace(/0/g, "A"), {})).toThrow(TypeError);
  });
});

describe("verifyChain", () => {
  it("a chain of 5 entries verifies, and its seal is the head hash", () => {
    const rows = chain();
    expect(verifyChain(rows)).toEqual({ intact: true, entries: 5, seal: rows[4]?.hash });
    expect(verifyChain(rows, { expectedSeal: rows[4]?.hash, expectedEntries: 5 }).intact).toBe(true);
  });

  it("an empty chain is intact with no seal", () => {
    expect(verifyChain([])).toEqual({ intact: true, entries: 0, seal: null });
  });

  it("changing a field in entry 3 is reported at seq 3", () => {
    const rows = chain();
    rows[2] = { ...rows[2]!, entry: { ...entries[2], result: "reject" } };
    const r = verifyChain(rows);
    expect(r.intact).toBe(false);
    expect(r.firstBrokenSeq).toBe(3);
    expect(r.seal).toBeNull();
    expect(r.reason).toMatch(/hash/);
  });

  it("a changed number (0.5 → 0.50 is the same JSON number, 0.5 → 0.6 is not)", () => {
    const same = chain();
    same[2] = { ...same[2]!, entry: JSON.parse('{"kind":"inspection","result":"accept","undercutMm":0.50}') };
    expect(verifyChain(same).intact).toBe(true);
    const changed = chain();
    changed[2] = { ...changed[2]!, entry: { ...entries[2], undercutMm: 0.6 } };
    expect(verifyChain(changed).firstBrokenSeq).toBe(3);
  });

  it("changing entry 3 and recomputing its hash is caught at seq 4 (its prevHash no longer matches)", () => {
    const rows = chain();
    const forged = { ...entries[2], result: "reject" };
    rows[2] = { ...rows[2]!, entry: forged, hash: chainHash(rows[1]!.hash, forged) };
    expect(verifyChain(rows)).toMatchObject({ intact: false, firstBrokenSeq: 4 });
  });

  it("deleting entry 2 is reported (at seq 3, the first row that no longer fits)", () => {
    const rows = chain().filter((r) => r.seq !== 2);
    const r = verifyChain(rows);
    expect(r.intact).toBe(false);
    expect(r.firstBrokenSeq).toBe(3);
    expect(r.reason).toMatch(/expected seq 2/);
  });

  it("deleting entry 2 and renumbering the rest is still reported (prevHash mismatch at seq 2)", () => {
    const rows = chain()
      .filter((r) => r.seq !== 2)
      .map((r, i) => ({ ...r, seq: i + 1 }));
    expect(verifyChain(rows)).toMatchObject({ intact: false, firstBrokenSeq: 2 });
  });

  it("reordering rows is reported", () => {
    const rows = chain();
    const swapped = [rows[0]!, rows[2]!, rows[1]!, rows[3]!, rows[4]!];
    expect(verifyChain(swapped)).toMatchObject({ intact: false, firstBrokenSeq: 3 });
  });

  it("swapping the entries of seq 2 and 3 (seq numbers left in place) is reported at seq 2", () => {
    const rows = chain();
    const [r2, r3] = [rows[1]!, rows[2]!];
    rows[1] = { ...r3, seq: 2 };
    rows[2] = { ...r2, seq: 3 };
    expect(verifyChain(rows)).toMatchObject({ intact: false, firstBrokenSeq: 2 });
  });

  it("a tampered stored prevHash is reported", () => {
    const rows = chain();
    rows[3] = { ...rows[3]!, prevHash: GENESIS_HASH };
    expect(verifyChain(rows)).toMatchObject({ intact: false, firstBrokenSeq: 4, reason: expect.stringMatching(/previous hash/) });
  });

  it("a rebuilt chain or a cut-off tail is caught only against the printed seal", () => {
    const original = chain();
    const seal = original[4]!.hash;
    // Rebuild everything from a changed entry 3: internally consistent, but the head differs.
    const rebuilt = buildChainRows([entries[0], entries[1], { ...entries[2], result: "reject" }, entries[3], entries[4]]);
    expect(verifyChain(rebuilt).intact).toBe(true);
    expect(verifyChain(rebuilt, { expectedSeal: seal })).toMatchObject({ intact: false, reason: expect.stringMatching(/seal/) });
    // Drop the last entry.
    const cut = original.slice(0, 4);
    expect(verifyChain(cut).intact).toBe(true);
    expect(verifyChain(cut, { expectedSeal: seal }).intact).toBe(false);
    expect(verifyChain(cut, { expectedEntries: 5 }).intact).toBe(false);
  });

  it("an entry that cannot be canonicalised is reported, not thrown", () => {
    const rows = chain();
    rows[1] = { ...rows[1]!, entry: { bad: Number.NaN } };
    expect(verifyChain(rows)).toMatchObject({ intact: false, firstBrokenSeq: 2 });
  });

  it("the pure verifier takes any SHA-256: the same result with an injected hash function", () => {
    expect(verifyChainWith(sha256Hex, chain())).toEqual(verifyChain(chain()));
    // A different function (a wrong digest) must not verify the same rows.
    expect(verifyChainWith((t) => sha256Hex(`x${t}`), chain()).intact).toBe(false);
  });
});
