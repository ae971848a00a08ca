import { GeometryError } from "./errors";

/** Bounds shared by the zod schema and the library's own guards, so both agree on what is too much. */
export const LIMITS = {
  /** Any coordinate, mm: 10 m is far beyond any vehicle and keeps squares well inside double precision. */
  coordMm: 10_000,
  travelMm: 2_000,
  armMm: 2_000,
  ratio: 100,
  rollDeg: 45,
  /** 10,001 = ±5,000 steps around ride height. */
  maxSweepPoints: 10_001,
  maxHoles: 500,
  labelChars: 60,
} as const;

/** Relative tolerance so that a grid value within rounding of an end point is not emitted twice. */
const GRID_TOL = 1e-9;

/**
 * Points of a sweep from lo to hi: lo, every multiple of step strictly inside (so ride height 0 is on
 * the grid whenever lo ≤ 0 ≤ hi), then hi. Multiples are k·step, never accumulated, so no drift.
 */
export function sweepCount(lo: number, hi: number, step: number): number {
  if (!(step > 0) || !Number.isFinite(step)) return Number.POSITIVE_INFINITY;
  if (!(hi >= lo)) return 0;
  const tol = step * GRID_TOL;
  if (hi - lo <= tol) return 1;
  const kMin = Math.floor((lo + tol) / step) + 1;
  const kMax = Math.ceil((hi - tol) / step) - 1;
  return 2 + Math.max(0, kMax - kMin + 1);
}

export function sweepValues(lo: number, hi: number, step: number, what: string): Float64Array {
  if (!(step > 0) || !Number.isFinite(step)) {
    throw new GeometryError("bad_step", `${what}: step must be greater than 0`);
  }
  if (!(hi >= lo)) throw new GeometryError("bad_range", `${what}: the range is empty`);
  const n = sweepCount(lo, hi, step);
  if (n > LIMITS.maxSweepPoints) {
    throw new GeometryError(
      "too_many_points",
      `${what}: ${n} points is more than ${LIMITS.maxSweepPoints}; use a larger step`,
    );
  }
  const out = new Float64Array(n);
  // A range narrower than rounding collapses to ride height when it spans it (keeps ±roll symmetric).
  if (n === 1) {
    out[0] = lo <= 0 && hi >= 0 ? 0 : lo;
    return out;
  }
  out[0] = lo;
  const tol = step * GRID_TOL;
  const kMin = Math.floor((lo + tol) / step) + 1;
  for (let i = 1; i < n - 1; i++) out[i] = (kMin + i - 1) * step;
  out[n - 1] = hi;
  return out;
}

/** Holes zMin, zMin + pitch, … ≤ zMax (a hole within rounding of zMax counts). */
export function holeRangeCount(zMin: number, zMax: number, pitch: number): number {
  if (!(pitch > 0) || !(zMax >= zMin)) return 0;
  return Math.floor((zMax - zMin) / pitch + 1e-9) + 1;
}
