// Where the axle and its links are at one point of the sweep, in frame-fixed mm (y lateral, z up).
// Pure: the diagram draws from it and the readout quotes it.
import type { Point2, SteeringInput, SteeringResult } from "@/lib/geometry";

export type SweepMode = "heave" | "roll";

export type Pose = {
  mode: SweepMode;
  /** Travel in mm (heave) or roll in degrees. */
  at: number;
  axleShift: number;
  dragLinkError: number;
  wheelSteerDeg: number;
  /** Moves a point carried by the axle (rotate about C, then shift). */
  carry: (p: Point2) => Point2;
};

const RAD = Math.PI / 180;

export function poseAt(input: SteeringInput, result: SteeringResult, mode: SweepMode, index: number): Pose | null {
  if (mode === "roll") {
    const p = result.roll[index];
    if (!p) return null;
    const C = input.axleCenter;
    const c = Math.cos(p.rollDeg * RAD);
    const s = Math.sin(p.rollDeg * RAD);
    return {
      mode,
      at: p.rollDeg,
      axleShift: p.axleShift,
      dragLinkError: p.dragLinkError,
      wheelSteerDeg: p.wheelSteerDeg,
      carry: (q) => ({ y: C.y + c * (q.y - C.y) - s * (q.z - C.z) + p.axleShift, z: C.z + s * (q.y - C.y) + c * (q.z - C.z) }),
    };
  }
  const p = result.heave[index];
  if (!p) return null;
  return {
    mode,
    at: p.travel,
    axleShift: p.axleShift,
    dragLinkError: p.dragLinkError,
    wheelSteerDeg: p.wheelSteerDeg,
    carry: (q) => ({ y: q.y + p.axleShift, z: q.z + p.travel }),
  };
}

/** Index of the sweep point nearest a value (travel mm or roll degrees). */
export function nearestIndex(values: readonly number[], at: number): number {
  let best = 0;
  for (let i = 1; i < values.length; i++) if (Math.abs(values[i]! - at) < Math.abs(values[best]! - at)) best = i;
  return best;
}
