import { GeometryError } from "./errors";
import { LIMITS, holeRangeCount, sweepValues } from "./limits";
import type {
  HeavePoint,
  HoleResult,
  OptimumResult,
  Point2,
  RollPoint,
  SteeringInput,
  SteeringResult,
  WorstCombined,
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
 * The points of a sweep as moves of the axle, precomputed once. At point i the lateral link's axle end (at
 * (ay, az) from the roll centre) moves by (p + c1·ay − sn·az, q + sn·ay + c1·az) and the steering-arm end by
 * (kdy, kdz), both before the lateral shift s. Heave is p = 0, q = kdz = h, no turn; roll is the turn alone,
 * sn = sin φ and c1 = cos φ − 1 (as −2 sin²(φ/2), free of cancellation for small φ). Adding the zeros is exact, so
 * every sweep below evaluates the same figures as computeSteeringGeometry's own heave and roll loops.
 */
interface Moves {
  /** Travel (mm) or roll angle (deg) of each point, to say where. */
  at: Float64Array;
  p: Float64Array;
  q: Float64Array;
  sn: Float64Array;
  c1: Float64Array;
  kdy: Float64Array;
  kdz: Float64Array;
}

function heaveMoves(travels: Float64Array): Moves {
  const zero = new Float64Array(travels.length);
  return { at: travels, p: zero, q: travels, sn: zero, c1: zero, kdy: zero, kdz: travels };
}

function rollMoves(angles: Float64Array, K: Point2, C: Point2): Moves {
  const n = angles.length;
  const zero = new Float64Array(n);
  const t: Moves = { at: angles, p: zero, q: zero, sn: new Float64Array(n), c1: new Float64Array(n), kdy: new Float64Array(n), kdz: new Float64Array(n) };
  const ky = K.y - C.y;
  const kz = K.z - C.z;
  for (let i = 0; i < n; i++) {
    const a = angles[i]! * RAD;
    const sn = Math.sin(a);
    const half = Math.sin(a / 2);
    const c1 = -2 * half * half;
    t.sn[i] = sn;
    t.c1[i] = c1;
    t.kdy[i] = c1 * ky - sn * kz;
    t.kdz[i] = sn * ky + c1 * kz;
  }
  return t;
}

/** Every `stride`-th point of a long sweep (both ends kept), for the optimum's dense first pass. */
function thinMoves(m: Moves, keep: number): Moves {
  const n = m.at.length;
  if (n <= keep) return m;
  const stride = (n - 1) / (keep - 1);
  const pick = (a: Float64Array) => {
    const out = new Float64Array(keep);
    for (let i = 0; i < keep; i++) out[i] = a[Math.round(i * stride)]!;
    return out;
  };
  return { at: pick(m.at), p: pick(m.p), q: pick(m.q), sn: pick(m.sn), c1: pick(m.c1), kdy: pick(m.kdy), kdz: pick(m.kdz) };
}

/** A constant extra move of both ends, added to every point: one roll angle under the heave sweep. */
interface Offset {
  ay: number;
  az: number;
  ky: number;
  kz: number;
}
const NO_OFFSET: Offset = { ay: 0, az: 0, ky: 0, kz: 0 };

interface Worst {
  /** Signed drag-link error of largest |d| (first one on a tie); NaN when a link cannot reach. */
  d: number;
  /** Index of that point, or of the point where a link could not reach. */
  i: number;
  fail: "lateral link" | "drag link" | null;
}

/**
 * The one hot loop: over the points of a sweep, the signed drag-link error of largest |d| for the lateral link
 * e = (ey, ez) whose axle end sits at (ay, az) from the roll centre. Scalars only, no allocation inside.
 */
