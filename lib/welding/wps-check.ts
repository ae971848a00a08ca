// Checks a logged pass against the ranges of the WPS it was welded to. SI throughout: °C, mm/min, kJ/mm.
// Low preheat blocks the pass outright (welding cold risks hydrogen cracking, which no override repairs);
// any other parameter out of range is recorded and needs a nonconformance or a lead's override.

import { heatInput } from "./heat-input";
import type { WeldingProcess } from "./processes";
import { gte, lte, round } from "./units";

export interface WpsRanges {
  process?: WeldingProcess;
  voltsMin?: number;
  voltsMax?: number;
  ampsMin?: number;
  ampsMax?: number;
  travelSpeedMinMmPerMin?: number;
  travelSpeedMaxMmPerMin?: number;
  heatInputMaxKJPerMm?: number;
  /**
   * What heatInputMaxKJPerMm limits: "arc-energy" (ASME IX QW-409.1, no efficiency factor; default) or
   * "iso-q" (ISO/TR 17671-1 Q = k × arc energy, as EN ISO 15614-1 WPSs state it).
   */
  heatInputBasis?: "arc-energy" | "iso-q";
  preheatMinC?: number;
  interpassMaxC?: number;
  /** Welding positions the WPS covers (1F, 2F, …); empty or absent: not checked. */
  positions?: readonly string[];
}

export interface PassValues {
  process?: WeldingProcess;
  volts?: number;
  amps?: number;
  travelSpeedMmPerMin?: number;
  /** Measured heat input on the WPS's basis, e.g. from a QW-409.1(c) power-source reading; wins over V·A/v. */
  heatInputKJPerMm?: number;
  preheatC?: number;
  /** Omitted on a first pass, where there is no interpass temperature yet. */
  interpassC?: number;
  /** Position welded in (1F, 2F, …). */
  position?: string;
}

export type WpsField = "volts" | "amps" | "travelSpeed" | "heatInput" | "preheat" | "interpass" | "position";

export interface WpsFinding {
  field: WpsField;
  /** null when the pass did not record the value. */
  value: number | null;
  /** non-numeric values (position) as recorded */
  shown?: string;
  unit: "V" | "A" | "mm/min" | "kJ/mm" | "°C" | "";
  min?: number;
  max?: number;
  ok: boolean;
  message: string;
}

export interface WpsCheckResult {
  findings: WpsFinding[];
  /** Preheat below the WPS minimum (or not recorded where the WPS sets one): the pass must not be made. */
  blocked: boolean;
  blockedReason: string | null;
  /** A recorded value outside the WPS: needs a nonconformance or a lead's override. */
  outOfRange: boolean;
  /** A value the WPS limits was not recorded (preheat excepted: that blocks). */
  incomplete: boolean;
  /** No finding failed. */
  ok: boolean;
}

const LABEL: Record<WpsField, string> = {
  volts: "Voltage",
  amps: "Current",
  travelSpeed: "Travel speed",
  heatInput: "Heat input",
  preheat: "Preheat",
  interpass: "Interpass temperature",
  position: "Position",
};

function fmt(v: number, unit: Exclude<WpsFinding["unit"], "">): string {
  const digits = unit === "kJ/mm" ? 3 : 1;
  return `${round(v, digits)} ${unit}`;
}

function rangeFinding(
  field: WpsField,
  unit: Exclude<WpsFinding["unit"], "">,
  value: number | undefined,
  min: number | undefined,
  max: number | undefined,
): WpsFinding | null {
  if (min === undefined && max === undefined) return null;
  const bounds = { ...(min !== undefined && { min }), ...(max !== undefined && { max }) };
  if (value === undefined) {
    return { field, value: null, unit, ...bounds, ok: false, message: `${LABEL[field]} was not recorded.` };
  }
  if (min !== undefined && !gte(value, min)) {
    return {
      field, value, unit, ...bounds, ok: false,
      message: `${LABEL[field]} ${fmt(value, unit)} is below the WPS minimum of ${fmt(min, unit)}.`,
    };
  }
  if (max !== undefined && !lte(value, max)) {
    return {
      field, value, unit, ...bounds, ok: false,
      message: `${LABEL[field]} ${fmt(value, unit)} is above the WPS maximum of ${fmt(max, unit)}.`,
    };
  }
  return { field, value, unit, ...bounds, ok: true, message: `${LABEL[field]} ${fmt(value, unit)} is within the WPS.` };
}

