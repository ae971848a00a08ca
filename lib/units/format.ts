/** Display of stored values in a person's preferred unit system. */
import { type Quantity, type UnitOf, type UnitSystem, fromSI, preferredUnit, unitSymbol } from "./quantities";

// Decimals that match the resolution a shop gauge or drawing gives in each unit.
const DEFAULT_DIGITS: Record<string, number> = {
  "length:mm": 1,
  "length:cm": 2,
  "length:m": 3,
  "length:in": 3,
  "length:ft": 2,
  "angle:deg": 1,
  "angle:rad": 3,
  "temperature:degC": 1,
  "temperature:degF": 0,
  "temperature:K": 1,
  "thickness:um": 0,
  "thickness:mm": 3,
  "thickness:mil": 1,
  "torque:N_m": 1,
  "torque:lbf_ft": 1,
  "torque:lbf_in": 0,
  "pressure:kPa": 0,
  "pressure:MPa": 2,
  "pressure:bar": 2,
  "pressure:psi": 1,
  "speed:mm_min": 0,
  "speed:mm_s": 1,
  "speed:in_min": 1,
  "force:N": 0,
  "force:kN": 2,
  "force:lbf": 0,
  "force:kip": 2,
};

export interface FormatOptions {
  /** decimals; defaults per unit */
  digits?: number;
}

export function defaultDigits<Q extends Quantity>(quantity: Q, unit: UnitOf<Q>): number {
  return DEFAULT_DIGITS[`${quantity}:${unit}`] ?? 2;
}

/** "135.6 N·m", "12.5°" — SP 811 puts a space before unit symbols except the degree of angle. */
export function formatInUnit<Q extends Quantity>(
  quantity: Q,
  valueSI: number,
  unit: UnitOf<Q>,
  options: FormatOptions = {},
): string {
  const digits = clampDigits(options.digits ?? defaultDigits(quantity, unit));
  const value = fromSI(quantity, valueSI, unit);
  if (!Number.isFinite(value)) return "—";
  let text = value.toFixed(digits);
  // "-0.0" reads as a sign error on a printed traveller.
  if (/^-0(?:\.0*)?$/.test(text)) text = text.slice(1);
  const symbol = unitSymbol(quantity, unit);
  return symbol === "°" ? `${text}°` : `${text} ${symbol}`;
}

export function formatQuantity<Q extends Quantity>(
  quantity: Q,
  valueSI: number,
  system: UnitSystem,
  options: FormatOptions = {},
): string {
  return formatInUnit(quantity, valueSI, preferredUnit(quantity, system), options);
}

function clampDigits(d: number): number {
  return Number.isFinite(d) ? Math.min(10, Math.max(0, Math.trunc(d))) : 2;
}
