// Visual acceptance of fillet welds.
// "aws-d1.1-static": AWS D1.1/D1.1M:2020 Table 8.1 (Table 6.1 in 2004–2015), statically loaded nontubular.
// "iso5817-B|C|D": ISO 5817:2014 quality levels; undercut (1.7, ref. 5011/5012) is judged numerically,
// the yes/no observations are judged conservatively (a "no" rejects) and say so.
// Limits in inches are converted exactly (1 in = 25.4 mm); the D1.1 metric brackets are soft conversions
// (1/32 in shown as [1 mm]) and would accept slightly more, so the inch values govern here.

import { MM_PER_IN, lte, round } from "./units";

export const VISUAL_CRITERIA = ["aws-d1.1-static", "iso5817-B", "iso5817-C", "iso5817-D"] as const;
export type VisualCriteria = (typeof VISUAL_CRITERIA)[number];

/** The criteria as people name them, for forms, mails, the record and the traveller. */
export const VISUAL_CRITERIA_LABELS: Record<VisualCriteria, string> = {
  "aws-d1.1-static": "AWS D1.1:2020 Table 8.1, statically loaded nontubular",
  "iso5817-B": "ISO 5817:2014 quality level B",
  "iso5817-C": "ISO 5817:2014 quality level C",
  "iso5817-D": "ISO 5817:2014 quality level D",
};
export const visualCriteriaLabel = (c: string): string => VISUAL_CRITERIA_LABELS[c as VisualCriteria] ?? c;
export type IsoLevel = "B" | "C" | "D";

export interface VisualObservations {
  cracks: boolean;
  fusionComplete: boolean;
  cratersFilled: boolean;
  profileAcceptable: boolean;
  specifiedLegMm: number;
  measuredLegMm: number;
  /** Length of weld that is under the specified size, mm. */
  undersizeLengthMm?: number;
  weldLengthMm: number;
  materialThicknessMm: number;
  undercutDepthMm: number;
  /** Accumulated length of the deeper undercut in any 300 mm (12 in) of weld. */
  undercutAccumulatedMm: number;
  /** Sum of visible pore diameters ≥ 0.8 mm (1/32 in) in any 25 mm (1 in) of weld. */
  porosityMm: number;
  /** Same sum in any 300 mm (12 in) of weld. */
  porosity12Mm: number;
  arcStrikes: boolean;
  spatterAcceptable: boolean;
}

export type VisualItem =
  | "cracks"
  | "fusion"
  | "craters"
  | "profile"
  | "undersize"
  | "undercut"
  | "porosity"
  | "arc-strikes"
  | "spatter";

export interface VisualItemResult {
  item: VisualItem;
  ok: boolean;
  /** Human-readable limit with units. */
  limit: string;
  /** Human-readable measurement. */
  measured: string;
  source: string;
}

export interface VisualVerdict {
  criteria: VisualCriteria;
  accepted: boolean;
  verdict: "accept" | "reject";
  items: VisualItemResult[];
  rejectedItems: VisualItem[];
  notes: string[];
}

const IN = MM_PER_IN;
const mm = (v: number): string => `${round(v, 2)} mm`;
const yes = (b: boolean): string => (b ? "yes" : "no");

// ---------------------------------------------------------------------------------------------------------
// AWS D1.1:2020 Table 8.1

const T81 = "AWS D1.1:2020 Table 8.1";

/**
 * Permitted underrun of a fillet below its specified leg L (Table 8.1): L ≤ 3/16 in: 1/16 in;
 * L = 1/4 in: 3/32 in; L ≥ 5/16 in: 1/8 in. The table names only those sizes; legs between them take the
 * smaller allowance, and a 6 mm leg counts as 1/4 in (the table's own metric bracket for it).
 */
export function awsUndersizeAllowanceMm(specifiedLegMm: number): number {
  if (specifiedLegMm >= (5 * IN) / 16 - 1e-9) return IN / 8;
  if (specifiedLegMm >= 6 - 1e-9) return (3 * IN) / 32;
  return IN / 16;
}

/** The part of the undersize allowance that carries a length limit: ≤ 10 % of the weld length. */
export const AWS_UNDERSIZE_LENGTH_FRACTION = 0.1;

