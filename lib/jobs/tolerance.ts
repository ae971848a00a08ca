// Tolerance verdicts for measure and torque steps. Limits and readings are in the quantity's stored unit
// (lib/procedures MEASURE_QUANTITIES: mm, deg, °C, µm, N·m, kPa), so no conversion happens here.
import type { Step } from "@/lib/procedures/schema";

type MeasureSpec = Extract<Step, { kind: "measure" }>;
type TorqueSpec = Extract<Step, { kind: "torque" }>;

export type Bounds = { low: number | null; high: number | null };
export type Verdict = { ok: boolean; side: "in" | "low" | "high"; bounds: Bounds; deviation: number | null };

// A reading typed exactly at a limit (often after a unit conversion) is inside it, not a hair over.
const EPS = 1e-9;
const atLeast = (a: number, b: number) => a >= b - EPS * Math.max(1, Math.abs(b));
const atMost = (a: number, b: number) => a <= b + EPS * Math.max(1, Math.abs(b));

export function measureBounds(spec: Pick<MeasureSpec, "tolerance" | "nominal">): Bounds {
  const t = spec.tolerance;
  switch (t.type) {
    case "plusMinus": {
      const nominal = spec.nominal ?? 0;
      return { low: nominal - t.minus, high: nominal + t.plus };
    }
    case "range":
      return { low: t.min, high: t.max };
    case "min":
      return { low: t.min, high: null };
    case "max":
      return { low: null, high: t.max };
  }
}

export function judge(value: number, bounds: Bounds, nominal?: number): Verdict {
  if (!Number.isFinite(value)) throw new RangeError("a reading must be a finite number");
  const low = bounds.low !== null && !atLeast(value, bounds.low);
  const high = bounds.high !== null && !atMost(value, bounds.high);
  return {
    ok: !low && !high,
    side: low ? "low" : high ? "high" : "in",
    bounds,
    deviation: nominal === undefined ? null : value - nominal,
  };
}

export function measureVerdict(spec: Pick<MeasureSpec, "tolerance" | "nominal">, reading: number): Verdict {
  return judge(reading, measureBounds(spec), spec.nominal);
}

/** Specified torque ± tolerancePct (percent of the specified value). */
export function torqueBounds(spec: Pick<TorqueSpec, "torqueNm" | "tolerancePct">): Bounds {
  const delta = (spec.torqueNm * spec.tolerancePct) / 100;
  return { low: spec.torqueNm - delta, high: spec.torqueNm + delta };
}

export function torqueVerdict(spec: Pick<TorqueSpec, "torqueNm" | "tolerancePct">, achievedNm: number): Verdict {
  return judge(achievedNm, torqueBounds(spec), spec.torqueNm);
}
