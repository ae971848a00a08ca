// Tightening torque from preload, T = K·D·F (Shigley's Mechanical Engineering Design, eq. 8-27).
// K is an empirical nut factor; the condition values are typical, not a substitute for the fastener
// maker's figure. mm × kN = N·m, so no scaling is needed.

import { nmToLbfFt } from "./units";

export const BOLT_CONDITIONS = ["plain", "waxed", "galvanised"] as const;
export type BoltCondition = (typeof BOLT_CONDITIONS)[number];

export const NUT_FACTOR: Readonly<Record<BoltCondition, number>> = {
  plain: 0.2, // non-plated black-finish steel
  waxed: 0.1,
  galvanised: 0.25,
};

export interface BoltTorqueRequest {
  /** Nominal bolt diameter, mm. */
  diameterMm: number;
  /** Target preload, kN. */
  preloadKN: number;
  /** Nut factor K from the condition, or given directly (wins). */
  condition?: BoltCondition;
  nutFactor?: number;
}

export interface BoltTorqueResult {
  torqueNm: number;
  torqueLbfFt: number;
  nutFactor: number;
}

export function boltTorque(req: BoltTorqueRequest): BoltTorqueResult {
  const k = req.nutFactor ?? NUT_FACTOR[req.condition ?? "plain"];
  for (const [name, v] of [["diameterMm", req.diameterMm], ["preloadKN", req.preloadKN], ["nutFactor", k]] as const) {
    if (!Number.isFinite(v) || v <= 0) throw new RangeError(`${name} must be a positive finite number`);
  }
  const torqueNm = k * req.diameterMm * req.preloadKN;
  return { torqueNm, torqueLbfFt: nmToLbfFt(torqueNm), nutFactor: k };
}

/** The inverse: preload from an applied torque, F = T / (K·D), kN. */
export function preloadFromTorque(torqueNm: number, diameterMm: number, nutFactor: number): number {
  return torqueNm / (nutFactor * diameterMm);
}
