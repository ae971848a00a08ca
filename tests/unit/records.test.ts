import { describe, expect, it } from "vitest";
import { recordEntryFor } from "@/lib/records/entry";
import { tokenFromScan } from "@/lib/records/token";
import { chainHash, GENESIS_HASH, verifyChain } from "@/lib/seal";

const signOff = (n: number) => ({
  id: `s${n}`,
  jobId: "j1",
  stepId: `st${n}`,
  nonconformanceId: null,
  userId: "u1",
  printedName: "Mick Tamsin",
  role: "welder",
  meaning: "performed",
  signedAt: new Date(Date.UTC(2026, 10, 3, 9, n)),
  contentHash: "a".repeat(64),
  amendsSignOffId: null,
  reason: null,
});

describe("record entries", () => {
  it("carry printed name, role, meaning and time of the sign-off (21 CFR 11.50 manifestation of a signature)", () => {
    const e = recordEntryFor(signOff(1));
    expect(e).toMatchObject({ signer: { printedName: "Mick Tamsin", role: "welder" }, meaning: "performed", signedAt: "2026-11-03T09:01:00.000Z" });
  });

  it("a changed printed name breaks the chain at that entry", () => {
    const rows: { seq: number; prevHash: string; hash: string; entry: unknown }[] = [];
    let prev = GENESIS_HASH;
    for (let n = 1; n <= 4; n++) {
      const entry = recordEntryFor(signOff(n));
      const hash = chainHash(prev, entry);
      rows.push({ seq: n, prevHash: prev, hash, entry });
      prev = hash;
    }
    expect(verifyChain(rows).intact).toBe(true);
    rows[2] = { ...rows[2]!, entry: recordEntryFor({ ...signOff(3), printedName: "Someone Else" }) };
    expect(verifyChain(rows)).toMatchObject({ intact: false, firstBrokenSeq: 3 });
  });
});

describe("scanned or typed codes", () => {
  const token = "AbCdEfGhIjKlMnOpQrStUvWxYz0";
  it("accept the traveller's URL, a bare token, and a token typed with spaces", () => {
    expect(tokenFromScan(`https://shop.example/verify/${token}`)).toBe(token);
    expect(tokenFromScan(`http://127.0.0.1:3000/verify/${token}?x=1`)).toBe(token);
    expect(tokenFromScan(`  ${token.slice(0, 9)} ${token.slice(9)} `)).toBe(token);
  });
  it("refuse anything else", () => {
    expect(tokenFromScan("https://elsewhere.example/product/123")).toBeNull();
    expect(tokenFromScan("short")).toBeNull();
    expect(tokenFromScan("<script>alert(1)</script>")).toBeNull();
  });
});
