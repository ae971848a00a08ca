import { GeometryError } from "./errors";
import { LIMITS, holeRangeCount, sweepValues } from "./limits";
import type {
  HeavePoint,
  HoleResult,
  Point2,
  RollPoint,
  SteeringInput,
  SteeringResult,
  WorstHeave,
  WorstOverall,
  WorstRoll,
} from "./types";

const DEG = 180 / Math.PI;
const RAD = Math.PI / 180;

/** A link at ride height as the vector e from its frame-fixed end to its axle-borne end. */
interface Link {
  ey: number;
  ez: number;
  /** |e|², the length every position must keep. */
  l2: number;
  /** Side of the fixed end the moving end sits on; picks the root continuous with ride height. */
  sgn: 1 | -1;
}

function makeLink(fixed: Point2, moving: Point2, name: string): Link {
  const ey = moving.y - fixed.y;
  const ez = moving.z - fixed.z;
  const l2 = ey * ey + ez * ez;
  if (l2 === 0) throw new GeometryError("zero_length_link", `${name} has zero length (both ends coincide)`);
  // A vertical link in front view gives no lateral location at ride height, so there is no root to follow.
  if (ey === 0) throw new GeometryError("vertical_link", `${name} is vertical in front view`);
  return { ey, ez, l2, sgn: ey > 0 ? 1 : -1 };
}

/**
 * Lateral correction (along y) the moving end needs, after the axle displaced it by (dy, dz), to keep its
 * distance from the fixed end, on the ride-height side. NaN when the link cannot reach.
 * Written as −(2e·δ + |δ|²)/(root + v) rather than root − v: no cancellation, exactly 0 at ride height.
 */
function correction(ey: number, ez: number, l2: number, sgn: number, dy: number, dz: number): number {
  const u = ez + dz;
  const disc = l2 - u * u;
  if (!(disc >= 0)) return Number.NaN;
  const root = Math.sqrt(disc);
  const v = sgn * (ey + dy);
  const den = root + v;
  // `+ 0` turns −0 into 0 so ride height reads as plain zero.
  if (den > 0) return (-sgn * (2 * (ey * dy + ez * dz) + dy * dy + dz * dz)) / den + 0;
  return sgn * root - (ey + dy) + 0;
}

/** Angle of a link from horizontal, atan2(dz, dy) folded to (−90, 90] so the link's direction doesn't matter. */
export function linkAngleDeg(a: Point2, b: Point2): number {
  return foldAngle(Math.atan2(b.z - a.z, b.y - a.y) * DEG);
}

function foldAngle(deg: number): number {
  let a = deg;
  while (a > 90) a -= 180;
  while (a <= -90) a += 180;
  return a;
}

function wheelSteerDeg(d: number, r: number, where: string): number {
  const x = d / r;
  if (!(Math.abs(x) <= 1)) {
    throw new GeometryError(
      "steer_out_of_range",
      `drag-link error ${d} mm exceeds the ${r} mm steering arm ${where}`,
    );
  }
  return Math.asin(x) * DEG;
}

function unreachable(name: string, where: string): GeometryError {
  return new GeometryError("unreachable", `${name} cannot reach ${where}`);
}

const fmt = (x: number, unit: string): string => `${x > 0 ? "+" : ""}${x} ${unit}`;

function assertFinite(input: SteeringInput): void {
  const check = (path: string, v: unknown): void => {
    if (typeof v !== "number" || !Number.isFinite(v)) {
      throw new GeometryError("non_finite_input", `${path} must be a finite number`);
    }
  };
  const pt = (path: string, p: Point2): void => {
    check(`${path}.y`, p.y);
    check(`${path}.z`, p.z);
  };
  pt("trackBar.frameEnd", input.trackBar.frameEnd);
  pt("trackBar.axleEnd", input.trackBar.axleEnd);
  pt("dragLink.pitmanEnd", input.dragLink.pitmanEnd);
  pt("dragLink.knuckleEnd", input.dragLink.knuckleEnd);
  pt("axleCenter", input.axleCenter);
  check("steeringArmLength", input.steeringArmLength);
  if (input.steeringRatio !== undefined) check("steeringRatio", input.steeringRatio);
  check("travel.bump", input.travel.bump);
  check("travel.droop", input.travel.droop);
  check("travel.step", input.travel.step);
  if (input.roll) {
    check("roll.maxDeg", input.roll.maxDeg);
    check("roll.stepDeg", input.roll.stepDeg);
  }
  input.candidateHoles?.forEach((h, i) => pt(`candidateHoles.${i}`, h));
  if (input.holeRange) {
    check("holeRange.zMin", input.holeRange.zMin);
    check("holeRange.zMax", input.holeRange.zMax);
    check("holeRange.pitch", input.holeRange.pitch);
    if (input.holeRange.y !== undefined) check("holeRange.y", input.holeRange.y);
  }
}