function worstOver(ey: number, ez: number, l2: number, sgn: number, drag: Link, m: Moves, ay: number, az: number, off: Offset = NO_OFFSET): Worst {
  const { p, q, sn, c1, kdy, kdz } = m;
  let worstAbs = -1;
  let worst = 0;
  let at = 0;
  for (let i = 0; i < p.length; i++) {
    const s = correction(ey, ez, l2, sgn, off.ay + (p[i]! + (c1[i]! * ay - sn[i]! * az)), off.az + (q[i]! + (sn[i]! * ay + c1[i]! * az)));
    if (s !== s) return { d: Number.NaN, i, fail: "lateral link" };
    const d = correction(drag.ey, drag.ez, drag.l2, drag.sgn, off.ky + kdy[i]! + s, off.kz + kdz[i]!);
    if (d !== d) return { d: Number.NaN, i, fail: "drag link" };
    const a = d < 0 ? -d : d;
    if (a > worstAbs) {
      worstAbs = a;
      worst = d;
      at = i;
    }
  }
  return { d: worst, i: at, fail: null };
}

/** Every point of a sweep with its lateral shift, drag-link error and wheel steer, for the answer's lists; throws where a link cannot reach. */
function sweepPoints(link: Link, drag: Link, m: Moves, ay: number, az: number, r: number, where: (at: number) => string): { points: { at: number; s: number; d: number; steer: number }[]; worst: number } {
  const points: { at: number; s: number; d: number; steer: number }[] = [];
  let worst = 0;
  for (let i = 0; i < m.at.length; i++) {
    const at = m.at[i]!;
    const s = correction(link.ey, link.ez, link.l2, link.sgn, m.p[i]! + (m.c1[i]! * ay - m.sn[i]! * az), m.q[i]! + (m.sn[i]! * ay + m.c1[i]! * az));
    if (s !== s) throw unreachable("lateral link", where(at));
    const d = correction(drag.ey, drag.ez, drag.l2, drag.sgn, m.kdy[i]! + s, m.kdz[i]!);
    if (d !== d) throw unreachable("drag link", where(at));
    const steer = wheelSteerDeg(d, r, where(at));
    points.push({ at, s, d, steer });
    if (Math.abs(steer) > Math.abs(points[worst]!.steer)) worst = i;
  }
  return { points, worst };
}

/**
 * Combined articulation: every heave point at every roll angle (the axle turned about the roll centre, then
 * lifted by h and shifted by s). Null when a link cannot reach somewhere on the grid.
 */
function combinedWorst(ey: number, ez: number, l2: number, sgn: number, drag: Link, heave: Moves, roll: Moves, ay: number, az: number): { d: number; travel: number; rollDeg: number } | null {
  let worstAbs = -1;
  let out = { d: 0, travel: 0, rollDeg: 0 };
  for (let i = 0; i < roll.at.length; i++) {
    const sn = roll.sn[i]!;
    const c1 = roll.c1[i]!;
    const w = worstOver(ey, ez, l2, sgn, drag, heave, ay, az, { ay: c1 * ay - sn * az, az: sn * ay + c1 * az, ky: roll.kdy[i]!, kz: roll.kdz[i]! });
    if (w.fail) return null;
    const a = Math.abs(w.d);
    if (a > worstAbs) {
      worstAbs = a;
      out = { d: w.d, travel: heave.at[w.i]!, rollDeg: roll.at[i]! };
    }
  }
  return out;
}

/** Largest combined grid (points × candidates) worked out per request; past it the answer says it was skipped. */
export const COMBINED_MAX_EVALUATIONS = 1_000_000;

/** Scan points for the optimum: the dense pass over the feasible range, and the fine pass near likely heights. */
const OPT_SCAN = 1601;
const OPT_NEAR = 401;
const OPT_NEAR_MM = 200;
const OPT_ZOOM = 11;
const OPT_SEEDS = 4;
const OPT_TOL_MM = 1e-7;
/** Heave and roll points used by the dense pass when the sweeps are long (refinement always uses them all). */
const OPT_THIN = 257;

