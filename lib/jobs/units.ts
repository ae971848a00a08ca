// Units the runner's number pad offers per quantity. Values are stored in lib/units' BASE_UNIT and shown
// in the unit each person prefers (membership.unit_system); the pad can switch unit per entry.
import { formatInUnit, fromSI, preferredUnit, toSI, type Quantity, type UnitOf, type UnitSystem, unitSymbol } from "@/lib/units";

export type PadQuantity = Exclude<Quantity, "force">;

export const PAD_UNITS: { [Q in PadQuantity]: readonly UnitOf<Q>[] } = {
  length: ["mm", "in"],
  angle: ["deg"],
  temperature: ["degC", "degF"],
  thickness: ["um", "mil"],
  torque: ["N_m", "lbf_ft"],
  pressure: ["kPa", "psi"],
  speed: ["mm_min", "in_min"],
};

export function padUnits<Q extends PadQuantity>(quantity: Q): readonly UnitOf<Q>[] {
  return PAD_UNITS[quantity] as readonly UnitOf<Q>[];
}

export function defaultPadUnit<Q extends PadQuantity>(quantity: Q, system: UnitSystem): UnitOf<Q> {
  const preferred = preferredUnit(quantity, system);
  const offered = padUnits(quantity);
  return (offered as readonly string[]).includes(preferred) ? preferred : (offered[0] as UnitOf<Q>);
}

export function isPadUnit(quantity: PadQuantity, unit: unknown): boolean {
  return typeof unit === "string" && (PAD_UNITS[quantity] as readonly string[]).includes(unit);
}

export function symbolOf(quantity: PadQuantity, unit: string): string {
  return unitSymbol(quantity, unit as UnitOf<typeof quantity>);
}

/**
 * What a person typed on the pad: digits, one decimal point or comma, an optional leading minus.
 * Null for anything else (an empty field, "-", "1.2.3"), so a half-typed entry never becomes a value.
 */
export function readPadNumber(text: string): number | null {
  const t = text.trim().replace(",", ".");
  if (!/^-?(\d+\.?\d*|\.\d+)$/.test(t)) return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}

/** Typed value in `unit` → stored value (SI base unit of the quantity). */
export function toStored(quantity: PadQuantity, value: number, unit: string): number {
  return toSI(quantity, value, unit as UnitOf<typeof quantity>);
}

/** Stored value → the value in `unit`, for putting a saved value back on the pad. */
export function fromStored(quantity: PadQuantity, valueSI: number, unit: string): number {
  return fromSI(quantity, valueSI, unit as UnitOf<typeof quantity>);
}

/** A stored value for the pad's display: rounded to the unit's usual resolution, no trailing noise. */
export function padText(quantity: PadQuantity, valueSI: number, unit: string, digits = 4): string {
  const v = fromStored(quantity, valueSI, unit);
  if (!Number.isFinite(v)) return "";
  return String(Number(v.toFixed(digits)));
}

export function show(quantity: PadQuantity, valueSI: number, unit: string, digits?: number): string {
  return formatInUnit(quantity, valueSI, unit as UnitOf<typeof quantity>, digits === undefined ? {} : { digits });
}

export type PadKey = "0" | "1" | "2" | "3" | "4" | "5" | "6" | "7" | "8" | "9" | "." | "±" | "⌫" | "clear";

/** Applies one key of the runner's number pad to the typed text; keeps it a number being typed ("-", "12.", "0.5"). */
export function applyKey(text: string, key: PadKey, opts: { decimals?: boolean; negative?: boolean; maxLength?: number } = {}): string {
  const max = opts.maxLength ?? 12;
  switch (key) {
    case "⌫":
      return text.slice(0, -1);
    case "clear":
      return "";
    case "±":
      if (!opts.negative) return text;
      return text.startsWith("-") ? text.slice(1) : `-${text}`;
    case ".":
      if (opts.decimals === false || text.includes(".")) return text;
      return text.replace(/^-?$/, (m) => `${m}0`) + ".";
    default:
      if (text.replace("-", "").length >= max) return text;
      if (text === "0") return key;
      if (text === "-0") return `-${key}`;
      return text + key;
  }
}

