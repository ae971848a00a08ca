// How WPS and qualification figures read on screen. Stored in SI; an imperial reader also sees their units.
import { formatQuantity, type UnitSystem } from "@/lib/units";

type Q = "length" | "temperature" | "speed";

const SI_DIGITS: Record<Q, number> = { length: 1, temperature: 0, speed: 0 };

function trim(n: number, digits: number): string {
  return Number(n.toFixed(digits)).toString();
}

const SI_SYMBOL: Record<Q, string> = { length: "mm", temperature: "°C", speed: "mm/min" };

/** "12 mm", or "12 mm (0.472 in)" for an imperial reader. */
export function measure(q: Q, value: number | null | undefined, system: UnitSystem): string {
  if (value === null || value === undefined) return "—";
  const si = `${trim(value, SI_DIGITS[q] + 1)} ${SI_SYMBOL[q]}`;
  return system === "imperial" ? `${si} (${formatQuantity(q, value, "imperial")})` : si;
}

/** "17–21 V", "at least 17 V", "at most 21 V" or "—". */
export function span(min: number | null | undefined, max: number | null | undefined, unit: string): string {
  const f = (n: number) => `${trim(n, 2)}`;
  if (min != null && max != null) return `${f(min)}–${f(max)} ${unit}`;
  if (min != null) return `at least ${f(min)} ${unit}`;
  if (max != null) return `at most ${f(max)} ${unit}`;
  return "—";
}

/** A range of a measured quantity, with the imperial equivalent for an imperial reader. */
export function measureSpan(q: Q, min: number | null | undefined, max: number | null | undefined, system: UnitSystem, openMax = "—"): string {
  if (min == null && max == null) return "—";
  const lo = min != null ? measure(q, min, system) : "—";
  const hi = max != null ? measure(q, max, system) : openMax;
  return `${lo} to ${hi}`;
}

export function day(d: Date | string | null | undefined): string {
  if (!d) return "—";
  return typeof d === "string" ? d.slice(0, 10) : d.toISOString().slice(0, 10);
}
