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
}

export interface HoleResult {
  y: number;
  z: number;
  label: string;
  /** Lateral-link angle with this hole, same convention as trackBarAngleDeg. */
  trackBarAngleDeg: number;
  /** Signed wheel steer at the heave point of largest |steer| (roll is not part of the ranking). */
  worstWheelSteerDeg: number;
  /** 1 = best (smallest |worstWheelSteerDeg|); ties keep input order. */
  rank: number;
}

export interface SteeringResult {
  trackBarAngleDeg: number;
  dragLinkAngleDeg: number;
  /** dragLinkAngleDeg − trackBarAngleDeg, wrapped to (−90, 90]. */
  angleDifferenceDeg: number;
  heave: HeavePoint[];
  /** Empty when no roll sweep was asked for. */
  roll: RollPoint[];
  worst: { heave: WorstHeave; roll: WorstRoll | null; overall: WorstOverall };
  /** Present when candidates were given; sorted best first. */
  holes?: HoleResult[];
  /**
   * Height z on the hole line (holeRange.y, else the candidate end's current y) at which the lateral
   * link is parallel to the drag link. Absent when that line passes through the other end.
   */
  parallelHeightZ?: number;
}