/**
 * Best height for one lateral-link end on the vertical through its current joint, by the largest |drag-link
 * error| over the heave and roll points (|steer| = asin(|d|/r) rises with |d|, so the same height wins).
 * The objective is a maximum of absolute values, so it has corners and may have several dips: a dense scan of
 * every feasible height picks the best few neighbourhoods, and each is narrowed by nested 11-point scans
 * (each a fifth as wide) to 1e-7 mm. The best height ever evaluated exactly is returned, so the answer is
 * never worse than any height the scan tried.
 */
function findOptimum(
  end: "axle" | "frame",
  F: Point2,
  A: Point2,
  C: Point2,
  drag: Link,
  r: number,
  heave: Moves,
  roll: Moves | null,
  hint: number | undefined,
): { z: number; d: number; min: number; max: number } {
  const ey = A.y - F.y;
  const current = end === "axle" ? A.z : F.z;
  // ez of the link vector F → A as a function of the height z of the moving end.
  const ezOf = end === "axle" ? (z: number) => z - F.z : (z: number) => A.z - z;
  const ay = A.y - C.y;
  const sgn = ey > 0 ? 1 : -1;
  const thinHeave = thinMoves(heave, OPT_THIN);
  const thinRoll = roll ? thinMoves(roll, OPT_THIN) : null;
  const evaluate = (z: number, hv: Moves, rl: Moves | null): number => {
    const ez = ezOf(z);
    const l2 = ey * ey + ez * ez;
    const az = (end === "axle" ? z : A.z) - C.z;
    let d = worstOver(ey, ez, l2, sgn, drag, hv, ay, az).d;
    if (d !== d) return Number.NaN;
    if (rl) {
      const dr = worstOver(ey, ez, l2, sgn, drag, rl, ay, az).d;
      if (dr !== dr) return Number.NaN;
      if (Math.abs(dr) > Math.abs(d)) d = dr;
    }
    // Past the steering arm's reach asin has no answer: such a height is not a solution.
    return Math.abs(d) <= r ? d : Number.NaN;
  };
  const score = (d: number) => (d === d ? Math.abs(d) : Number.POSITIVE_INFINITY);

  // Heights at which the link reaches over the heave sweep (closed form), within the coordinate bounds.
  // For the link vector e = (ey, ez): ey² − 2·ez·h − h² ≥ 0 at every travel h (axle end), mirrored for the frame end.
  const bump = heave.at[heave.at.length - 1]!;
  const droop = -heave.at[0]!;
  let ezLo = -Infinity;
  let ezHi = Infinity;
  if (bump > 0) ezHi = Math.min(ezHi, (ey * ey - bump * bump) / (2 * bump));
  if (droop > 0) ezLo = Math.max(ezLo, (droop * droop - ey * ey) / (2 * droop));
  let lo: number;
  let hi: number;
  if (end === "axle") {
    lo = F.z + ezLo;
    hi = F.z + ezHi;
  } else {
    lo = A.z - ezHi;
    hi = A.z - ezLo;
  }
  lo = Math.max(lo, -LIMITS.coordMm);
  hi = Math.min(hi, LIMITS.coordMm);
  if (!(hi >= lo)) {
    lo = current;
    hi = current;
  }

  const zs: number[] = [];
  for (let i = 0; i < OPT_SCAN; i++) zs.push(lo + ((hi - lo) * i) / (OPT_SCAN - 1));
  // Finer near the joint as it is and near the first-order answer (parallel links), where the best usually is.
  for (const c of [current, hint]) {
    if (c === undefined || !Number.isFinite(c)) continue;
    for (let i = 0; i < OPT_NEAR; i++) {
      const z = c - OPT_NEAR_MM + (2 * OPT_NEAR_MM * i) / (OPT_NEAR - 1);
      if (z >= lo && z <= hi) zs.push(z);
    }
  }
  zs.push(current);
  zs.sort((a, b) => a - b);
  const grid = zs.filter((z, i) => i === 0 || z !== zs[i - 1]);
  const rough = grid.map((z) => score(evaluate(z, thinHeave, thinRoll)));

  let bestZ = current;
  let bestD = evaluate(current, heave, roll);
  const consider = (z: number): number => {
    const d = evaluate(z, heave, roll);
    const sc = score(d);
    if (sc < score(bestD) || (sc === score(bestD) && Math.abs(z - current) < Math.abs(bestZ - current))) {
      bestZ = z;
      bestD = d;
    }
    return sc;
  };

  // Local minima of the rough scan, best first.
  const seeds: number[] = [];
  for (let i = 0; i < grid.length; i++) {
    const v = rough[i]!;
    if (!Number.isFinite(v)) continue;
    if ((i === 0 || v <= rough[i - 1]!) && (i === grid.length - 1 || v <= rough[i + 1]!)) seeds.push(i);
  }
  seeds.sort((a, b) => rough[a]! - rough[b]!);

  for (const i of seeds.slice(0, OPT_SEEDS)) {
    let a = grid[Math.max(0, i - 1)]!;
    let b = grid[Math.min(grid.length - 1, i + 1)]!;
    consider(grid[i]!);
    for (let round = 0; round < 60 && b - a > OPT_TOL_MM; round++) {
      let bj = 0;
      let bv = Number.POSITIVE_INFINITY;
      const pts: number[] = [];
      for (let k = 0; k < OPT_ZOOM; k++) pts.push(a + ((b - a) * k) / (OPT_ZOOM - 1));
      pts.forEach((z, k) => {
        const v = consider(z);
        if (v < bv) {
          bv = v;
          bj = k;
        }
      });
      if (!Number.isFinite(bv)) break;
      a = pts[Math.max(0, bj - 1)]!;
      b = pts[Math.min(OPT_ZOOM - 1, bj + 1)]!;
    }
  }

  // Feasible heights: the outermost feasible scan points, pushed out by bisection toward their infeasible neighbours.
  let fMin = bestZ;
  let fMax = bestZ;
  let iMin = -1;
  let iMax = -1;
  for (let i = 0; i < grid.length; i++) {
    if (Number.isFinite(rough[i]!)) {
      if (iMin < 0) iMin = i;
      iMax = i;
    }
  }
  const feasible = (z: number) => Number.isFinite(score(evaluate(z, heave, roll)));
  const edge = (inside: number, outside: number): number => {
    let a = inside;
    let b = outside;
    for (let k = 0; k < 50 && Math.abs(b - a) > 1e-6; k++) {
      const m = (a + b) / 2;
      if (feasible(m)) a = m;
      else b = m;
    }
    return a;
  };
  if (iMin >= 0) {
    fMin = Math.min(bestZ, iMin > 0 ? edge(grid[iMin]!, grid[iMin - 1]!) : grid[iMin]!);
    fMax = Math.max(bestZ, iMax < grid.length - 1 ? edge(grid[iMax]!, grid[iMax + 1]!) : grid[iMax]!);
  }
  return { z: bestZ, d: bestD, min: fMin, max: fMax };
}

