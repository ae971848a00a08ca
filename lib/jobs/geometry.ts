// Key results of a steering-geometry capture, computed from its input with lib/geometry. The server
// recomputes these on every save, so a stored capture always agrees with its own input.
import { computeSteeringGeometry } from "@/lib/geometry";
import type { SteeringInput } from "@/lib/geometry";
import type { GeometryResults } from "./values";

const CURVE_POINTS = 41;

export function geometryResults(input: SteeringInput): GeometryResults {
  // Roll and candidate holes are calculator matters; a job records heave at the fitted bracket.
  const result = computeSteeringGeometry({ ...input, roll: undefined, candidateHoles: undefined, holeRange: undefined });
  const worst = result.worst.heave;
  const every = Math.max(1, Math.ceil(result.heave.length / CURVE_POINTS));
  const curve: [number, number][] = [];
  result.heave.forEach((p, i) => {
    if (i % every === 0 || i === result.heave.length - 1) curve.push([p.travel, p.wheelSteerDeg]);
  });
  return {
    trackBarAngleDeg: result.trackBarAngleDeg,
    dragLinkAngleDeg: result.dragLinkAngleDeg,
    angleDifferenceDeg: result.angleDifferenceDeg,
    worstHeave: { travel: worst.travel, wheelSteerDeg: worst.wheelSteerDeg, dragLinkError: worst.dragLinkError },
    steeringWheelDeg: input.steeringRatio === undefined ? null : worst.wheelSteerDeg * input.steeringRatio,
    curve,
  };
}

/** Which captures a geometry step needs before it can be signed. */
export function requiredCaptures(capture: "before" | "after" | "both"): ("before" | "after")[] {
  return capture === "both" ? ["before", "after"] : [capture];
}