function awsUndersize(o: VisualObservations): VisualItemResult {
  const allowance = awsUndersizeAllowanceMm(o.specifiedLegMm);
  const allowanceIn = allowance === IN / 8 ? "1/8 in" : allowance === IN / 16 ? "1/16 in" : "3/32 in";
  const under = o.specifiedLegMm - o.measuredLegMm;
  const limit =
    `leg may be up to ${allowanceIn} (${mm(allowance)}) under the specified ${mm(o.specifiedLegMm)} ` +
    `over no more than 10 % of the weld length (${mm(AWS_UNDERSIZE_LENGTH_FRACTION * o.weldLengthMm)})`;
  const base = { item: "undersize" as const, limit, source: `${T81}, undersize` };
  if (under <= 1e-9) return { ...base, ok: true, measured: `${mm(o.measuredLegMm)} leg, not undersize` };
  const measured =
    `${mm(o.measuredLegMm)} leg, ${mm(under)} under` +
    (o.undersizeLengthMm !== undefined ? ` over ${mm(o.undersizeLengthMm)}` : ", undersize length not recorded");
  if (!lte(under, allowance)) return { ...base, ok: false, measured };
  // Without the length the 10 % rule cannot be shown to hold, so the weld is not accepted.
  const ok =
    o.undersizeLengthMm !== undefined && lte(o.undersizeLengthMm, AWS_UNDERSIZE_LENGTH_FRACTION * o.weldLengthMm);
  return { ...base, ok, measured };
}

function awsUndercut(o: VisualObservations): VisualItemResult {
  const thick = o.materialThicknessMm >= IN - 1e-9;
  const d = o.undercutDepthMm;
  const measured = `${mm(d)} deep` + (d > IN / 32 ? `, ${mm(o.undercutAccumulatedMm)} accumulated in 300 mm` : "");
  const source = `${T81}, undercut`;
  if (thick) {
    return {
      item: "undercut", ok: lte(d, IN / 16), measured, source,
      limit: "material ≥ 1 in (25.4 mm): ≤ 1/16 in (1.59 mm) for any length",
    };
  }
  const limit =
    "material < 1 in (25.4 mm): ≤ 1/32 in (0.79 mm); up to 1/16 in (1.59 mm) for an accumulated " +
    "2 in (50.8 mm) in any 12 in (300 mm)";
  const ok = lte(d, IN / 32) || (lte(d, IN / 16) && lte(o.undercutAccumulatedMm, 2 * IN));
  return { item: "undercut", ok, limit, measured, source };
}

function awsPorosity(o: VisualObservations): VisualItemResult {
  return {
    item: "porosity",
    ok: lte(o.porosityMm, (3 * IN) / 8) && lte(o.porosity12Mm, (3 * IN) / 4),
    limit:
      "sum of visible pores ≥ 1/32 in (0.8 mm): ≤ 3/8 in (9.53 mm) in any 1 in (25 mm) and " +
      "≤ 3/4 in (19.05 mm) in any 12 in (300 mm)",
    measured: `${mm(o.porosityMm)} in 25 mm; ${mm(o.porosity12Mm)} in 300 mm`,
    // The porosity sums are from memory (REFERENCES.md "mem"); the screen names the table only.
    source: `${T81}, porosity (fillet and non-transverse groove welds)`,
  };
}

function judgeAws(o: VisualObservations): VisualItemResult[] {
  return [
    { item: "cracks", ok: !o.cracks, limit: "no cracks", measured: o.cracks ? "crack present" : "none", source: `${T81}, crack prohibition` },
    { item: "fusion", ok: o.fusionComplete, limit: "complete fusion between weld and base metal and between passes", measured: `complete: ${yes(o.fusionComplete)}`, source: `${T81}, weld/base-metal fusion` },
    { item: "craters", ok: o.cratersFilled, limit: "craters filled to the full cross section (intermittent fillet ends outside their effective length excepted)", measured: `filled: ${yes(o.cratersFilled)}`, source: `${T81}, crater cross section` },
    { item: "profile", ok: o.profileAcceptable, limit: "weld profile as the code's profile figures allow (judged by the inspector)", measured: `acceptable: ${yes(o.profileAcceptable)}`, source: `${T81}, weld profiles` },
    awsUndersize(o),
    awsUndercut(o),
    awsPorosity(o),
    { item: "arc-strikes", ok: !o.arcStrikes, limit: "arc strikes outside the weld ground smooth and checked for cracks before acceptance", measured: o.arcStrikes ? "present" : "none", source: "AWS D1.1:2020, arc strikes (workmanship)" },
    { item: "spatter", ok: o.spatterAcceptable, limit: "spatter removed as the contract or coating requires", measured: `acceptable: ${yes(o.spatterAcceptable)}`, source: "AWS D1.1:2020, weld cleaning (workmanship)" },
  ];
}

// ---------------------------------------------------------------------------------------------------------
// ISO 5817:2014

const ISO = "ISO 5817:2014";

/**
 * Permitted undercut depth h (ISO 5817:2014 item 1.7, from memory): t > 3 mm: D 0.2t max 1 mm, C 0.1t max
 * 0.5 mm, B 0.05t max 0.5 mm; 0.5 ≤ t ≤ 3 mm: D 0.2t, C 0.1t (short imperfections), B not permitted (0).
 * Throws below 0.5 mm, which ISO 5817 does not cover.
 */