function passHeatInputValue(wps: WpsRanges, pass: PassValues): { value?: number; problem?: string } {
  if (pass.heatInputKJPerMm !== undefined) return { value: pass.heatInputKJPerMm };
  if (pass.volts === undefined || pass.amps === undefined || pass.travelSpeedMmPerMin === undefined) {
    return {};
  }
  if (!(pass.volts > 0 && pass.amps > 0 && pass.travelSpeedMmPerMin > 0)) return {};
  const basis = wps.heatInputBasis ?? "arc-energy";
  const process = pass.process ?? wps.process;
  if (basis === "iso-q" && !process) {
    return { problem: "Heat input on the ISO basis needs the process (for k); none was given." };
  }
  const r = heatInput({
    process: process ?? "SMAW", // only k depends on it, and k is unused on the arc-energy basis
    volts: pass.volts,
    amps: pass.amps,
    travelSpeed: { value: pass.travelSpeedMmPerMin, unit: "mm/min" },
  });
  return { value: basis === "iso-q" ? r.heatInputKJPerMm : r.arcEnergyKJPerMm };
}

export function checkPassAgainstWps(wps: WpsRanges, pass: PassValues): WpsCheckResult {
  const findings: WpsFinding[] = [];
  const push = (f: WpsFinding | null) => {
    if (f) findings.push(f);
  };

  push(rangeFinding("volts", "V", pass.volts, wps.voltsMin, wps.voltsMax));
  push(rangeFinding("amps", "A", pass.amps, wps.ampsMin, wps.ampsMax));
  push(
    rangeFinding("travelSpeed", "mm/min", pass.travelSpeedMmPerMin, wps.travelSpeedMinMmPerMin, wps.travelSpeedMaxMmPerMin),
  );

  if (wps.heatInputMaxKJPerMm !== undefined) {
    const hi = passHeatInputValue(wps, pass);
    if (hi.problem) {
      findings.push({
        field: "heatInput", value: null, unit: "kJ/mm", max: wps.heatInputMaxKJPerMm, ok: false, message: hi.problem,
      });
    } else {
      push(rangeFinding("heatInput", "kJ/mm", hi.value, undefined, wps.heatInputMaxKJPerMm));
    }
  }

  let blockedReason: string | null = null;
  if (wps.preheatMinC !== undefined) {
    const f = rangeFinding("preheat", "°C", pass.preheatC, wps.preheatMinC, undefined);
    if (f && !f.ok) {
      blockedReason =
        pass.preheatC === undefined
          ? `Preheat was not recorded; the WPS requires at least ${fmt(wps.preheatMinC, "°C")} before welding.`
          : `Preheat ${fmt(pass.preheatC, "°C")} is below the WPS minimum of ${fmt(wps.preheatMinC, "°C")}: ` +
            "bring the joint up to temperature before welding.";
      f.message = blockedReason;
    }
    push(f);
  }

  // A first pass has no interpass temperature, so an absent value is not a finding.
  if (wps.interpassMaxC !== undefined && pass.interpassC !== undefined) {
    push(rangeFinding("interpass", "°C", pass.interpassC, undefined, wps.interpassMaxC));
  }

  if (wps.positions && wps.positions.length > 0 && pass.position !== undefined) {
    const ok = wps.positions.includes(pass.position);
    findings.push({
      field: "position", value: null, shown: pass.position, unit: "", ok,
      message: ok
        ? `Position ${pass.position} is covered by the WPS.`
        : `Position ${pass.position} is not among the WPS positions (${wps.positions.join(", ")}).`,
    });
  }

  const failedOther = findings.filter((f) => !f.ok && f.field !== "preheat");
  return {
    findings,
    blocked: blockedReason !== null,
    blockedReason,
    outOfRange: failedOther.some((f) => f.value !== null || f.shown !== undefined),
    incomplete: failedOther.some((f) => f.value === null && f.shown === undefined),
    ok: findings.every((f) => f.ok),
  };
}
