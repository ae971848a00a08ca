import { BASE_UNIT, formatInUnit, formatQuantity, type UnitSystem } from "@/lib/units";
import type { MeasureQuantity, Step } from "@/lib/procedures/schema";
import { TORQUE_TO_NM } from "@/lib/procedures/forms";

export function fmtDate(d: Date | string | null | undefined): string {
  if (!d) return "—";
  const date = typeof d === "string" ? new Date(d) : d;
  return `${date.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

export function shortHash(hash: string | null | undefined): string {
  return hash ? `${hash.slice(0, 12)}…` : "—";
}

// Stored values are SI; a person who reads imperial also sees the converted value.
export function fmtValue(q: MeasureQuantity, value: number, system: UnitSystem): string {
  const si = formatInUnit(q, value, BASE_UNIT[q]);
  if (system === "metric" || q === "angle") return si;
  return `${si} (${formatQuantity(q, value, "imperial")})`;
}

// A tolerance band is a difference: a temperature difference converts without the 32 °F offset.
export function fmtDelta(q: MeasureQuantity, value: number, system: UnitSystem): string {
  if (q !== "temperature") return fmtValue(q, value, system);
  const c = `${value.toFixed(1)} °C`;
  return system === "metric" ? c : `${c} (${(value * 1.8).toFixed(0)} °F)`;
}

export function describeTolerance(step: Extract<Step, { kind: "measure" }>, system: UnitSystem): string {
  const t = step.tolerance;
  const q = step.quantity;
  switch (t.type) {
    case "plusMinus":
      return t.plus === t.minus
        ? `${fmtValue(q, step.nominal ?? 0, system)} ± ${fmtDelta(q, t.plus, system)}`
        : `${fmtValue(q, step.nominal ?? 0, system)} +${fmtDelta(q, t.plus, system)} / −${fmtDelta(q, t.minus, system)}`;
    case "range":
      return `${fmtValue(q, t.min, system)} to ${fmtValue(q, t.max, system)}`;
    case "min":
      return `at least ${fmtValue(q, t.min, system)}`;
    case "max":
      return `at most ${fmtValue(q, t.max, system)}`;
  }
}

export function describeTorque(step: Extract<Step, { kind: "torque" }>): string {
  const nm = `${step.torqueNm.toFixed(1)} N·m`;
  if (step.torqueUnit === "lbf_ft") return `${(step.torqueNm / TORQUE_TO_NM.lbf_ft).toFixed(1)} lbf·ft (${nm})`;
  return `${nm} (${(step.torqueNm / TORQUE_TO_NM.lbf_ft).toFixed(1)} lbf·ft)`;
}
