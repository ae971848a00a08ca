// Fillet weld strength and size checks for brackets welded to housings and frames.
// Strength: AISC 360-16 J2.4 (Rn = Fnw·Awe, Fnw = 0.60 FEXX (1.0 + 0.50 sin^1.5 θ), φ = 0.75, Ω = 2.00).
// Throat: 0.707 × leg for an equal-leg fillet (AISC 360-16 J2.2a).
// Minimum size: AWS D1.1:2020 Table 7.7 (2015: Table 5.7), same values as AISC 360-16 Table J2.4.
// SI inside (mm, MPa, kN); units.ts converts for inch/kip display.

import { MM_PER_IN, gte, ksiToMPa, lte, round } from "./units";

export const ELECTRODE_CLASSES = ["E60", "E70", "E80", "E90", "E100", "E110"] as const;
export type ElectrodeClass = (typeof ELECTRODE_CLASSES)[number];

/** FEXX from the class number in ksi (E70 → 70 ksi → 482.6 MPa), converted exactly. */
export function electrodeStrengthMPa(cls: ElectrodeClass): number {
  return ksiToMPa(Number(cls.slice(1)));
}

export const THROAT_FACTOR = 0.707;
export const PHI_LRFD = 0.75;
export const OMEGA_ASD = 2.0;

export type DesignMethod = "LRFD" | "ASD";

export const filletThroatMm = (legMm: number): number => THROAT_FACTOR * legMm;

/**
 * Directional strength increase of AISC 360-16 J2.4(a): 1.0 + 0.50 sin^1.5 θ, θ = angle between the line of
 * action of the load and the weld axis (0° longitudinal, 90° transverse).
 */
export function directionalFactor(angleDeg: number): number {
  const s = Math.sin((angleDeg * Math.PI) / 180);
  return 1 + 0.5 * Math.abs(s) ** 1.5;
}

export interface FilletStrengthInput {
  legMm: number;
  electrodeMPa: number;
  method: DesignMethod;
  angleDeg?: number;
  directionalIncrease?: boolean;
}

/** Available strength per unit length, kN/mm (multiply by 25.4/4.448… for kip/in). */
export function filletStrengthPerMm(input: FilletStrengthInput): number {
  const angle = input.angleDeg ?? 0;
  const f = input.directionalIncrease === false ? 1 : directionalFactor(angle);
  const rnPerMm = (0.6 * input.electrodeMPa * f * filletThroatMm(input.legMm)) / 1000; // N/mm → kN/mm
  return input.method === "LRFD" ? PHI_LRFD * rnPerMm : rnPerMm / OMEGA_ASD;
}

// ---------------------------------------------------------------------------------------------------------
// Minimum fillet size

export type SizeSystem = "in" | "mm";

interface MinBand {
  /** Upper edge of base-metal thickness, inclusive. */
  throughMm: number;
  legMm: number;
  label: string;
}

// Inch table (pub): the governing text; leg sizes converted exactly.
const MIN_BANDS_IN: readonly MinBand[] = [
  { throughMm: 0.25 * MM_PER_IN, legMm: MM_PER_IN / 8, label: "1/8 in (3 mm)" },
  { throughMm: 0.5 * MM_PER_IN, legMm: (3 * MM_PER_IN) / 16, label: "3/16 in (5 mm)" },
  { throughMm: 0.75 * MM_PER_IN, legMm: MM_PER_IN / 4, label: "1/4 in (6 mm)" },
  { throughMm: Infinity, legMm: (5 * MM_PER_IN) / 16, label: "5/16 in (8 mm)" },
];

// Metric column of D1.1M: sizes 3/5/6/8 mm are in REFERENCES.md; the thickness edges 6/12/20 mm are
// from memory. Offered because a metric shop's nominal 6 mm fillet is 0.35 mm short of 1/4 in.
const MIN_BANDS_MM: readonly MinBand[] = [
  { throughMm: 6, legMm: 3, label: "3 mm" },
  { throughMm: 12, legMm: 5, label: "5 mm" },
  { throughMm: 20, legMm: 6, label: "6 mm" },
  { throughMm: Infinity, legMm: 8, label: "8 mm" },
];

