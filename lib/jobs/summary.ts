// One line per step value, in the reader's units: lists, conflicts, sign-offs and the measurements tab.
import { checkDewPoint } from "@/lib/coating";
import type { Step } from "@/lib/procedures/schema";
import { measureVerdict, torqueVerdict } from "./tolerance";
import { defaultPadUnit, show, type PadQuantity } from "./units";
import type { CautionValue, CheckValue, CoatingValue, GeometryValue, MeasureValue, TorqueValue } from "./values";

export function valueSummary(spec: Step, value: Record<string, unknown> | null | undefined, system: "metric" | "imperial", passes = 0): string {
  const v = (value ?? {}) as Record<string, unknown>;
  switch (spec.kind) {
    case "check":
      return (v as CheckValue).confirmed ? "Confirmed" : "Not confirmed yet";
    case "caution": {
      const n = (v as CautionValue).acknowledged?.length ?? 0;
      return `${n} of ${spec.hazards.length} hazards acknowledged`;
    }
    case "measure": {
      const r = (v as MeasureValue).reading;
      if (typeof r !== "number") return "No reading yet";
      const q = spec.quantity as PadQuantity;
      const unit = defaultPadUnit(q, system);
      const verdict = measureVerdict(spec, r);
      return `${show(q, r, unit)} — ${verdict.ok ? "within tolerance" : `out of tolerance (${verdict.side === "low" ? "low" : "high"})`}`;
    }
    case "torque": {
      const t = (v as TorqueValue).achievedNm;
      if (typeof t !== "number") return "No torque yet";
      const unit = defaultPadUnit("torque", system);
      return `${show("torque", t, unit)} of ${show("torque", spec.torqueNm, unit)} ± ${spec.tolerancePct} % — ${torqueVerdict(spec, t).ok ? "within" : "out of tolerance"}`;
    }
    case "coating": {
      const c = v as CoatingValue;
      const parts: string[] = [];
      if (c.airTempC !== undefined && c.relativeHumidity !== undefined && c.surfaceTempC !== undefined) {
        const d = checkDewPoint({ airTempC: c.airTempC, relativeHumidity: c.relativeHumidity, surfaceTempC: c.surfaceTempC, requiredMarginC: spec.dewPointMarginC });
        parts.push(`surface ${d.marginC.toFixed(1)} °C above dew point${d.ok ? "" : " (too close)"}`);
      }
      const spots = (c.dftSpots ?? []).filter((s) => s.length);
      if (spots.length) {
        const all = spots.map((s) => s.reduce((a, b) => a + b, 0) / s.length);
        parts.push(`DFT ${show("thickness", all.reduce((a, b) => a + b, 0) / all.length, defaultPadUnit("thickness", system))} over ${spots.length} spots`);
      }
      return parts.join("; ") || "No readings yet";
    }
    case "geometry": {
      const g = v as GeometryValue;
      const one = (w: "before" | "after") => (g[w]?.results ? `${w}: worst ${g[w]!.results.worstHeave.wheelSteerDeg.toFixed(2)}°, links ${g[w]!.results.angleDifferenceDeg.toFixed(2)}° apart` : null);
      return [one("before"), one("after")].filter(Boolean).join("; ") || "Not captured yet";
    }
    case "weld":
      return `${passes} ${passes === 1 ? "pass" : "passes"} recorded`;
    case "photo":
    case "hold":
      return typeof v.note === "string" && v.note ? v.note : "";
  }
}

/** The first words of a nonconformance raised on an out-of-tolerance value. */
export function outOfToleranceText(spec: Step, value: Record<string, unknown> | null | undefined, system: "metric" | "imperial"): string {
  const v = (value ?? {}) as Record<string, unknown>;
  const say = (q: PadQuantity, reading: number, verdict: ReturnType<typeof measureVerdict>) => {
    const unit = defaultPadUnit(q, system);
    const limit = verdict.side === "low" ? verdict.bounds.low : verdict.bounds.high;
    if (verdict.ok || limit === null) return `${show(q, reading, unit)} recorded.`;
    return `${show(q, reading, unit)} is ${verdict.side === "low" ? "below the lower" : "above the upper"} limit of ${show(q, limit, unit)}.`;
  };
  if (spec.kind === "measure" && typeof (v as MeasureValue).reading === "number") {
    const r = (v as MeasureValue).reading!;
    return say(spec.quantity as PadQuantity, r, measureVerdict(spec, r));
  }
  if (spec.kind === "torque" && typeof (v as TorqueValue).achievedNm === "number") {
    const t = (v as TorqueValue).achievedNm!;
    return say("torque", t, torqueVerdict(spec, t));
  }
  return valueSummary(spec, value, system);
}