/** Candidate holes: the explicit list first, then the range bottom to top. */
export function candidateList(input: SteeringInput): { y: number; z: number; label: string }[] {
  const out: { y: number; z: number; label: string }[] = [];
  input.candidateHoles?.forEach((h, i) => out.push({ y: h.y, z: h.z, label: h.label ?? `H${i + 1}` }));
  const hr = input.holeRange;
  if (hr) {
    if (!(hr.pitch > 0)) throw new GeometryError("bad_step", "holeRange.pitch must be greater than 0");
    if (!(hr.zMax >= hr.zMin)) throw new GeometryError("bad_range", "holeRange.zMax is below zMin");
    const n = holeRangeCount(hr.zMin, hr.zMax, hr.pitch);
    if (n + out.length > LIMITS.maxHoles) {
      throw new GeometryError("too_many_points", `more than ${LIMITS.maxHoles} candidate holes`);
    }
    const end = input.candidateEnd ?? "axle";
    const y = hr.y ?? (end === "axle" ? input.trackBar.axleEnd.y : input.trackBar.frameEnd.y);
    for (let i = 0; i < n; i++) out.push({ y, z: hr.zMin + i * hr.pitch, label: `R${i + 1}` });
  }
  if (out.length > LIMITS.maxHoles) {
    throw new GeometryError("too_many_points", `more than ${LIMITS.maxHoles} candidate holes`);
  }
  return out;
}

/**
 * Signed drag-link error of largest magnitude over the heave sweep for one lateral-link vector.
 * The hot loop of the hole ranking: scalars only, no allocation.
 */
function worstHeaveError(link: Link, drag: Link, travels: Float64Array, label: string): number {
  const { ey, ez, l2, sgn } = link;
  const dy0 = drag.ey;
  const dz0 = drag.ez;
  const dl2 = drag.l2;
  const dsgn = drag.sgn;
  let worstAbs = -1;
  let worst = 0;
  for (const h of travels) {
    const s = correction(ey, ez, l2, sgn, 0, h);
    if (s !== s) throw unreachable(`lateral link with hole ${label}`, `at travel ${fmt(h, "mm")}`);
    const d = correction(dy0, dz0, dl2, dsgn, s, h);
    if (d !== d) throw unreachable("drag link", `at travel ${fmt(h, "mm")} (hole ${label})`);
    const a = d < 0 ? -d : d;
    if (a > worstAbs) {
      worstAbs = a;
      worst = d;
    }
  }
  return worst;
}

/**
 * Front-view steering-link sweep: lateral axle shift, drag-link error and wheel steer over heave and
 * roll, and candidate lateral-link holes ranked by worst heave steer. Throws GeometryError when the
 * geometry is impossible. Nothing is rounded.
 */
