// The steering-links calculator's form state and its translation into the steering API input.
// Pure and JSON-serialisable on purpose: a job's geometry step can keep a before/after state as it is and
// rebuild the request (or the screen) from it later. Lengths are text in the state's own unit system.
import { z } from "zod";
import { steeringRequestSchema, type SteeringRequest } from "@/lib/calc/steering-request";
import { convertText, fieldErrors, numberText, optionalNumberText, optionalQuantityText, quantityText, trimNumber, type FieldErrors, type UnitSystem } from "./values";
import { LIMITS } from "@/lib/geometry";
import { fromSI, preferredUnit } from "@/lib/units";

export type PointText = { y: string; z: string };
/** Which side of the vehicle a joint is on, as the person at the vehicle says it. */
export type Side = "driver" | "passenger";
/** A joint as a fabricator measures it: up from the floor, across from the vehicle's centre line, and which side. */
export type FloorText = { height: string; distance: string; side: Side };
export type Drive = "lhd" | "rhd";
export type HoleText = { id: string; label: string; y: string; z: string };

export type SteeringFormState = {
  version: 1;
  /** Lengths below are in mm (metric) or inches (imperial); a field may also carry its own unit (`3 1/4"`). */
  units: UnitSystem;
  frameEnd: PointText;
  axleEnd: PointText;
  pitmanEnd: PointText;
  knuckleEnd: PointText;
  axleCenter: PointText;
  steeringArmLength: string;
  /** Blank: no steering-wheel figures. */
  steeringRatio: string;
  travel: { bump: string; droop: string; step: string };
  roll: { on: boolean; maxDeg: string; stepDeg: string };
  holes: HoleText[];
  /** A column of holes every `pitch` from zMin to zMax on the line y (blank y: the y of the end it replaces). */
  holeColumn: { on: boolean; zMin: string; zMax: string; pitch: string; y: string };
  /** Which lateral-link end the candidate holes are for: a new axle bracket (usual) or a new frame bracket. */
  candidateEnd: "axle" | "frame";
  /** How the joints are entered: coordinates (y, z) or the measuring guide's floor heights and centre-line distances. */
  entry?: "coordinates" | "floor";
  /** Left- or right-hand drive: which side "driver's side" is. */
  drive?: Drive;
  floor?: Record<PointKey, FloorText>;
  /** Optional axle width (wheel-mount face to face), for the plausibility check of link lengths. */
  axleWidth?: string;
  /** Rim diameter for toe at the rim (blank: not shown). */
  rimDiameter?: string;
  rankBy?: "heave" | "heaveAndRoll" | "combined";
};

/**
 * Front view seen from ahead of the vehicle: its left side is on the drawing's right (+y). Left-hand drive puts
 * the driver's side on the vehicle's left, right-hand drive on its right, so the two mirror each other.
 */
export function sideSign(side: Side, drive: Drive): 1 | -1 {
  const driverIsPlus = drive === "lhd";
  return (side === "driver") === driverIsPlus ? 1 : -1;
}

/** Coordinates → floor entries: y's sign gives the side, z is the height (a floor datum is assumed). */
export function floorFromPoints(state: SteeringFormState, drive: Drive): Record<PointKey, FloorText> {
  const out = {} as Record<PointKey, FloorText>;
  for (const k of POINT_KEYS) {
    const y = state[k].y.trim();
    const negative = /^[-\u2212]/.test(y);
    const plusSide: Side = drive === "lhd" ? "driver" : "passenger";
    const minusSide: Side = plusSide === "driver" ? "passenger" : "driver";
    out[k] = { height: state[k].z, distance: y.replace(/^[-+\u2212]\s*/, ""), side: negative ? minusSide : plusSide };
  }
  return out;
}

export const emptyFloor = (): Record<PointKey, FloorText> => ({
  frameEnd: { height: "", distance: "", side: "driver" },
  axleEnd: { height: "", distance: "", side: "passenger" },
  pitmanEnd: { height: "", distance: "", side: "driver" },
  knuckleEnd: { height: "", distance: "", side: "passenger" },
  axleCenter: { height: "", distance: "0", side: "driver" },
});

export const POINT_KEYS = ["frameEnd", "axleEnd", "pitmanEnd", "knuckleEnd", "axleCenter"] as const;
export type PointKey = (typeof POINT_KEYS)[number];

export const POINT_LABELS: Record<PointKey, string> = {
  frameEnd: "Lateral link, frame end",
  axleEnd: "Lateral link, axle end",
  pitmanEnd: "Drag link, pitman arm end",
  knuckleEnd: "Drag link, steering arm end",
  axleCenter: "Axle roll centre",
};