export interface MinimumLegRequest {
  /** Base-metal thickness T used for the table (the thicker part, per REFERENCES.md), mm. */
  thicknessMm: number;
  /** The table minimum need not exceed the thinner part joined. */
  thinnerPartMm?: number;
  sizeSystem?: SizeSystem;
}

export interface MinimumLeg {
  minimumLegMm: number;
  tableLegMm: number;
  label: string;
  /** True when the thinner part, not the table, set the minimum. */
  limitedByThinnerPart: boolean;
  source: string;
}

export const MIN_FILLET_SOURCE = "AWS D1.1:2020 Table 7.7 (2015: Table 5.7); same values AISC 360-16 Table J2.4";

export function minimumFilletLeg(req: MinimumLegRequest): MinimumLeg {
  const bands = req.sizeSystem === "mm" ? MIN_BANDS_MM : MIN_BANDS_IN;
  // Slack so a thickness typed exactly at an edge (6.35 mm = 1/4 in) stays in the lower band.
  const band = bands.find((b) => req.thicknessMm <= b.throughMm + 1e-9) ?? bands[bands.length - 1]!;
  const capped = req.thinnerPartMm !== undefined && req.thinnerPartMm < band.legMm;
  return {
    minimumLegMm: capped ? req.thinnerPartMm! : band.legMm,
    tableLegMm: band.legMm,
    label: capped ? `${round(req.thinnerPartMm!, 2)} mm (thinner part)` : band.label,
    limitedByThinnerPart: capped,
    // The metric band edges are from memory (see MIN_BANDS_MM); the source line names the table only.
    source: req.sizeSystem === "mm" ? `${MIN_FILLET_SOURCE}, metric column` : MIN_FILLET_SOURCE,
  };
}

// ---------------------------------------------------------------------------------------------------------
// Bracket check

export interface FilletWeldRequest {
  legMm: number;
  /** Total effective length of the weld group, mm. */
  lengthMm: number;
  /** Give the class or FEXX in MPa, not both. */
  electrodeClass?: ElectrodeClass;
  electrodeMPa?: number;
  /** Load angle to the weld axis, degrees (0 longitudinal … 90 transverse); default 0. */
  angleDeg?: number;
  /** Apply the J2.4(a) directional increase; default true (it is 1.0 at 0°). */
  directionalIncrease?: boolean;
  method: DesignMethod;
  thinnerPartMm?: number;
  thickerPartMm?: number;
  sizeSystem?: SizeSystem;
  /** LRFD: factored load; ASD: service load, kN. */
  loadKN?: number;
}

export interface FilletWeldResult {
  throatMm: number;
  electrodeMPa: number;
  directionalFactor: number;
  fnwMPa: number;
  /** Rn = Fnw·Awe, kN. */
  nominalStrengthKN: number;
  /** φRn (LRFD) or Rn/Ω (ASD), kN. */
  designStrengthKN: number;
  method: DesignMethod;
  /** null when no part thickness was given. */
  minimumLegMm: number | null;
  legOk: boolean | null;
  /** load / design strength; only with a load. */
  utilisation?: number;
  /** utilisation ≤ 1 and the leg is not under the minimum; only with a load. */
  ok?: boolean;
  notes: string[];
}

