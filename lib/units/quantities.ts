/**
 * Quantities, their units and conversion to the stored ("SI") unit.
 *
 * Values are stored in one unit per quantity: an SI unit or a decimal multiple of one, chosen to be
 * what a shop reads off a metric drawing or gauge (mm rather than m, µm for coatings, kPa for
 * pressure, °C rather than K, and the degree, which SP 811 accepts for use with the SI).
 */
import {
  DEG_PER_RAD,
  F_AT_0C,
  F_PER_C,
  KN_PER_KIP,
  KPA_PER_BAR,
  KPA_PER_PSI,
  K_AT_0C,
  MM_PER_FT,
  MM_PER_IN,
  NM_PER_LBF_FT,
  NM_PER_LBF_IN,
  N_PER_LBF,
  UM_PER_MIL,
} from "./factors";

export type UnitSystem = "metric" | "imperial";

export const QUANTITIES = ["length", "angle", "temperature", "thickness", "torque", "pressure", "speed", "force"] as const;
export type Quantity = (typeof QUANTITIES)[number];

export interface UnitDef {
  /** printed symbol, SP 811 style */
  symbol: string;
  toBase(value: number): number;
  fromBase(valueSI: number): number;
}

// Multiply/divide by one factor so a round trip costs at most a couple of ulps.
const linear = (symbol: string, factor: number): UnitDef => ({
  symbol,
  toBase: (v) => v * factor,
  fromBase: (b) => b / factor,
});

export const UNITS = {
  length: {
    mm: linear("mm", 1),
    cm: linear("cm", 10),
    m: linear("m", 1000),
    in: linear("in", MM_PER_IN),
    ft: linear("ft", MM_PER_FT),
  },
  angle: {
    deg: linear("°", 1),
    rad: linear("rad", DEG_PER_RAD),
  },
  temperature: {
    degC: linear("°C", 1),
    degF: { symbol: "°F", toBase: (f) => (f - F_AT_0C) / F_PER_C, fromBase: (c) => c * F_PER_C + F_AT_0C },
    K: { symbol: "K", toBase: (k) => k - K_AT_0C, fromBase: (c) => c + K_AT_0C },
  },
  thickness: {
    um: linear("µm", 1),
    mm: linear("mm", 1000),
    mil: linear("mil", UM_PER_MIL),
  },
  torque: {
    N_m: linear("N·m", 1),
    lbf_ft: linear("lbf·ft", NM_PER_LBF_FT),
    lbf_in: linear("lbf·in", NM_PER_LBF_IN),
  },
  pressure: {
    kPa: linear("kPa", 1),
    MPa: linear("MPa", 1000),
    bar: linear("bar", KPA_PER_BAR),
    psi: linear("psi", KPA_PER_PSI),
  },
  speed: {
    mm_min: linear("mm/min", 1),
    mm_s: linear("mm/s", 60),
    in_min: linear("in/min", MM_PER_IN),
  },
  force: {
    N: linear("N", 0.001),
    kN: linear("kN", 1),
    lbf: linear("lbf", N_PER_LBF / 1000),
    kip: linear("kip", KN_PER_KIP),
  },
} as const satisfies Record<Quantity, Record<string, UnitDef>>;

// Distributive, so UnitOf<"length" | "torque"> is the union of both unit sets rather than never.
export type UnitOf<Q extends Quantity> = Q extends Quantity ? keyof (typeof UNITS)[Q] & string : never;
export type AnyUnit = { [Q in Quantity]: UnitOf<Q> }[Quantity];

/** The unit values are stored in, per quantity. */
export const BASE_UNIT = {
  length: "mm",
  angle: "deg",
  temperature: "degC",
  thickness: "um",
  torque: "N_m",
  pressure: "kPa",
  speed: "mm_min",
  force: "kN",
} as const satisfies { [Q in Quantity]: UnitOf<Q> };

const PREFERRED = {
  metric: {
    length: "mm",
    angle: "deg",
    temperature: "degC",
    thickness: "um",
    torque: "N_m",
    pressure: "kPa",
    speed: "mm_min",
    force: "kN",
  },
  imperial: {
    length: "in",
    angle: "deg",
    temperature: "degF",
    thickness: "mil",
    torque: "lbf_ft",
    pressure: "psi",
    speed: "in_min",
    force: "kip",
  },
} as const satisfies Record<UnitSystem, { [Q in Quantity]: UnitOf<Q> }>;

export function isQuantity(value: unknown): value is Quantity {
  return typeof value === "string" && (QUANTITIES as readonly string[]).includes(value);
}

export function isUnitOf<Q extends Quantity>(quantity: Q, unit: unknown): unit is UnitOf<Q> {
  return typeof unit === "string" && Object.prototype.hasOwnProperty.call(UNITS[quantity], unit);
}

export function unitDef<Q extends Quantity>(quantity: Q, unit: UnitOf<Q>): UnitDef {
  if (!isUnitOf(quantity, unit)) throw new RangeError(`unknown ${quantity} unit: ${String(unit)}`);
  return (UNITS[quantity] as Record<string, UnitDef>)[unit] as UnitDef;
}

export function unitSymbol<Q extends Quantity>(quantity: Q, unit: UnitOf<Q>): string {
  return unitDef(quantity, unit).symbol;
}

/** Value in `unit` → value in the quantity's stored unit (BASE_UNIT). */
export function toSI<Q extends Quantity>(quantity: Q, value: number, unit: UnitOf<Q>): number {
  return unitDef(quantity, unit).toBase(value);
}

/** Stored value (BASE_UNIT) → value in `unit`. */
export function fromSI<Q extends Quantity>(quantity: Q, valueSI: number, unit: UnitOf<Q>): number {
  return unitDef(quantity, unit).fromBase(valueSI);
}

export function convert<Q extends Quantity>(quantity: Q, value: number, from: UnitOf<Q>, to: UnitOf<Q>): number {
  if (from === to) return value;
  return fromSI(quantity, toSI(quantity, value, from), to);
}

export function preferredUnit<Q extends Quantity>(quantity: Q, system: UnitSystem): UnitOf<Q> {
  return PREFERRED[system][quantity] as unknown as UnitOf<Q>;
}
