/** Front view, millimetres, frame-fixed axes: y lateral, z up; the origin is the caller's choice. */
export interface Point2 {
  y: number;
  z: number;
}

export interface CandidateHole extends Point2 {
  label?: string | undefined;
}

export interface SteeringInput {
  /** Lateral link (track bar): frame end F, axle end A. */
  trackBar: { frameEnd: Point2; axleEnd: Point2 };
  /** Drag link: pitman end P (frame-fixed), steering-arm end K (moves with the axle). */
  dragLink: { pitmanEnd: Point2; knuckleEnd: Point2 };
  /** Roll centre of the axle body for the roll sweep. */
  axleCenter: Point2;
  /** Steering-arm length r, mm: turns the drag-link error d into wheel steer asin(d / r). */
  steeringArmLength: number;
  /** Steering-wheel degrees per road-wheel degree; when given, heave points carry steeringWheelDeg. */
  steeringRatio?: number | undefined;
  /** Heave from −droop to +bump (both ≥ 0, mm), positive travel = bump (axle toward the frame). */
  travel: { bump: number; droop: number; step: number };
  /** Roll from −maxDeg to +maxDeg about axleCenter. */
  roll?: { maxDeg: number; stepDeg: number } | undefined;
  /**
   * Candidate positions (at ride height) for the link end named by candidateEnd, by default the AXLE
   * end: the new bracket is welded on the housing. Each candidate gets its own bar length |hole − other
   * end|, as an adjustable bar is re-set to centre the axle at ride height.
   */
  candidateHoles?: CandidateHole[] | undefined;
  /** Holes every `pitch` from zMin up to zMax on the vertical line y (default: the current end's y). */
  holeRange?: { zMin: number; zMax: number; pitch: number; y?: number | undefined } | undefined;
  /** Which lateral-link end the candidates replace; "frame" is the frame-bracket variant. */
  candidateEnd?: "axle" | "frame" | undefined;
  /**
   * What orders the candidate holes: the largest |wheel steer| over the heave sweep (default), over the heave
   * and roll sweeps' points, or over combined articulation (every heave point at every roll angle).
   */
  rankBy?: "heave" | "heaveAndRoll" | "combined" | undefined;
  /** Rim diameter, mm: when given, wheel steer is also given as toe at the rim, D·sin(steer). */
  rimDiameter?: number | undefined;
}

export interface HeavePoint {
  /** mm, + = bump. */
  travel: number;
  /** Lateral move s of the axle forced by the lateral link, mm, + = toward +y. */
  axleShift: number;
  /** Lateral move d the drag link forces on the arm end relative to the axle, mm, + = toward +y. */
  dragLinkError: number;
  /** asin(d / r), degrees; + = the arm end pushed toward +y. */
  wheelSteerDeg: number;
  steeringWheelDeg?: number;
}

export interface RollPoint {
  /** Degrees, + = counter-clockwise seen from the front (+y side rises). */
  rollDeg: number;
  axleShift: number;
  dragLinkError: number;
  wheelSteerDeg: number;
}

export interface WorstHeave {
  travel: number;
  wheelSteerDeg: number;
  dragLinkError: number;
}

export interface WorstRoll {
  rollDeg: number;
  wheelSteerDeg: number;
  dragLinkError: number;
}

export interface WorstOverall {
  /** Which sweep holds the largest |wheel steer|; heave wins a tie. */
  source: "heave" | "roll";
  /** The travel (mm) or roll angle (deg) where it occurs. */
  at: number;
  wheelSteerDeg: number;
  dragLinkError: number;
  steeringWheelDeg?: number;
  /** D·sin(wheel steer), mm, when a rim diameter D was given: how far the rim's front edge moves against its back. */
  toeAtRimMm?: number;
}

export interface HoleResult {
  y: number;
  z: number;
  label: string;
  /** Lateral-link angle with this hole, same convention as trackBarAngleDeg. */
  trackBarAngleDeg: number;
  /** Signed wheel steer at the heave point of largest |steer|. */
  worstWheelSteerDeg: number;
  /** Signed wheel steer at the roll point of largest |steer|; null without a roll sweep. */
  rollWheelSteerDeg: number | null;
  /** Signed wheel steer of largest |steer| over every heave point at every roll angle; null when not computed. */
  combinedWheelSteerDeg: number | null;
  /** The figure the ranking used (by rankBy), signed; null when the link cannot reach somewhere that ranking needs. */
  rankedWheelSteerDeg: number | null;
  /** 1 = best (smallest |rankedWheelSteerDeg|); ties keep input order. */
  rank: number;
}

/**
 * The height on a vertical hole line that minimises the largest |wheel steer| over every point the answer
 * lists in `heave` and in `roll` (each taken on its own, as those arrays are), the bar re-set to each height's
 * own length. Found by a dense scan of the feasible heights, then nested finer scans around the best.
 */
export interface OptimumResult {
  /** Which lateral-link end moves on the line: "axle" = a new axle bracket, "frame" = a new frame bracket. */
  end: "axle" | "frame";
  /** The hole line: y of the current joint of that end. */
  y: number;
  /** The best height, mm. */
  z: number;
  /** That largest |wheel steer|, degrees, ≥ 0. */
  worstWheelSteerDeg: number;
  /** Signed worst over heave alone, over roll alone (null without roll), over combined articulation (null when not computed). */
  heaveWheelSteerDeg: number;
  rollWheelSteerDeg: number | null;
  combinedWheelSteerDeg: number | null;
  /** Link length with the joint there, mm. */
  barLength: number;
  /** The same measure for the joint where it is now (to say how much better the optimum is), ≥ 0. */
  currentWorstWheelSteerDeg: number;
  /** Heights on the line where the link reaches at every listed point with steer within the arm. */
  feasibleZ: { min: number; max: number };
}

export interface WorstCombined {
  travel: number;
  rollDeg: number;
  wheelSteerDeg: number;
  dragLinkError: number;
}

export interface SteeringResult {
  trackBarAngleDeg: number;
  dragLinkAngleDeg: number;
  /** dragLinkAngleDeg − trackBarAngleDeg, wrapped to (−90, 90]. */
  angleDifferenceDeg: number;
  heave: HeavePoint[];
  /** Empty when no roll sweep was asked for. */
  roll: RollPoint[];
  worst: {
    heave: WorstHeave;
    roll: WorstRoll | null;
    overall: WorstOverall;
    /** Every heave point at every roll angle: null without roll, or when the grid is over the work limit. */
    combined: WorstCombined | null;
  };
  /** Why combined articulation was not computed, when roll was asked for but the grid was too large. */
  combinedSkipped?: string;
  /** The ranking's measure (rankBy as applied: "combined" falls back to "heaveAndRoll" when skipped). */
  rankBy?: "heave" | "heaveAndRoll" | "combined";
  /** Best axle-end height on the vertical through the current axle end. */
  optimum: OptimumResult;
  /** Best frame-end height on the vertical through the current frame end (raising the frame end instead). */
  optimumFrame: OptimumResult;
  /** Present when candidates were given; sorted best first. */
  holes?: HoleResult[];
  /**
   * Height z on the hole line (holeRange.y, else the candidate end's current y) at which the lateral
   * link is parallel to the drag link. Absent when that line passes through the other end.
   */
  parallelHeightZ?: number;
}