export function computeSteeringGeometry(input: SteeringInput): SteeringResult {
  assertFinite(input);
  const r = input.steeringArmLength;
  if (!(r > 0)) throw new GeometryError("bad_steering_arm", "steering arm length must be greater than 0");
  const F = input.trackBar.frameEnd;
  const A = input.trackBar.axleEnd;
  const P = input.dragLink.pitmanEnd;
  const K = input.dragLink.knuckleEnd;
  const C = input.axleCenter;
  const ratio = input.steeringRatio;

  const link = makeLink(F, A, "lateral link");
  const drag = makeLink(P, K, "drag link");
  const travels = sweepValues(0 - input.travel.droop, input.travel.bump, input.travel.step, "travel");

  const heave: HeavePoint[] = [];
  let wh: WorstHeave | undefined;
  for (const h of travels) {
    const s = correction(link.ey, link.ez, link.l2, link.sgn, 0, h);
    if (s !== s) throw unreachable("lateral link", `at travel ${fmt(h, "mm")}`);
    const d = correction(drag.ey, drag.ez, drag.l2, drag.sgn, s, h);
    if (d !== d) throw unreachable("drag link", `at travel ${fmt(h, "mm")}`);
    const steer = wheelSteerDeg(d, r, `at travel ${fmt(h, "mm")}`);
    const p: HeavePoint = { travel: h, axleShift: s, dragLinkError: d, wheelSteerDeg: steer };
    if (ratio !== undefined) p.steeringWheelDeg = steer * ratio;
    heave.push(p);
    if (!wh || Math.abs(steer) > Math.abs(wh.wheelSteerDeg)) {
      wh = { travel: h, wheelSteerDeg: steer, dragLinkError: d };
    }
  }
  // sweepValues always yields at least one point.
  const worstHeave = wh as WorstHeave;

  const roll: RollPoint[] = [];
  let wr: WorstRoll | null = null;
  if (input.roll) {
    const angles = sweepValues(0 - input.roll.maxDeg, input.roll.maxDeg, input.roll.stepDeg, "roll");
    const ay = A.y - C.y;
    const az = A.z - C.z;
    const ky = K.y - C.y;
    const kz = K.z - C.z;
    for (const phi of angles) {
      const t = phi * RAD;
      const sn = Math.sin(t);
      const half = Math.sin(t / 2);
      // cos φ − 1 as −2 sin²(φ/2): keeps small rotations free of cancellation.
      const c1 = -2 * half * half;
      const s = correction(link.ey, link.ez, link.l2, link.sgn, c1 * ay - sn * az, sn * ay + c1 * az);
      if (s !== s) throw unreachable("lateral link", `at roll ${fmt(phi, "deg")}`);
      const d = correction(drag.ey, drag.ez, drag.l2, drag.sgn, c1 * ky - sn * kz + s, sn * ky + c1 * kz);
      if (d !== d) throw unreachable("drag link", `at roll ${fmt(phi, "deg")}`);
      const steer = wheelSteerDeg(d, r, `at roll ${fmt(phi, "deg")}`);
      roll.push({ rollDeg: phi, axleShift: s, dragLinkError: d, wheelSteerDeg: steer });
      if (!wr || Math.abs(steer) > Math.abs(wr.wheelSteerDeg)) {
        wr = { rollDeg: phi, wheelSteerDeg: steer, dragLinkError: d };
      }
    }
  }

  const rollWins = wr !== null && Math.abs(wr.wheelSteerDeg) > Math.abs(worstHeave.wheelSteerDeg);
  const overall: WorstOverall =
    wr !== null && rollWins
      ? { source: "roll", at: wr.rollDeg, wheelSteerDeg: wr.wheelSteerDeg, dragLinkError: wr.dragLinkError }
      : {
          source: "heave",
          at: worstHeave.travel,
          wheelSteerDeg: worstHeave.wheelSteerDeg,
          dragLinkError: worstHeave.dragLinkError,
        };
  if (ratio !== undefined) overall.steeringWheelDeg = overall.wheelSteerDeg * ratio;

  const trackBarAngleDeg = linkAngleDeg(F, A);
  const dragLinkAngleDeg = linkAngleDeg(P, K);
  const result: SteeringResult = {
    trackBarAngleDeg,
    dragLinkAngleDeg,
    angleDifferenceDeg: foldAngle(dragLinkAngleDeg - trackBarAngleDeg),
    heave,
    roll,
    worst: { heave: worstHeave, roll: wr, overall },
  };

  const atFrame = input.candidateEnd === "frame";
  const slope = drag.ez / drag.ey;
  if (atFrame) {
    const yl = input.holeRange?.y ?? F.y;
    if (yl !== A.y) result.parallelHeightZ = A.z - slope * (A.y - yl);
  } else {
    const yl = input.holeRange?.y ?? A.y;
    if (yl !== F.y) result.parallelHeightZ = F.z + slope * (yl - F.y);
  }

  const holes = candidateList(input);
  if (input.candidateHoles !== undefined || input.holeRange !== undefined) {
    const ranked: HoleResult[] = [];
    for (const hole of holes) {
      const hl = atFrame
        ? makeLink(hole, A, `lateral link with hole ${hole.label}`)
        : makeLink(F, hole, `lateral link with hole ${hole.label}`);
      const d = worstHeaveError(hl, drag, travels, hole.label);
      ranked.push({
        y: hole.y,
        z: hole.z,
        label: hole.label,
        trackBarAngleDeg: atFrame ? linkAngleDeg(hole, A) : linkAngleDeg(F, hole),
        worstWheelSteerDeg: wheelSteerDeg(d, r, `with hole ${hole.label}`),
        rank: 0,
      });
    }
    // Array sort is stable, so equal steer keeps input order.
    ranked.sort((a, b) => Math.abs(a.worstWheelSteerDeg) - Math.abs(b.worstWheelSteerDeg));
    ranked.forEach((h, k) => {
      h.rank = k + 1;
    });
    result.holes = ranked;
  }
  return result;
}