/** Form field key → what to call it in the list of fields still to fix. */
export function steeringFieldLabel(key: string): string {
  const [head, a, b] = key.split(".");
  if (head === "floor" && a && a in POINT_LABELS) return `${POINT_LABELS[a as PointKey]}, ${b === "height" ? "height from the floor" : "distance from the centre line"}`;
  if (head && head in POINT_LABELS) return `${POINT_LABELS[head as PointKey]} ${a ?? ""}`.trim();
  if (head === "holes") return `Hole ${Number(a) + 1} ${b ?? ""}`.trim();
  const names: Record<string, string> = {
    steeringArmLength: "Steering arm length",
    steeringRatio: "Steering ratio",
    "travel.bump": "Bump",
    "travel.droop": "Droop",
    "travel.step": "Travel step",
    "roll.maxDeg": "Roll either way",
    "roll.stepDeg": "Roll step",
    "holeColumn.zMin": "Hole column, lowest z",
    "holeColumn.zMax": "Hole column, highest z",
    "holeColumn.pitch": "Hole column, pitch",
    "holeColumn.y": "Hole column, y",
    rimDiameter: "Rim diameter",
    holes: "Candidate holes",
    _: "Layout",
  };
  return names[key] ?? key;
}

const DIGITS = { metric: 2, imperial: 4 } as const;

/**
 * An invented lifted-truck layout in each unit system (round figures, not a converted copy), measured from the
 * floor and the centre line as the guide asks: the axle centre 16 in / 400 mm up.
 */
export function exampleSteeringForm(units: UnitSystem): SteeringFormState {
  const state = exampleCoordinates(units);
  return { ...state, entry: "floor", drive: "lhd", floor: floorFromPoints(state, "lhd") };
}

function exampleCoordinates(units: UnitSystem): SteeringFormState {
  if (units === "imperial") {
    return {
      version: 1,
      units,
      frameEnd: { y: "-16.5", z: "23" },
      axleEnd: { y: "19", z: "18.5" },
      pitmanEnd: { y: "-15.75", z: "22" },
      knuckleEnd: { y: "17.25", z: "19.75" },
      axleCenter: { y: "0", z: "16" },
      steeringArmLength: "6.25",
      steeringRatio: "16",
      travel: { bump: "4", droop: "4", step: "0.25" },
      roll: { on: true, maxDeg: "5", stepDeg: "0.5" },
      holes: [
        { id: "h1", label: "H1", y: "19", z: "18.5" },
        { id: "h2", label: "H2", y: "19", z: "19.5" },
        { id: "h3", label: "H3", y: "19", z: "20.5" },
        { id: "h4", label: "H4", y: "19", z: "21.5" },
      ],
      holeColumn: { on: false, zMin: "18", zMax: "23", pitch: "0.5", y: "" },
      candidateEnd: "axle",
    };
  }
  return {
    version: 1,
    units,
    frameEnd: { y: "-420", z: "580" },
    axleEnd: { y: "480", z: "460" },
    pitmanEnd: { y: "-400", z: "550" },
    knuckleEnd: { y: "440", z: "495" },
    axleCenter: { y: "0", z: "400" },
    steeringArmLength: "160",
    steeringRatio: "16",
    travel: { bump: "100", droop: "100", step: "5" },
    roll: { on: true, maxDeg: "5", stepDeg: "0.5" },
    holes: [
      { id: "h1", label: "H1", y: "480", z: "460" },
      { id: "h2", label: "H2", y: "480", z: "485" },
      { id: "h3", label: "H3", y: "480", z: "510" },
      { id: "h4", label: "H4", y: "480", z: "535" },
    ],
    holeColumn: { on: false, zMin: "450", zMax: "575", pitch: "12.5", y: "" },
    candidateEnd: "axle",
  };
}

/** A blank layout, entered through the measuring guide (floor and centre line) unless told otherwise. */
export function emptySteeringForm(units: UnitSystem, entry: "floor" | "coordinates" = "floor", drive: Drive = "lhd"): SteeringFormState {
  const p = { y: "", z: "" };
  return {
    version: 1,
    entry,
    drive,
    ...(entry === "floor" ? { floor: emptyFloor() } : {}),
    units,
    frameEnd: { ...p },
    axleEnd: { ...p },
    pitmanEnd: { ...p },
    knuckleEnd: { ...p },
    axleCenter: { y: "0", z: "0" },
    steeringArmLength: "",
    steeringRatio: "",
    travel: { bump: "", droop: "", step: "" },
    roll: { on: false, maxDeg: "", stepDeg: "" },
    holes: [],
    holeColumn: { on: false, zMin: "", zMax: "", pitch: "", y: "" },
    candidateEnd: "axle",
  };
}