export function isoUndercutLimitMm(level: IsoLevel, thicknessMm: number): number {
  if (!(thicknessMm >= 0.5)) throw new RangeError("ISO 5817 covers material thickness from 0.5 mm");
  if (thicknessMm <= 3) return level === "D" ? 0.2 * thicknessMm : level === "C" ? 0.1 * thicknessMm : 0;
  if (level === "D") return Math.min(0.2 * thicknessMm, 1);
  if (level === "C") return Math.min(0.1 * thicknessMm, 0.5);
  return Math.min(0.05 * thicknessMm, 0.5);
}

function isoUndercut(level: IsoLevel, o: VisualObservations): VisualItemResult {
  const t = o.materialThicknessMm;
  // Item and reference numbers (1.7, 5011/5012) and the limits are from memory: shown by name only.
  const source = `${ISO}, undercut (level ${level})`;
  const measured = `${mm(o.undercutDepthMm)} deep on t = ${mm(t)}`;
  if (!(t >= 0.5)) {
    return { item: "undercut", ok: false, limit: "ISO 5817 applies from t = 0.5 mm", measured, source };
  }
  const h = isoUndercutLimitMm(level, t);
  let limit: string;
  if (t <= 3) {
    limit = level === "B" ? "not permitted (t 0.5–3 mm)" : `h ≤ ${level === "D" ? "0.2" : "0.1"}t = ${mm(h)}, short imperfections only (t 0.5–3 mm)`;
  } else {
    const [f, cap] = level === "D" ? ["0.2", 1] : level === "C" ? ["0.1", 0.5] : ["0.05", 0.5];
    limit = `h ≤ ${f}t but ≤ ${cap} mm → ${mm(h)}; smooth transition required`;
  }
  return { item: "undercut", ok: lte(o.undercutDepthMm, h), limit, measured, source };
}

function judgeIso(level: IsoLevel, o: VisualObservations): VisualItemResult[] {
  const cons = "judged conservatively: ";
  return [
    { item: "cracks", ok: !o.cracks, limit: "cracks not permitted at any level", measured: o.cracks ? "crack present" : "none", source: `${ISO}, cracks` },
    { item: "fusion", ok: o.fusionComplete, limit: `${cons}lack of fusion rejects (level D admits short internal lack of fusion)`, measured: `complete: ${yes(o.fusionComplete)}`, source: `${ISO}, lack of fusion` },
    { item: "craters", ok: o.cratersFilled, limit: `${cons}an unfilled crater rejects (crater cracks never permitted; end crater pipes have depth limits at C and D)`, measured: `filled: ${yes(o.cratersFilled)}`, source: `${ISO}, crater cracks and end crater pipes` },
    { item: "profile", ok: o.profileAcceptable, limit: `excess weld metal, convexity and toe angle within level ${level}`, measured: `acceptable: ${yes(o.profileAcceptable)}`, source: `${ISO}, excess weld metal, convexity and weld toe (judged by the inspector)` },
    {
      item: "undersize", ok: o.measuredLegMm >= o.specifiedLegMm - 1e-9,
      limit: `${cons}no undersize accepted (the insufficient-throat allowance is not applied here${level === "B" ? "; not permitted at B" : ""})`,
      measured: `${mm(o.measuredLegMm)} leg for ${mm(o.specifiedLegMm)} specified`,
      source: `${ISO}, insufficient throat`,
    },
    isoUndercut(level, o),
    {
      item: "porosity", ok: o.porosityMm <= 0 && o.porosity12Mm <= 0,
      limit: `${cons}any recorded surface porosity rejects (surface pore limits are per pore diameter, not a sum${level === "B" ? "; not permitted at B" : ""})`,
      measured: `${mm(o.porosityMm)} in 25 mm; ${mm(o.porosity12Mm)} in 300 mm`,
      source: `${ISO}, surface pores`,
    },
    { item: "arc-strikes", ok: !o.arcStrikes, limit: level === "D" ? `${cons}a stray arc rejects unless shown not to affect the parent metal` : "stray arcs not permitted", measured: o.arcStrikes ? "present" : "none", source: `${ISO}, stray arcs` },
    { item: "spatter", ok: o.spatterAcceptable, limit: "spatter: acceptance depends on the application", measured: `acceptable: ${yes(o.spatterAcceptable)}`, source: `${ISO}, spatter` },
  ];
}

export function judgeVisual(criteria: VisualCriteria, observations: VisualObservations): VisualVerdict {
  const items =
    criteria === "aws-d1.1-static"
      ? judgeAws(observations)
      : judgeIso(criteria.slice(-1) as IsoLevel, observations);
  const rejectedItems = items.filter((i) => !i.ok).map((i) => i.item);
  const notes =
    criteria === "aws-d1.1-static"
      ? ["Inspect after the weld has cooled to ambient temperature (AWS D1.1:2020 Table 8.1)."]
      : ["Items other than undercut are yes/no observations here; measure them against ISO 5817 where a 'no' is borderline."];
  return {
    criteria,
    accepted: rejectedItems.length === 0,
    verdict: rejectedItems.length === 0 ? "accept" : "reject",
    items,
    rejectedItems,
    notes,
  };
}
