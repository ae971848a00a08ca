// The rules the qualification and WPS forms and API share (lib/welding/qualification-schema.ts, lib/welding/wps-schema.ts).
import { describe, expect, it } from "vitest";
import { qualificationCreateSchema, qualificationPatchSchema, todayIso } from "@/lib/welding/qualification-schema";
import {
  applyPatch,
  contentIssues,
  EMPTY_CONTENT,
  publishIssues,
  referenceSchema,
  toWpsRanges,
  wpsPatchSchema,
  type WpsContent,
} from "@/lib/welding/wps-schema";
import { checkPassAgainstWps } from "@/lib/welding";

const good = {
  welderUserId: "u1",
  process: "GTAW",
  positions: ["2F", "1F", "2F"],
  thicknessMinMm: 1.5,
  thicknessMaxMm: 8,
  fillerFNumber: 6,
  testDate: "2025-01-10",
};

function fields(result: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) {
  return (result.error?.issues ?? []).map((i) => i.path.join("."));
}

describe("qualification input", () => {
  it("accepts a complete qualification and puts positions in code order without repeats", () => {
    const r = qualificationCreateSchema.parse(good);
    expect(r.positions).toEqual(["1F", "2F"]);
  });

  it("names each bad field: unknown process, no positions, min above max, F-No. out of range, no such date", () => {
    const r = qualificationCreateSchema.safeParse({ ...good, process: "OFW", positions: [], thicknessMinMm: 9, fillerFNumber: 0, testDate: "2025-02-30" });
    expect(fields(r)).toEqual(expect.arrayContaining(["process", "positions", "fillerFNumber", "testDate"]));
    const range = qualificationCreateSchema.safeParse({ ...good, thicknessMinMm: 9, diameterMinMm: 100, diameterMaxMm: 50 });
    expect(fields(range)).toEqual(expect.arrayContaining(["thicknessMinMm", "diameterMinMm"]));
  });

  it("refuses a test date or last use after today (UTC calendar day)", () => {
    const tomorrow = new Date(Date.now() + 86_400_000).toISOString().slice(0, 10);
    expect(fields(qualificationCreateSchema.safeParse({ ...good, testDate: tomorrow }))).toContain("testDate");
    expect(fields(qualificationCreateSchema.safeParse({ ...good, lastUsedOn: tomorrow }))).toContain("lastUsedOn");
    expect(qualificationCreateSchema.safeParse({ ...good, testDate: todayIso() }).success).toBe(true);
  });

  it("todayIso is the UTC date, whatever the clock's zone", () => {
    expect(todayIso(new Date("2025-07-10T23:30:00-05:00"))).toBe("2025-07-11");
    expect(todayIso(new Date("2025-07-11T00:30:00+10:00"))).toBe("2025-07-10");
  });

  it("a patch may not change the welder or the process, and must change something", () => {
    expect(fields(qualificationPatchSchema.safeParse({ process: "SMAW" }))).toContain("");
    expect(qualificationPatchSchema.safeParse({}).success).toBe(false);
    expect(qualificationPatchSchema.parse({ thicknessMaxMm: null })).toEqual({ thicknessMaxMm: null });
  });
});

const complete: WpsContent = {
  ...EMPTY_CONTENT,
  title: "GMAW fillets",
  process: "GMAW",
  iso4063: 135,
  baseMetals: "Carbon steel",
  thicknessMinMm: 3,
  thicknessMaxMm: 12,
  fillerClassification: "ER70S-6",
  fillerDiameterMm: 0.9,
  shieldingGas: "Ar/CO2 75/25",
  gasFlowLPerMin: 14,
  currentType: "DC",
  polarity: "EP",
  voltsMin: 17,
  voltsMax: 21,
  ampsMin: 110,
  ampsMax: 165,
  travelSpeedMinMmPerMin: 250,
  travelSpeedMaxMmPerMin: 450,
  heatInputMaxKJPerMm: 1.2,
  heatInputBasis: "arc-energy",
  preheatMinC: 10,
  interpassMaxC: 250,
  positions: ["1F", "2F"],
};