/**
 * Floor entries → coordinates with the floor as z = 0 and the centre line as y = 0, in the state's units. A
 * joint whose height or distance does not read keeps its coordinates as they were.
 */
export function pointsFromFloor(state: SteeringFormState): Partial<Record<PointKey, PointText>> {
  const out: Partial<Record<PointKey, PointText>> = {};
  if (!state.floor) return out;
  const unit = preferredUnit("length", state.units);
  const t = (mm: number) => trimNumber(fromSI("length", mm, unit), DIGITS[state.units]);
  for (const k of POINT_KEYS) {
    const f = state.floor[k];
    const h = quantityText("length", unit, "height").safeParse(f.height);
    const d = quantityText("length", unit, "distance").safeParse(f.distance);
    if (h.success && d.success) out[k] = { y: t(sideSign(f.side, state.drive ?? "lhd") * Math.abs(d.data) + 0), z: t(h.data) };
  }
  return out;
}

/**
 * The same layout entered the other way: coordinates become floor heights and centre-line distances (their z
 * taken from the floor, their y from the centre line) and back, so switching never loses what was typed.
 */
export function withEntry(state: SteeringFormState, entry: "floor" | "coordinates"): SteeringFormState {
  const drive = state.drive ?? "lhd";
  const floorNow = state.entry === "floor" && state.floor !== undefined;
  if (entry === "floor") return floorNow ? state : { ...state, entry, drive, floor: floorFromPoints(state, drive) };
  return floorNow ? { ...state, ...pointsFromFloor(state), entry, drive } : { ...state, entry, drive };
}

/** What a job's capture keeps beside its input: the entry units, and the drive when it was measured from the floor. */
export function captureMeta(state: SteeringFormState): { unit: "mm" | "in"; drive?: Drive } {
  return { unit: state.units === "imperial" ? "in" : "mm", ...(state.entry === "floor" && state.floor ? { drive: state.drive ?? "lhd" } : {}) };
}

function capitalise(t: string): string {
  return t.charAt(0).toUpperCase() + t.slice(1);
}

/**
 * Checks a measured layout against what a vehicle can look like. Errors (a joint below the floor) are already
 * field errors; these are warnings that name what to re-measure, shown beside the results.
 */
export function plausibility(request: SteeringRequest, state: SteeringFormState): string[] {
  const out: string[] = [];
  const F = request.trackBar.frameEnd;
  const A = request.trackBar.axleEnd;
  const P = request.dragLink.pitmanEnd;
  const K = request.dragLink.knuckleEnd;
  const unit = preferredUnit("length", state.units);
  const t = (mm: number) => `${trimNumber(fromSI("length", mm, unit), DIGITS[state.units])} ${state.units === "imperial" ? "in" : "mm"}`;
  const lateral = Math.hypot(A.y - F.y, A.z - F.z);
  const dragL = Math.hypot(K.y - P.y, K.z - P.z);
  const width = state.axleWidth?.trim() ? quantityText("length", unit, "the axle width").safeParse(state.axleWidth) : null;
  if (width?.success) {
    if (lateral > width.data) out.push(`The lateral link (${t(lateral)} joint to joint) is longer than the axle (${t(width.data)}): check both distances from the centre line and their sides.`);
    if (dragL > width.data) out.push(`The drag link (${t(dragL)} joint to joint) is longer than the axle (${t(width.data)}): check both distances from the centre line and their sides.`);
  }
  if (Math.sign(A.y) === Math.sign(F.y) && A.y !== 0) out.push("Both lateral-link joints are on the same side of the centre line; a lateral link normally crosses the vehicle. Check the sides.");
  if (Math.sign(K.y) === Math.sign(P.y) && K.y !== 0) out.push("Both drag-link joints are on the same side of the centre line; check the sides.");
  if (state.entry === "floor") {
    for (const k of POINT_KEYS) {
      const p = k === "frameEnd" ? F : k === "axleEnd" ? A : k === "pitmanEnd" ? P : k === "knuckleEnd" ? K : request.axleCenter;
      if (p.z > 1500) out.push(`${POINT_LABELS[k]} is ${t(p.z)} above the floor: more than 1.5 m; check the reading.`);
    }
  }
  if (lateral < 300) out.push(`The lateral link is only ${t(lateral)} joint to joint; check the two joints.`);
  return out;
}