export function filletWeld(req: FilletWeldRequest): FilletWeldResult {
  for (const [name, v] of [["legMm", req.legMm], ["lengthMm", req.lengthMm]] as const) {
    if (!Number.isFinite(v) || v <= 0) throw new RangeError(`${name} must be a positive finite number`);
  }
  if ((req.electrodeClass === undefined) === (req.electrodeMPa === undefined)) {
    throw new RangeError("give exactly one of electrodeClass or electrodeMPa");
  }
  const electrodeMPa = req.electrodeClass ? electrodeStrengthMPa(req.electrodeClass) : req.electrodeMPa!;
  const angle = req.angleDeg ?? 0;
  const dirFactor = req.directionalIncrease === false ? 1 : directionalFactor(angle);
  const throatMm = filletThroatMm(req.legMm);
  const fnwMPa = 0.6 * electrodeMPa * dirFactor;
  const nominalStrengthKN = (fnwMPa * throatMm * req.lengthMm) / 1000;
  const designStrengthKN = req.method === "LRFD" ? PHI_LRFD * nominalStrengthKN : nominalStrengthKN / OMEGA_ASD;
  const notes: string[] = [
    req.method === "LRFD"
      ? "LRFD: φ = 0.75 (AISC 360-16 J2.4); compare with the factored load."
      : "ASD: Ω = 2.00 (AISC 360-16 J2.4); compare with the service load.",
  ];

  if (dirFactor > 1) {
    notes.push(
      `Directional increase ×${round(dirFactor, 3)} (AISC 360-16 J2.4(a)) holds only for a linear weld group ` +
        "of uniform leg loaded through its centre of gravity; mixed longitudinal + transverse groups follow J2.4(c).",
    );
  }

  const thickness = req.thickerPartMm ?? req.thinnerPartMm;
  let minimumLegMm: number | null = null;
  let legOk: boolean | null = null;
  if (thickness !== undefined) {
    const min = minimumFilletLeg({
      thicknessMm: thickness,
      ...(req.thinnerPartMm !== undefined && { thinnerPartMm: req.thinnerPartMm }),
      ...(req.sizeSystem !== undefined && { sizeSystem: req.sizeSystem }),
    });
    minimumLegMm = min.minimumLegMm;
    legOk = gte(req.legMm, min.minimumLegMm);
    notes.push(
      `Minimum fillet ${min.label} for ${round(thickness, 2)} mm base metal (${min.source})` +
        (legOk ? "." : `: ${round(req.legMm, 2)} mm is undersize.`),
    );
    if (req.thickerPartMm === undefined) {
      notes.push("Only the thinner part was given; the minimum size was taken from it.");
    }
  } else {
    notes.push("No part thickness given: minimum fillet size not checked.");
  }

  // Length rules of AISC 360-16 J2.2b, from memory: flagged for the engineer, not applied.
  if (req.lengthMm < 4 * req.legMm) {
    notes.push("Weld shorter than 4 × its size: AISC 360-16 limits its effective size to 1/4 of its length; check with the engineer.");
  }
  if (req.lengthMm > 100 * req.legMm && angle === 0) {
    notes.push("End-loaded longitudinal weld longer than 100 × its size: AISC 360-16's length reduction may apply; check with the engineer.");
  }
  if (req.thinnerPartMm !== undefined && req.legMm > req.thinnerPartMm) {
    notes.push("Leg exceeds the thinner part: along an edge the maximum size is the part thickness (less 1/16 in from 1/4 in up, AISC 360-16).");
  }
  notes.push(
    "Base metal not checked here: the connected parts' shear yielding and rupture along the weld " +
      "(AISC 360-16 J4) can govern over the weld on thin brackets or tubes.",
  );

  const result: FilletWeldResult = {
    throatMm,
    electrodeMPa,
    directionalFactor: dirFactor,
    fnwMPa,
    nominalStrengthKN,
    designStrengthKN,
    method: req.method,
    minimumLegMm,
    legOk,
    notes,
  };
  if (req.loadKN !== undefined) {
    if (!Number.isFinite(req.loadKN) || req.loadKN < 0) throw new RangeError("loadKN must be a finite number ≥ 0");
    result.utilisation = req.loadKN / designStrengthKN;
    result.ok = lte(result.utilisation, 1) && legOk !== false;
  }
  return result;
}
