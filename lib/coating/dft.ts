/**
 * Dry film thickness per SSPC-PA 2 (2015, editorial revision 2018).
 *
 * gauge readings (≥ 3 in a 4 cm / 1.5 in circle) → spot average; 5 spots → area average.
 * Spot conforms when ≥ 80 % of the specified minimum and ≤ 120 % of the specified maximum;
 * area conforms when its average lies within the specified minimum–maximum.
 * Individual gauge readings are not judged on their own: only spot averages are.
 * Any consistent unit works (µm or mil): limits and readings just have to share it.
 */

export const MIN_READINGS_PER_SPOT = 3;
export const SPOTS_PER_AREA = 5;
export const SPOT_MIN_PCT = 80;
export const SPOT_MAX_PCT = 120;

// Readings averaged in floating point must not fail a spot that sits exactly on a limit.
const EPS = 1e-9;

export interface DftSpecification {
  specMin: number;
  specMax: number;
  /** Percent of specMin below which a spot fails; defaults to 80. */
  spotMinPct?: number;
  /** Percent of specMax above which a spot fails; defaults to 120. */
  spotMaxPct?: number;
}

export interface DftSpotLimits {
  min: number;
  max: number;
}

/** Spot limits; percentages are applied as ×pct/100 so 6 × 120 % gives 7.2, not 7.199999…. */
export function dftSpotLimits(spec: DftSpecification): DftSpotLimits {
  assertSpec(spec);
  const minPct = spec.spotMinPct ?? SPOT_MIN_PCT;
  const maxPct = spec.spotMaxPct ?? SPOT_MAX_PCT;
  return { min: (spec.specMin * minPct) / 100, max: (spec.specMax * maxPct) / 100 };
}

function assertSpec(spec: DftSpecification): void {
  const { specMin, specMax } = spec;
  if (!Number.isFinite(specMin) || !Number.isFinite(specMax) || specMin <= 0 || specMax < specMin) {
    throw new RangeError("specified DFT needs 0 < specMin ≤ specMax");
  }
  for (const pct of [spec.spotMinPct, spec.spotMaxPct]) {
    if (pct !== undefined && (!Number.isFinite(pct) || pct <= 0)) throw new RangeError("spot percentages must be > 0");
  }
}

export function average(values: readonly number[]): number {
  if (values.length === 0) throw new RangeError("cannot average an empty list");
  let sum = 0;
  for (const v of values) sum += v;
  return sum / values.length;
}

export interface DftSpotResult {
  /** 1-based spot number */
  spot: number;
  readings: number[];
  average: number;
  ok: boolean;
  reason?: "below-spot-minimum" | "above-spot-maximum";
}

export interface DftAreaResult {
  specMin: number;
  specMax: number;
  spotLimits: DftSpotLimits;
  spots: DftSpotResult[];
  areaAverage: number;
  /** area average within specMin–specMax */
  areaOk: boolean;
  /** every spot within the spot limits */
  spotsOk: boolean;
  /** areaOk && spotsOk */
  ok: boolean;
  warnings: string[];
}

/**
 * One measured area: `spots` is a list of spots, each a list of gauge readings.
 * Throws RangeError when a spot has fewer than 3 readings (PA 2 defines a spot as ≥ 3).
 */
export function evaluateDftArea(spec: DftSpecification, spots: readonly (readonly number[])[]): DftAreaResult {
  const limits = dftSpotLimits(spec);
  if (spots.length === 0) throw new RangeError("an area needs at least one spot");
  const spotResults: DftSpotResult[] = spots.map((readings, i) => {
    if (readings.length < MIN_READINGS_PER_SPOT) {
      throw new RangeError(`spot ${i + 1} has ${readings.length} readings; at least ${MIN_READINGS_PER_SPOT} are required`);
    }
    for (const r of readings) {
      if (!Number.isFinite(r) || r < 0) throw new RangeError(`spot ${i + 1} has an invalid reading`);
    }
    const avg = average(readings);
    const below = avg < limits.min - EPS;
    const above = avg > limits.max + EPS;
    const result: DftSpotResult = { spot: i + 1, readings: [...readings], average: avg, ok: !below && !above };
    if (below) result.reason = "below-spot-minimum";
    if (above) result.reason = "above-spot-maximum";
    return result;
  });
  const areaAverage = average(spotResults.map((s) => s.average));
  const areaOk = areaAverage >= spec.specMin - EPS && areaAverage <= spec.specMax + EPS;
  const spotsOk = spotResults.every((s) => s.ok);

  const warnings: string[] = [];
  if (spots.length !== SPOTS_PER_AREA) {
    warnings.push(`SSPC-PA 2 takes ${SPOTS_PER_AREA} spot measurements per area; ${spots.length} given.`);
  }
  for (const s of spotResults) {
    if (s.reason === "below-spot-minimum") warnings.push(`Spot ${s.spot} average is below ${limits.min}.`);
    if (s.reason === "above-spot-maximum") warnings.push(`Spot ${s.spot} average is above ${limits.max}.`);
  }
  if (!areaOk) warnings.push(`Area average is outside ${spec.specMin}–${spec.specMax}.`);

  return {
    specMin: spec.specMin,
    specMax: spec.specMax,
    spotLimits: limits,
    spots: spotResults,
    areaAverage,
    areaOk,
    spotsOk,
    ok: areaOk && spotsOk,
    warnings,
  };
}

export type AreaUnit = "m2" | "ft2";

/**
 * Number of 10 m² (100 ft²) areas to measure on a coated surface of the given size.
 * < 30 m²: every 10 m² (or part of one); 30–100 m²: 3; > 100 m²: 3 in the first 100 m² plus one
 * per further 100 m² or part of it. PA 2 states the thresholds in both systems as soft equivalents
 * (10 m² ≈ 100 ft²), so ft² input uses 100/300/1000 ft² rather than a converted value; that is
 * what makes the worked 12,500 ft² come out at 15 areas.
 */
export function dftAreasToMeasure(surfaceArea: number, unit: AreaUnit = "m2"): number {
  if (!Number.isFinite(surfaceArea) || surfaceArea <= 0) throw new RangeError("surface area must be > 0");
  const unitArea = unit === "m2" ? 10 : 100; // one measured area
  const small = 3 * unitArea; // 30 m² / 300 ft²
  const large = 10 * unitArea; // 100 m² / 1000 ft²
  if (surfaceArea < small) return Math.max(1, Math.ceil(surfaceArea / unitArea - EPS));
  if (surfaceArea <= large) return 3;
  return 3 + Math.ceil((surfaceArea - large) / large - EPS);
}