/** API path (trackBar.frameEnd.y, candidateHoles.2.z, holeRange.pitch…) → the form's field key. */
function formKey(path: string): string {
  return path
    .replace(/^trackBar\./, "")
    .replace(/^dragLink\./, "")
    .replace(/^candidateHoles/, "holes")
    .replace(/^holeRange/, "holeColumn");
}

export type SteeringRequestOutcome = { ok: true; request: SteeringRequest } | { ok: false; errors: FieldErrors };

/**
 * Form state → body of POST /api/calc/steering (mm, degrees), checked by the very schema the route uses.
 * Errors are keyed by the form's fields ("frameEnd.y", "holes.1.z", "travel.step"…).
 */
export function toSteeringRequest(state: SteeringFormState): SteeringRequestOutcome {
  // Every field is read on its own, and the route's schema then runs on what was read (a field that did
  // not read stands in as NaN, which that schema refuses on the same path). So a range error on one field
  // shows at the same time as a typo in another: nothing waits for something else to be fixed first.
  const errors: FieldErrors = {};
  const unit = preferredUnit("length", state.units);
  const read = <T>(key: string, schema: z.ZodType<T>, text: string): T | typeof Number.NaN => {
    const r = schema.safeParse(text);
    if (r.success) return r.data;
    errors[key] ??= fieldErrors(r.error.issues)._ ?? "Check this value.";
    return Number.NaN;
  };
  const len = (key: string, text: string, label: string) => read(key, quantityText("length", unit, label), text) as number;
  const floorMode = state.entry === "floor" && state.floor !== undefined;
  const drive = state.drive ?? "lhd";
  const point = (key: PointKey, label: string) => {
    if (floorMode) {
      const f = state.floor![key];
      const height = len(`floor.${key}.height`, f.height, `the height of ${label} from the floor`);
      const distance = len(`floor.${key}.distance`, f.distance, `the distance of ${label} from the centre line`);
      if (height < 0) errors[`floor.${key}.height`] ??= `${capitalise(label)} is below the floor: measure heights up from the floor.`;
      if (distance < 0) errors[`floor.${key}.distance`] ??= "Give the distance from the centre line as a positive length, and pick the side.";
      // `+ 0`: a joint on the centre line is y 0 whichever side was picked, not −0.
      return { y: sideSign(f.side, drive) * Math.abs(distance) + 0, z: height };
    }
    return {
      y: len(`${key}.y`, state[key].y, `${label} y`),
      z: len(`${key}.z`, state[key].z, `${label} z`),
    };
  };
  const ratio = read("steeringRatio", optionalNumberText("steering ratio"), state.steeringRatio) as number | undefined;
  const rim = read("rimDiameter", optionalQuantityText("length", unit), state.rimDiameter ?? "") as number | undefined;
  const column = state.holeColumn;
  const columnY = column.on ? (read("holeColumn.y", optionalQuantityText("length", unit), column.y) as number | undefined) : undefined;
  const frameEnd = point("frameEnd", "the frame end");
  const axleEnd = point("axleEnd", "the axle end");
  // Measured from the floor, a hole is a height on the end's own vertical line.
  const holeY = (i: number, text: string) => (floorMode ? (state.candidateEnd === "frame" ? frameEnd.y : axleEnd.y) : len(`holes.${i}.y`, text, "the hole y"));
  const request: SteeringRequest = {
    trackBar: { frameEnd, axleEnd },
    dragLink: { pitmanEnd: point("pitmanEnd", "the pitman end"), knuckleEnd: point("knuckleEnd", "the steering arm end") },
    axleCenter: point("axleCenter", "the roll centre"),
    steeringArmLength: len("steeringArmLength", state.steeringArmLength, "the steering arm length"),
    ...(ratio !== undefined ? { steeringRatio: ratio } : {}),
    travel: {
      bump: len("travel.bump", state.travel.bump, "the bump travel"),
      droop: len("travel.droop", state.travel.droop, "the droop travel"),
      step: len("travel.step", state.travel.step, "the travel step"),
    },
    ...(state.roll.on
      ? {
          roll: {
            maxDeg: read("roll.maxDeg", numberText("the roll angle"), state.roll.maxDeg) as number,
            stepDeg: read("roll.stepDeg", numberText("the roll step"), state.roll.stepDeg) as number,
          },
        }
      : {}),
    ...(state.holes.length
      ? {
          candidateHoles: state.holes.map((h, i) => {
            const label = h.label.trim() || `H${i + 1}`;
            // Said here in words: the library's own message for an over-long label reads "must be text".
            if (label.length > LIMITS.labelChars) errors[`holes.${i}.label`] ??= `Keep the label to ${LIMITS.labelChars} characters.`;
            return { y: holeY(i, h.y), z: len(`holes.${i}.z`, h.z, floorMode ? "the hole's height from the floor" : "the hole z"), label };
          }),
        }
      : {}),
    ...(column.on
      ? {
          holeRange: {
            zMin: len("holeColumn.zMin", column.zMin, "the lowest hole z"),
            zMax: len("holeColumn.zMax", column.zMax, "the highest hole z"),
            pitch: len("holeColumn.pitch", column.pitch, "the hole pitch"),
            ...(columnY !== undefined ? { y: columnY } : {}),
          },
        }
      : {}),
    ...(state.candidateEnd === "frame" ? { candidateEnd: "frame" as const } : {}),
    ...(state.rankBy && state.rankBy !== "heave" ? { rankBy: state.rankBy } : {}),
    ...(rim !== undefined ? { rimDiameter: rim } : {}),
  };
  const checked = steeringRequestSchema.safeParse(request);
  if (!checked.success) {
    for (const [key, message] of Object.entries(fieldErrors(checked.error.issues, formKey))) errors[key] ??= message;
  }
  if (Object.keys(errors).length) return { ok: false, errors };
  return { ok: true, request };
}

