// Key results of a steering-geometry capture, computed from its input with lib/geometry. The server
// recomputes these on every save, so a stored capture always agrees with its own input.
// From the module itself, not the index: the index also carries the zod schema, which the runner need not load.
import { computeSteeringGeometry } from "@/lib/geometry/steering";
import type { SteeringInput } from "@/lib/geometry/types";
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

export { requiredCaptures } from "./captures";

type CaptureLike = { input: SteeringInput; results: GeometryResults };

/** Worst steering-wheel degrees of a capture (wheel steer × ratio), or null without a ratio. */
export function worstSteeringWheelDeg(c: CaptureLike): number | null {
  return c.input.steeringRatio === undefined ? null : c.results.worstHeave.wheelSteerDeg * c.input.steeringRatio;
}

/**
 * What the road test should confirm, in words, from the captures: the steering-wheel movement the geometry
 * predicts over the travel checked, after against before. The same sentence is on the job page and the traveller.
 */
export function roadTestNote(before: CaptureLike | null, after: CaptureLike | null): string {
  const deg = (x: number) => `${Math.abs(x).toFixed(1)}°`;
  const describe = (c: CaptureLike) => {
    const sw = worstSteeringWheelDeg(c);
    return sw === null ? `${deg(c.results.worstHeave.wheelSteerDeg)} at the road wheel` : `${deg(sw)} at the steering wheel`;
  };
  const range = (c: CaptureLike) => `−${Math.round(c.input.travel.droop)} to +${Math.round(c.input.travel.bump)} mm`;
  const close =
    "Road-test slowly first on a rough surface: a tug at the steering wheel over bumps, or wander, beyond that means re-measuring before the vehicle goes back into service.";
  if (after && before) return `Road test: by the measured geometry the wheel steers at most ${describe(after)} over ${range(after)} of travel, against ${describe(before)} before the work. ${close}`;
  if (after) return `Road test: by the measured geometry the wheel steers at most ${describe(after)} over ${range(after)} of travel. ${close}`;
  if (before) return `Road test: only the geometry before the work is captured (${describe(before)} over ${range(before)}); capture the after geometry before relying on the road test.`;
  return "";
}
