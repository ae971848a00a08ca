/**
 * Dew point and the coating go/no-go check.
 *
 * Magnus form: γ = ln(RH/100) + a·T/(b + T); Td = b·γ/(a − γ).
 * Coefficients: Alduchov & Eskridge 1996 (J. Appl. Meteor. 35:601) by default, Sonntag 1990 optional.
 * Rule: steel at least 3 °C (5 °F) above the dew point before coating; RH above 85 % is flagged
 * (common practice, ISO 8502-4 / ISO 12944-7 via secondary sources).
 */

export type MagnusCoefficients = "alduchov-eskridge-1996" | "sonntag-1990";

export const MAGNUS: Readonly<Record<MagnusCoefficients, { a: number; bC: number }>> = {
  "alduchov-eskridge-1996": { a: 17.625, bC: 243.04 },
  "sonntag-1990": { a: 17.62, bC: 243.12 },
};

/** Minimum surface-temperature margin above the dew point, °C (the "3 °C rule"). */
export const DEFAULT_REQUIRED_MARGIN_C = 3;
/** Relative humidity above which coating is flagged, %. */
export const RH_WARNING_ABOVE_PCT = 85;
/** Range over which the A&E fit is stated to hold (over water); outside it we only warn. */
export const MAGNUS_VALID_RANGE_C = { min: -40, max: 50 } as const;

// Float noise must not flip a verdict that sits exactly on the limit (e.g. margin 3.0000000000001).
const EPS = 1e-9;

/**
 * Dew point in °C. Throws RangeError for RH outside (0, 100] or non-finite input, because
 * ln(0) is undefined and RH > 100 % is not a measurement; the API validates first.
 */
export function dewPointC(
  airTempC: number,
  relativeHumidity: number,
  coefficients: MagnusCoefficients = "alduchov-eskridge-1996",
): number {
  if (!Number.isFinite(airTempC)) throw new RangeError("airTempC must be a finite number");
  if (!Number.isFinite(relativeHumidity) || relativeHumidity <= 0 || relativeHumidity > 100) {
    throw new RangeError("relativeHumidity must be greater than 0 and at most 100 (%)");
  }
  const { a, bC } = MAGNUS[coefficients];
  if (airTempC <= -bC) throw new RangeError(`airTempC must be above ${-bC} °C`);
  const gamma = Math.log(relativeHumidity / 100) + (a * airTempC) / (bC + airTempC);
  return (bC * gamma) / (a - gamma);
}

export interface DewPointInput {
  airTempC: number;
  relativeHumidity: number;
  surfaceTempC: number;
  /** Defaults to 3 °C. */
  requiredMarginC?: number;
  coefficients?: MagnusCoefficients;
}

export interface DewPointResult {
  dewPointC: number;
  /** surface temperature − dew point, °C */
  marginC: number;
  /** margin ≥ requiredMarginC */
  ok: boolean;
  requiredMarginC: number;
  /** RH above 85 %: advisory, does not change `ok` */
  rhWarning: boolean;
  coefficients: MagnusCoefficients;
  warnings: string[];
}

export function checkDewPoint(input: DewPointInput): DewPointResult {
  const coefficients = input.coefficients ?? "alduchov-eskridge-1996";
  const requiredMarginC = input.requiredMarginC ?? DEFAULT_REQUIRED_MARGIN_C;
  if (!Number.isFinite(input.surfaceTempC)) throw new RangeError("surfaceTempC must be a finite number");
  if (!Number.isFinite(requiredMarginC) || requiredMarginC < 0) {
    throw new RangeError("requiredMarginC must be a number ≥ 0");
  }
  const dp = dewPointC(input.airTempC, input.relativeHumidity, coefficients);
  const marginC = input.surfaceTempC - dp;
  const ok = marginC >= requiredMarginC - EPS;
  const rhWarning = input.relativeHumidity > RH_WARNING_ABOVE_PCT;

  const warnings: string[] = [];
  if (!ok) {
    warnings.push(
      `Surface is ${marginC.toFixed(1)} °C above the dew point; at least ${requiredMarginC} °C is required before coating.`,
    );
  }
  if (rhWarning) {
    warnings.push(`Relative humidity ${input.relativeHumidity} % is above ${RH_WARNING_ABOVE_PCT} %.`);
  }
  if (input.airTempC < MAGNUS_VALID_RANGE_C.min || input.airTempC > MAGNUS_VALID_RANGE_C.max) {
    warnings.push(
      `Air temperature is outside ${MAGNUS_VALID_RANGE_C.min}…${MAGNUS_VALID_RANGE_C.max} °C, where the Magnus fit is less accurate.`,
    );
  }
  return { dewPointC: dp, marginC, ok, requiredMarginC, rhWarning, coefficients, warnings };
}