/** The other way: a stored request (mm) shown as a form in the given units, e.g. to reopen a job's geometry. */
export function fromSteeringRequest(request: SteeringRequest, units: UnitSystem): SteeringFormState {
  const unit = preferredUnit("length", units);
  const t = (mm: number) => trimNumber(fromSI("length", mm, unit), DIGITS[units]);
  const pt = (p: { y: number; z: number }): PointText => ({ y: t(p.y), z: t(p.z) });
  return {
    version: 1,
    units,
    frameEnd: pt(request.trackBar.frameEnd),
    axleEnd: pt(request.trackBar.axleEnd),
    pitmanEnd: pt(request.dragLink.pitmanEnd),
    knuckleEnd: pt(request.dragLink.knuckleEnd),
    axleCenter: pt(request.axleCenter),
    steeringArmLength: t(request.steeringArmLength),
    steeringRatio: request.steeringRatio === undefined ? "" : String(request.steeringRatio),
    travel: { bump: t(request.travel.bump), droop: t(request.travel.droop), step: t(request.travel.step) },
    roll: request.roll ? { on: true, maxDeg: String(request.roll.maxDeg), stepDeg: String(request.roll.stepDeg) } : { on: false, maxDeg: "", stepDeg: "" },
    holes: (request.candidateHoles ?? []).map((h, i) => ({ id: `h${i + 1}`, label: h.label ?? `H${i + 1}`, ...pt(h) })),
    holeColumn: request.holeRange
      ? { on: true, zMin: t(request.holeRange.zMin), zMax: t(request.holeRange.zMax), pitch: t(request.holeRange.pitch), y: request.holeRange.y === undefined ? "" : t(request.holeRange.y) }
      : { on: false, zMin: "", zMax: "", pitch: "", y: "" },
    candidateEnd: request.candidateEnd ?? "axle",
  };
}

/** Same layout, other units: every length field rewritten; a field that does not read stays as typed. */
export function convertSteeringForm(state: SteeringFormState, to: UnitSystem): SteeringFormState {
  if (state.units === to) return state;
  const c = (s: string) => convertText(s, "length", state.units, to, DIGITS);
  const pt = (p: PointText): PointText => ({ y: c(p.y), z: c(p.z) });
  return {
    ...state,
    units: to,
    frameEnd: pt(state.frameEnd),
    axleEnd: pt(state.axleEnd),
    pitmanEnd: pt(state.pitmanEnd),
    knuckleEnd: pt(state.knuckleEnd),
    axleCenter: pt(state.axleCenter),
    steeringArmLength: c(state.steeringArmLength),
    travel: { bump: c(state.travel.bump), droop: c(state.travel.droop), step: c(state.travel.step) },
    holes: state.holes.map((h) => ({ ...h, ...pt(h) })),
    holeColumn: { ...state.holeColumn, zMin: c(state.holeColumn.zMin), zMax: c(state.holeColumn.zMax), pitch: c(state.holeColumn.pitch), y: c(state.holeColumn.y) },
    ...(state.floor
      ? { floor: Object.fromEntries(POINT_KEYS.map((k) => [k, { ...state.floor![k], height: c(state.floor![k].height), distance: c(state.floor![k].distance) }])) as Record<PointKey, FloorText> }
      : {}),
    ...(state.axleWidth !== undefined ? { axleWidth: c(state.axleWidth) } : {}),
    ...(state.rimDiameter !== undefined ? { rimDiameter: c(state.rimDiameter) } : {}),
  };
}