describe("WPS content rules", () => {
  it("a complete WPS has nothing missing", () => {
    expect(publishIssues(complete)).toEqual([]);
  });

  it("ranges the wrong way round, a number of another process, AC with a polarity and gas on SMAW are refused", () => {
    const paths = contentIssues({ ...complete, voltsMin: 25, ampsMax: 100, iso4063: 141, currentType: "AC", travelSpeedMinMmPerMin: 500 }).map((i) => i.path);
    expect(paths).toEqual(expect.arrayContaining(["voltsMin", "ampsMin", "travelSpeedMinMmPerMin", "iso4063", "polarity"]));
    expect(contentIssues({ ...complete, process: "SMAW", iso4063: 111 }).map((i) => i.path)).toContain("shieldingGas");
    expect(contentIssues({ ...complete, preheatMinC: 300 }).map((i) => i.path)).toContain("preheatMinC");
  });

  it("publishing needs every field a welder reads; GMAW and GTAW need their gas", () => {
    const paths = publishIssues({ ...EMPTY_CONTENT, title: "ab", process: "GTAW" }).map((i) => i.path);
    expect(paths).toEqual(
      expect.arrayContaining(["title", "iso4063", "baseMetals", "thicknessMinMm", "fillerClassification", "currentType", "voltsMin", "ampsMax", "preheatMinC", "positions", "shieldingGas", "gasFlowLPerMin"]),
    );
    expect(paths).not.toContain("interpassMaxC");
    expect(publishIssues({ ...complete, polarity: null }).map((i) => i.path)).toEqual(["polarity"]);
    expect(publishIssues({ ...complete, heatInputBasis: null }).map((i) => i.path)).toEqual(["heatInputBasis"]);
  });

  it("a patch changes only what it names; null clears a field", () => {
    const patch = wpsPatchSchema.parse({ ampsMax: 150, notes: null });
    const next = applyPatch({ ...complete, notes: "old" }, patch);
    expect(next.ampsMax).toBe(150);
    expect(next.notes).toBe("");
    expect(next.voltsMax).toBe(21);
    expect(wpsPatchSchema.safeParse({ ampsMax: 150, reference: "X" }).success).toBe(false);
    expect(wpsPatchSchema.safeParse({}).success).toBe(false);
  });

  it("references are upper-cased and kept to letters, digits, dots, dashes and slashes", () => {
    expect(referenceSchema.parse(" gx-wps-04 ")).toBe("GX-WPS-04");
    expect(referenceSchema.safeParse("has space").success).toBe(false);
  });

  it("the ranges handed to checkPassAgainstWps come from the revision (worked: 24 V, 180 A, 8 in/min = 32,400 J/in, REFERENCES.md Heat input)", () => {
    const ranges = toWpsRanges({ ...complete, voltsMax: 25, ampsMax: 200, heatInputMaxKJPerMm: 1.2 });
    expect(ranges).toMatchObject({ process: "GMAW", voltsMin: 17, voltsMax: 25, preheatMinC: 10, heatInputBasis: "arc-energy" });
    // 8 in/min = 203.2 mm/min; 24 × 180 × 60 / 203.2 / 1000 = 1.276 kJ/mm arc energy: above 1.2, and below the 250 mm/min minimum speed.
    const out = checkPassAgainstWps(ranges, { volts: 24, amps: 180, travelSpeedMmPerMin: 203.2, preheatC: 15 });
    expect(out.findings.find((f) => f.field === "heatInput")?.value).toBeCloseTo(1.276, 3);
    expect(out.outOfRange).toBe(true);
    expect(checkPassAgainstWps(ranges, { volts: 20, amps: 150, travelSpeedMmPerMin: 300, preheatC: 5 }).blocked).toBe(true);
    expect(toWpsRanges(EMPTY_CONTENT)).toEqual({});
  });
});
