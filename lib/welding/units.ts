// Unit conversions used across the welding module.
// Exact definitions from NIST SP 811 (2008), Appendix B: 1 in = 25.4 mm, 1 lbf = 4.448 221 615 260 5 N.

// The factors themselves live in lib/units, so the whole product converts with the very same doubles.
import { KN_PER_KIP, KPA_PER_PSI, MM_PER_IN, N_PER_LBF, NM_PER_LBF_FT } from "@/lib/units/factors";

export { KN_PER_KIP, MM_PER_IN, N_PER_LBF, NM_PER_LBF_FT };
/** 1 ksi in MPa (= 1 psi in kPa), 6.894 757 293 168… */
export const MPA_PER_KSI = KPA_PER_PSI;

export const inToMm = (inches: number): number => inches * MM_PER_IN;
export const mmToIn = (mm: number): number => mm / MM_PER_IN;
export const kipToKN = (kip: number): number => kip * KN_PER_KIP;
export const kNToKip = (kN: number): number => kN / KN_PER_KIP;
export const ksiToMPa = (ksi: number): number => ksi * MPA_PER_KSI;
export const mpaToKsi = (mpa: number): number => mpa / MPA_PER_KSI;
export const lbfFtToNm = (lbfFt: number): number => lbfFt * NM_PER_LBF_FT;
export const nmToLbfFt = (nm: number): number => nm / NM_PER_LBF_FT;
export const fToC = (f: number): number => (f - 32) / 1.8;
export const cToF = (c: number): number => c * 1.8 + 32;
export const inPerMinToMmPerMin = (inPerMin: number): number => inPerMin * MM_PER_IN;
export const mmPerMinToInPerMin = (mmPerMin: number): number => mmPerMin / MM_PER_IN;
/** kJ/mm → J/in (ASME IX reports heat input per inch). */
export const kJPerMmToJPerIn = (kJPerMm: number): number => kJPerMm * 1000 * MM_PER_IN;
export const jPerInToKJPerMm = (jPerIn: number): number => jPerIn / MM_PER_IN / 1000;

export type SpeedUnit = "mm/min" | "in/min";
export interface TravelSpeed {
  value: number;
  unit: SpeedUnit;
}
export type LengthUnit = "mm" | "in";
export interface Length {
  value: number;
  unit: LengthUnit;
}

export function travelSpeedToMmPerMin(speed: TravelSpeed): number {
  return speed.unit === "in/min" ? inPerMinToMmPerMin(speed.value) : speed.value;
}

export function lengthToMm(length: Length): number {
  return length.unit === "in" ? inToMm(length.value) : length.value;
}

/** Formats a millimetre value with its inch equivalent, e.g. "1.59 mm (0.063 in)". */
export function mmWithIn(mm: number, mmDigits = 2): string {
  return `${round(mm, mmDigits)} mm (${round(mmToIn(mm), 3)} in)`;
}

/** Rounds for display only; calculations never round. */
export function round(value: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(value * f) / f;
}

// Comparisons against limits allow a hair of floating-point noise, so a measurement exactly at a limit
// (1/16 in = 1.5875 mm entered as 1.5875) is judged "at the limit", not "over".
const EPS = 1e-9;
export const lte = (a: number, b: number): boolean => a <= b + EPS * Math.max(1, Math.abs(b));
export const gte = (a: number, b: number): boolean => a >= b - EPS * Math.max(1, Math.abs(b));
