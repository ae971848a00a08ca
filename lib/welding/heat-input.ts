// Heat input per ASME BPVC Section IX QW-409.1 and arc energy / heat input per ISO/TR 17671-1 (EN 1011-1).
// ASME's figure carries no efficiency factor, so it equals the ISO "arc energy"; ISO's heat input Q is
// k × arc energy. Both are returned because WPSs from either world are logged against the same pass.

import { efficiencyFactor as kFor, type WeldingProcess } from "./processes";
import {
  MM_PER_IN,
  lengthToMm,
  travelSpeedToMmPerMin,
  type Length,
  type TravelSpeed,
} from "./units";

export interface HeatInputRequest {
  process: WeldingProcess;
  volts: number;
  amps: number;
  travelSpeed: TravelSpeed;
}

/** Exactly what `POST /api/calc/heat-input` returns. */
export interface HeatInputResult {
  /** ISO/TR 17671-1 arc energy U·I/v, kJ/mm (= ASME QW-409.1(a) value in SI). */
  arcEnergyKJPerMm: number;
  /** ISO/TR 17671-1 heat input Q = k × arc energy, kJ/mm. */
  heatInputKJPerMm: number;
  /** k for the process. */
  efficiencyFactor: number;
  /** ASME IX QW-409.1(a): V × A × 60 / travel speed [in/min], J/in. */
  jPerIn: number;
}

function requirePositive(name: string, value: number): void {
  if (!Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${name} must be a positive finite number (got ${String(value)})`);
  }
}

/** Heat input from volts, amps and travel speed: QW-409.1(a) and ISO/TR 17671-1. */
export function heatInput(req: HeatInputRequest): HeatInputResult {
  requirePositive("volts", req.volts);
  requirePositive("amps", req.amps);
  requirePositive("travelSpeed.value", req.travelSpeed.value);
  const mmPerMin = travelSpeedToMmPerMin(req.travelSpeed);
  const k = kFor(req.process);
  // J/mm = W / (mm/s); kJ/mm needs the 10⁻³ of ISO/TR 17671-1.
  const arcEnergyKJPerMm = (req.volts * req.amps) / (mmPerMin / 60) / 1000;
  const jPerIn = (req.volts * req.amps * 60) / (mmPerMin / MM_PER_IN);
  return { arcEnergyKJPerMm, heatInputKJPerMm: k * arcEnergyKJPerMm, efficiencyFactor: k, jPerIn };
}

/**
 * Pass heat input by any of the QW-409.1 routes:
 * - "voltage-current": (a) V × A × 60 / travel speed; travel speed given, or bead length / arc time.
 * - "energy": (c)(1) instantaneous energy [J] from the power source / bead length.
 * - "power": (c)(2) average instantaneous power [W] × arc time [s] / bead length.
 * Waveform-controlled welding must use (c) (ASME IX Nonmandatory Appendix H); that choice is the caller's.
 */
export type PassHeatInputRequest =
  | {
      method: "voltage-current";
      process?: WeldingProcess;
      volts: number;
      amps: number;
      travelSpeed?: TravelSpeed;
      beadLength?: Length;
      arcTimeS?: number;
    }
  | { method: "energy"; process?: WeldingProcess; energyJ: number; beadLength: Length; arcTimeS?: number }
  | { method: "power"; process?: WeldingProcess; powerW: number; arcTimeS: number; beadLength: Length };

export interface PassHeatInputResult {
  method: PassHeatInputRequest["method"];
  clause: "ASME IX QW-409.1(a)" | "ASME IX QW-409.1(c)(1)" | "ASME IX QW-409.1(c)(2)";
  jPerIn: number;
  /** Same quantity in kJ/mm (ISO arc energy, no k). */
  arcEnergyKJPerMm: number;
  /** k × arc energy (ISO/TR 17671-1); null when no process was given. */
  heatInputKJPerMm: number | null;
  efficiencyFactor: number | null;
  /** Travel speed used or derived, mm/min; null when it cannot be known (energy without arc time). */
  travelSpeedMmPerMin: number | null;
}

export function passHeatInput(req: PassHeatInputRequest): PassHeatInputResult {
  let jPerMm: number;
  let travelSpeedMmPerMin: number | null = null;
  let clause: PassHeatInputResult["clause"];

  switch (req.method) {
    case "voltage-current": {
      requirePositive("volts", req.volts);
      requirePositive("amps", req.amps);
      const derivable = req.beadLength !== undefined || req.arcTimeS !== undefined;
      if (req.travelSpeed && derivable) {
        // Two sources for one number would silently disagree; make the caller choose.
        throw new RangeError("give travelSpeed, or beadLength with arcTimeS, not both");
      }
      if (req.travelSpeed) {
        requirePositive("travelSpeed.value", req.travelSpeed.value);
        travelSpeedMmPerMin = travelSpeedToMmPerMin(req.travelSpeed);
      } else {
        if (!req.beadLength || req.arcTimeS === undefined) {
          throw new RangeError("travel speed needs travelSpeed, or both beadLength and arcTimeS");
        }
        requirePositive("beadLength.value", req.beadLength.value);
        requirePositive("arcTimeS", req.arcTimeS);
        travelSpeedMmPerMin = (lengthToMm(req.beadLength) / req.arcTimeS) * 60;
      }
      jPerMm = (req.volts * req.amps * 60) / travelSpeedMmPerMin;
      clause = "ASME IX QW-409.1(a)";
      break;
    }
    case "energy": {
      requirePositive("energyJ", req.energyJ);
      requirePositive("beadLength.value", req.beadLength.value);
      const mm = lengthToMm(req.beadLength);
      jPerMm = req.energyJ / mm;
      if (req.arcTimeS !== undefined) {
        requirePositive("arcTimeS", req.arcTimeS);
        travelSpeedMmPerMin = (mm / req.arcTimeS) * 60;
      }
      clause = "ASME IX QW-409.1(c)(1)";
      break;
    }
    case "power": {
      requirePositive("powerW", req.powerW);
      requirePositive("arcTimeS", req.arcTimeS);
      requirePositive("beadLength.value", req.beadLength.value);
      const mm = lengthToMm(req.beadLength);
      jPerMm = (req.powerW * req.arcTimeS) / mm;
      travelSpeedMmPerMin = (mm / req.arcTimeS) * 60;
      clause = "ASME IX QW-409.1(c)(2)";
      break;
    }
  }

  const k = req.process ? kFor(req.process) : null;
  const arcEnergyKJPerMm = jPerMm / 1000;
  return {
    method: req.method,
    clause,
    jPerIn: jPerMm * MM_PER_IN,
    arcEnergyKJPerMm,
    // Applying k to a (c)-route energy is an assumption: ISO/TR 17671-1 defines k against arc energy,
    // and the measured energy is the better arc energy for pulsed/waveform sources.
    heatInputKJPerMm: k === null ? null : k * arcEnergyKJPerMm,
    efficiencyFactor: k,
    travelSpeedMmPerMin,
  };
}