/** D·sin(steer): how far the rim's front edge moves relative to its back edge, same sign as the steer. */
export function toeAtRim(wheelSteerDeg: number, rimDiameterMm: number): number {
  return rimDiameterMm * Math.sin(wheelSteerDeg * RAD);
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

  const ayNow = A.y - C.y;
  const azNow = A.z - C.z;
  const heaveM = heaveMoves(travels);
  const heave: HeavePoint[] = [];
  const hs = sweepPoints(link, drag, heaveM, ayNow, azNow, r, (h) => `at travel ${fmt(h, "mm")}`);
  for (const pt of hs.points) {
    const p: HeavePoint = { travel: pt.at, axleShift: pt.s, dragLinkError: pt.d, wheelSteerDeg: pt.steer };
    if (ratio !== undefined) p.steeringWheelDeg = pt.steer * ratio;
    heave.push(p);
  }
  // sweepValues always yields at least one point.
  const wh = hs.points[hs.worst]!;
  const worstHeave: WorstHeave = { travel: wh.at, wheelSteerDeg: wh.steer, dragLinkError: wh.d };

  let roll: RollPoint[] = [];
  let wr: WorstRoll | null = null;
  let table: Moves | null = null;
  if (input.roll) {
    const angles = sweepValues(0 - input.roll.maxDeg, input.roll.maxDeg, input.roll.stepDeg, "roll");
    table = rollMoves(angles, K, C);
    const rs = sweepPoints(link, drag, table, ayNow, azNow, r, (phi) => `at roll ${fmt(phi, "deg")}`);
    roll = rs.points.map((pt) => ({ rollDeg: pt.at, axleShift: pt.s, dragLinkError: pt.d, wheelSteerDeg: pt.steer }));
    const w = rs.points[rs.worst]!;
    wr = { rollDeg: w.at, wheelSteerDeg: w.steer, dragLinkError: w.d };
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
    worst: { heave: worstHeave, roll: wr, overall, combined: null },
    // Filled in below, once the sweeps are known.
    optimum: undefined as unknown as OptimumResult,
    optimumFrame: undefined as unknown as OptimumResult,
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
  const rimD = input.rimDiameter;
  if (rimD !== undefined && rimD > 0) overall.toeAtRimMm = toeAtRim(overall.wheelSteerDeg, rimD);

  // Combined articulation is a grid (heave × roll) per candidate: computed only while it stays within bounds.
  const wantHoles = input.candidateHoles !== undefined || input.holeRange !== undefined;
  const gridPoints = table ? travels.length * table.at.length : 0;
  const combinedOn = table !== null && gridPoints * (1 + (wantHoles ? holes.length : 0)) <= COMBINED_MAX_EVALUATIONS;
  if (table && !combinedOn) {
    result.combinedSkipped = `${(gridPoints * (1 + holes.length)).toLocaleString("en-US")} heave × roll evaluations is more than ${COMBINED_MAX_EVALUATIONS.toLocaleString("en-US")}; use larger steps to see combined articulation`;
  }
  if (table && combinedOn) {
    const c = combinedWorst(link.ey, link.ez, link.l2, link.sgn, drag, heaveM, table, ayNow, azNow);
    if (!c) throw unreachable("a link", "under combined heave and roll");
    const wc: WorstCombined = { travel: c.travel, rollDeg: c.rollDeg, wheelSteerDeg: wheelSteerDeg(c.d, r, "under combined heave and roll"), dragLinkError: c.d };
    result.worst.combined = wc;
  }

  // The optimum on each end's hole line: same measure as the answer's heave and roll lists.
  const optimumOf = (end: "axle" | "frame"): OptimumResult => {
    const hint = end === "axle" ? (A.y !== F.y ? F.z + slope * (A.y - F.y) : undefined) : F.y !== A.y ? A.z - slope * (A.y - F.y) : undefined;
    const o = findOptimum(end, F, A, C, drag, r, heaveM, table, hint);
    const J = end === "axle" ? { y: A.y, z: o.z } : { y: F.y, z: o.z };
    const ol = end === "axle" ? makeLink(F, J, "lateral link") : makeLink(J, A, "lateral link");
    const az = (end === "axle" ? o.z : A.z) - C.z;
    const dh = worstOver(ol.ey, ol.ez, ol.l2, ol.sgn, drag, heaveM, ayNow, az).d;
    const dr = table ? worstOver(ol.ey, ol.ez, ol.l2, ol.sgn, drag, table, ayNow, az).d : Number.NaN;
    const dc = table && combinedOn ? combinedWorst(ol.ey, ol.ez, ol.l2, ol.sgn, drag, heaveM, table, ayNow, az) : null;
    const steerOrNull = (d: number) => (d === d && Math.abs(d) <= r ? Math.asin(d / r) * DEG : null);
    const currentWorst = Math.max(Math.abs(worstHeave.wheelSteerDeg), wr ? Math.abs(wr.wheelSteerDeg) : 0);
    return {
      end,
      y: J.y,
      z: o.z,
      worstWheelSteerDeg: Math.abs(Math.asin(o.d / r) * DEG),
      heaveWheelSteerDeg: Math.asin(dh / r) * DEG,
      rollWheelSteerDeg: table ? steerOrNull(dr) : null,
      combinedWheelSteerDeg: dc ? steerOrNull(dc.d) : null,
      barLength: Math.sqrt(ol.l2),
      currentWorstWheelSteerDeg: currentWorst,
      feasibleZ: { min: o.min, max: o.max },
    };
  };
  result.optimum = optimumOf("axle");
  result.optimumFrame = optimumOf("frame");

  if (wantHoles) {
    const rankBy = input.rankBy === "combined" && !combinedOn ? (table ? "heaveAndRoll" : "heave") : input.rankBy === "heaveAndRoll" && !table ? "heave" : (input.rankBy ?? "heave");
    result.rankBy = rankBy;
    const ranked: HoleResult[] = [];
    for (const hole of holes) {
      const hl = atFrame
        ? makeLink(hole, A, `lateral link with hole ${hole.label}`)
        : makeLink(F, hole, `lateral link with hole ${hole.label}`);
      const az = (atFrame ? A.z : hole.z) - C.z;
      const ay = (atFrame ? A.y : hole.y) - C.y;
      const wh = worstOver(hl.ey, hl.ez, hl.l2, hl.sgn, drag, heaveM, ay, az);
      if (wh.fail) {
        const name = wh.fail === "lateral link" ? `lateral link with hole ${hole.label}` : "drag link";
        throw unreachable(name, `at travel ${fmt(travels[wh.i]!, "mm")}${wh.fail === "drag link" ? ` (hole ${hole.label})` : ""}`);
      }
      const heaveSteer = wheelSteerDeg(wh.d, r, `with hole ${hole.label}`);
      let rollSteer: number | null = null;
      let combSteer: number | null = null;
      if (table) {
        const dr = worstOver(hl.ey, hl.ez, hl.l2, hl.sgn, drag, table, ay, az).d;
        rollSteer = dr === dr && Math.abs(dr) <= r ? Math.asin(dr / r) * DEG : null;
        if (combinedOn) {
          const dc = combinedWorst(hl.ey, hl.ez, hl.l2, hl.sgn, drag, heaveM, table, ay, az);
          combSteer = dc && Math.abs(dc.d) <= r ? Math.asin(dc.d / r) * DEG : null;
        }
      }
      // A hole whose link cannot reach in roll ranks last under a ranking that needs roll.
      const ranked1 =
        rankBy === "heave"
          ? heaveSteer
          : rankBy === "heaveAndRoll"
            ? rollSteer === null
              ? Number.POSITIVE_INFINITY
              : Math.abs(rollSteer) > Math.abs(heaveSteer)
                ? rollSteer
                : heaveSteer
            : (combSteer ?? Number.POSITIVE_INFINITY);
      ranked.push({
        y: hole.y,
        z: hole.z,
        label: hole.label,
        trackBarAngleDeg: atFrame ? linkAngleDeg(hole, A) : linkAngleDeg(F, hole),
        worstWheelSteerDeg: heaveSteer,
        rollWheelSteerDeg: rollSteer,
        combinedWheelSteerDeg: combSteer,
        rankedWheelSteerDeg: Number.isFinite(ranked1) ? ranked1 : null,
        rank: 0,
      });
    }
    // Array sort is stable, so equal steer keeps input order.
    const key = (h: HoleResult) => (h.rankedWheelSteerDeg === null ? Number.POSITIVE_INFINITY : Math.abs(h.rankedWheelSteerDeg));
    ranked.sort((a, b) => key(a) - key(b));
    ranked.forEach((h, k) => {
      h.rank = k + 1;
    });
    result.holes = ranked;
  }
  return result;
}
