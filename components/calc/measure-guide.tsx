// The measuring guide: one drawing per joint of the steering links, front view of a solid-axle truck seen from
// ahead, with the joint to measure ringed and the two tapes drawn: up from the floor to the joint's centre,
// and across from the vehicle's centre line. Shapes and words carry the meaning, not colour.
import { useState } from "react";
import { Segmented } from "./fields";
import { POINT_LABELS, withEntry, type FloorText, type PointKey, type SteeringFormState } from "./steering-request";

export const GUIDE_ORDER: readonly PointKey[] = ["frameEnd", "axleEnd", "pitmanEnd", "knuckleEnd", "axleCenter"];

export const GUIDE_TEXT: Record<PointKey, { title: string; what: string; tape: string }> = {
  frameEnd: {
    title: "Lateral link, frame end",
    what: "The centre of the bolt through the lateral link's bushing at the frame bracket.",
    tape: "Tape straight up from the floor to the bolt centre; then across, level, from the centre line (a plumb line or chalk line midway between the frame rails) to the bolt centre.",
  },
  axleEnd: {
    title: "Lateral link, axle end",
    what: "The centre of the bolt through the lateral link's bushing at the axle bracket, on the other side of the vehicle.",
    tape: "Up from the floor to the bolt centre, then across from the centre line. This is the joint a new bracket moves.",
  },
  pitmanEnd: {
    title: "Drag link, pitman arm end",
    what: "The centre of the ball joint where the drag link meets the pitman arm under the steering box, wheels straight ahead.",
    tape: "Up from the floor to the ball's centre (half-way up its housing), then across from the centre line.",
  },
  knuckleEnd: {
    title: "Drag link, steering arm end",
    what: "The centre of the ball joint where the drag link meets the steering arm on the knuckle.",
    tape: "Up from the floor to the ball's centre, then across from the centre line.",
  },
  axleCenter: {
    title: "Axle roll centre",
    what: "The point the axle turns about when the body rolls; without better knowledge, the middle of the axle tube at the centre line.",
    tape: "Up from the floor to the middle of the tube; across is usually 0 (on the centre line).",
  },
};

// Schematic positions (drawing units, y right, z up) of each joint on the guide's truck.
const SPOT: Record<PointKey, { x: number; y: number }> = {
  frameEnd: { x: 95, y: 150 },
  axleEnd: { x: 300, y: 95 },
  pitmanEnd: { x: 110, y: 170 },
  knuckleEnd: { x: 285, y: 112 },
  axleCenter: { x: 200, y: 80 },
};

const INK = "#171b1a";
const SOFT = "#7b8380";

export function MeasureGuideDrawing({ point, className = "" }: { point: PointKey; className?: string }) {
  const p = SPOT[point];
  const Y = (v: number) => 230 - v; // z up on paper
  const floor = 215;
  const cl = 200;
  const text = GUIDE_TEXT[point];
  return (
    <svg viewBox="0 0 400 240" className={`h-auto w-full rounded-md border-2 border-graphite-200 bg-white ${className}`} role="img" aria-label={`Where to measure: ${text.title}. ${text.what}`} data-testid={`guide-drawing-${point}`}>
      {/* floor, hatched */}
      <line x1={10} y1={floor} x2={390} y2={floor} stroke={INK} strokeWidth={2.5} />
      {Array.from({ length: 19 }, (_, i) => (
        <line key={i} x1={14 + i * 20} y1={floor + 2} x2={4 + i * 20} y2={floor + 12} stroke={SOFT} strokeWidth={1.2} />
      ))}
      {/* centre line */}
      <line x1={cl} y1={12} x2={cl} y2={floor} stroke={INK} strokeWidth={1.2} strokeDasharray="10 4 2 4" />
      <text x={cl + 4} y={22} fontSize={11} fill={INK}>centre line</text>
      {/* wheels and tyres */}
      {[30, 330].map((x) => (
        <g key={x}>
          <rect x={x} y={Y(150)} width={40} height={135} rx={10} fill="#e7e9e8" stroke={INK} strokeWidth={2} />
          <rect x={x + 10} y={Y(105)} width={20} height={50} fill="#ffffff" stroke={INK} strokeWidth={1.2} />
        </g>
      ))}
      {/* axle tube and diff */}
      <rect x={70} y={Y(92)} width={260} height={24} fill="#e7e9e8" stroke={INK} strokeWidth={2} />
      <circle cx={215} cy={Y(80)} r={28} fill="#e7e9e8" stroke={INK} strokeWidth={2} />
      {/* frame rails */}
      {[120, 280].map((x) => (
        <rect key={x} x={x - 12} y={Y(200)} width={24} height={30} fill="#cdd1cf" stroke={INK} strokeWidth={2} />
      ))}
      {/* links: lateral solid, drag outlined */}
      <line x1={SPOT.frameEnd.x} y1={Y(SPOT.frameEnd.y)} x2={SPOT.axleEnd.x} y2={Y(SPOT.axleEnd.y)} stroke={INK} strokeWidth={6} strokeLinecap="round" />
      <line x1={SPOT.pitmanEnd.x} y1={Y(SPOT.pitmanEnd.y)} x2={SPOT.knuckleEnd.x} y2={Y(SPOT.knuckleEnd.y)} stroke={INK} strokeWidth={8} strokeLinecap="round" />
      <line x1={SPOT.pitmanEnd.x} y1={Y(SPOT.pitmanEnd.y)} x2={SPOT.knuckleEnd.x} y2={Y(SPOT.knuckleEnd.y)} stroke="#f1f6cf" strokeWidth={3.5} strokeLinecap="round" />
      {(Object.keys(SPOT) as PointKey[]).map((k) => (
        <circle key={k} cx={SPOT[k].x} cy={Y(SPOT[k].y)} r={4} fill={k === point ? INK : "#ffffff"} stroke={INK} strokeWidth={1.5} />
      ))}
      {/* the joint to measure: double ring */}
      <circle cx={p.x} cy={Y(p.y)} r={11} fill="none" stroke={INK} strokeWidth={2.5} />
      <circle cx={p.x} cy={Y(p.y)} r={16} fill="none" stroke={INK} strokeWidth={1} strokeDasharray="3 2" />
      {/* tape up from the floor */}
      <g data-testid="guide-tape-height">
        <line x1={p.x} y1={floor} x2={p.x} y2={Y(p.y) + 12} stroke={INK} strokeWidth={1.5} />
        <path d={`M${p.x - 5} ${Y(p.y) + 20} l5 -8 l5 8 Z M${p.x - 5} ${floor - 8} l5 8 l5 -8 Z`} fill={INK} />
        <text x={p.x + 6} y={(floor + Y(p.y)) / 2 + 20} fontSize={12} fontWeight={700} fill={INK} paintOrder="stroke" stroke="#ffffff" strokeWidth={4}>height</text>
      </g>
      {/* tape across from the centre line */}
      {Math.abs(p.x - cl) > 4 ? (
        <g data-testid="guide-tape-across">
          <line x1={cl} y1={Y(p.y) - 22} x2={p.x} y2={Y(p.y) - 22} stroke={INK} strokeWidth={1.5} />
          <line x1={p.x} y1={Y(p.y) - 28} x2={p.x} y2={Y(p.y) - 14} stroke={INK} strokeWidth={1} />
          <text x={(cl + p.x) / 2} y={Y(p.y) - 27} fontSize={12} fontWeight={700} textAnchor="middle" fill={INK} paintOrder="stroke" stroke="#ffffff" strokeWidth={4}>from centre line</text>
        </g>
      ) : (
        <text x={cl + 8} y={Y(p.y) - 20} fontSize={12} fontWeight={700} fill={INK}>on the centre line: 0</text>
      )}
      <text x={12} y={236} fontSize={10} fill={INK}>Seen from ahead of the vehicle, at ride height, on a level floor.</text>
    </svg>
  );
}

/** Draws a length field (label, text, setter) the way the screen using the guide draws its own, errors and all. */
export type LengthFieldRenderer = (key: string, label: string, value: string, set: (v: string) => void, opts?: { hint?: React.ReactNode; signed?: boolean }) => React.ReactNode;

/**
 * The step-by-step measuring guide: one joint at a time with its drawing, where the tape goes, its height from
 * the floor, its distance from the centre line and its side; the list of joints measured so far. The calculator
 * and a job's geometry step on the runner both use it, so a joint is measured the same way in both.
 */
export function MeasureGuide({ floor, onState, state, lengthField }: { floor: Record<PointKey, FloorText>; state: SteeringFormState; onState: (next: SteeringFormState) => void; lengthField: LengthFieldRenderer }) {
  const [step, onStep] = useState(0);
  const i = Math.max(0, Math.min(step, GUIDE_ORDER.length - 1));
  const key = GUIDE_ORDER[i]!;
  const f = floor[key];
  const text = GUIDE_TEXT[key];
  const setF = (patch: Partial<FloorText>) => onState({ ...state, floor: { ...floor, [key]: { ...f, ...patch } } });
  return (
    <fieldset className="card space-y-3 p-4" data-testid="measure-guide">
      <legend className="px-1 text-lg font-bold">Measuring guide</legend>
      <div className="space-y-3">
        <p className="text-sm font-semibold text-graphite-700" data-testid="guide-step">Point {i + 1} of {GUIDE_ORDER.length}</p>
        <h4 className="text-lg font-bold" data-testid="guide-title">{text.title}</h4>
        <MeasureGuideDrawing point={key} />
        <p className="text-sm text-graphite-950">{text.what}</p>
        <p className="text-sm text-graphite-700">{text.tape} Vehicle at ride height on a level floor, wheels straight ahead. Any mix of units reads: <span className="figures">12 3/8 in</span>, <span className="figures">12-3/8&quot;</span>, <span className="figures">314 mm</span>.</p>
        <div className="grid grid-cols-2 gap-x-3">
          {lengthField(`floor.${key}.height`, "Height from the floor", f.height, (v) => setF({ height: v }), { signed: false })}
          {lengthField(`floor.${key}.distance`, "From the centre line", f.distance, (v) => setF({ distance: v }), { signed: false })}
        </div>
        <Segmented
          legend="On the"
          testId={`st-floor-${key}-side`}
          value={f.side}
          onChange={(side) => setF({ side })}
          options={[
            { value: "driver", label: "driver's side" },
            { value: "passenger", label: "passenger side" },
          ]}
        />
        <div className="flex flex-wrap gap-2">
          <button type="button" className="btn btn-quiet" data-testid="guide-back" disabled={i === 0} onClick={() => onStep(Math.max(0, i - 1))}>
            <span aria-hidden="true">◀</span> Back
          </button>
          <button type="button" className="btn btn-primary" data-testid="guide-next" disabled={i >= GUIDE_ORDER.length - 1} onClick={() => onStep(Math.min(GUIDE_ORDER.length - 1, i + 1))}>
            Next point <span aria-hidden="true">▶</span>
          </button>
        </div>
        <ol className="grid gap-1 text-sm" aria-label="Points measured">
          {GUIDE_ORDER.map((k, j) => {
            const p = floor[k];
            const done = p.height.trim() !== "" && p.distance.trim() !== "";
            return (
              <li key={k}>
                <button type="button" className={`flex min-h-12 w-full items-center gap-2 rounded-md px-2 text-left ${j === i ? "bg-graphite-100 font-bold" : ""}`} onClick={() => onStep(j)}>
                  <span aria-hidden="true">{done ? "●" : "○"}</span>
                  {POINT_LABELS[k]}
                  <span className="figures ml-auto text-graphite-700">{done ? `${p.height} up · ${/^0*(\.0*)?$/.test(p.distance.trim()) ? "on the centre line" : `${p.distance} ${p.side === "driver" ? "driver" : "passenger"}`}` : "to measure"}</span>
                </button>
              </li>
            );
          })}
        </ol>
        {lengthField("axleWidth", "Axle width (optional)", state.axleWidth ?? "", (v) => onState({ ...state, axleWidth: v }), { signed: false, hint: "wheel-mount face to face, for the length check" })}
      </div>
    </fieldset>
  );
}

/** How the joints are entered (the guide or coordinates) and, for the guide, which side the driver sits. */
export function EntryChoice({ state, onState }: { state: SteeringFormState; onState: (next: SteeringFormState) => void }) {
  const floorMode = state.entry === "floor" && state.floor !== undefined;
  return (
    <>
      <Segmented
        legend="Enter the joints as"
        testId="steer-entry"
        value={floorMode ? "floor" : "coordinates"}
        onChange={(entry) => onState(withEntry(state, entry))}
        options={[
          { value: "floor", label: "Floor and centre line" },
          { value: "coordinates", label: "Coordinates" },
        ]}
      />
      {floorMode ? (
        <Segmented
          legend="The vehicle is"
          testId="steer-drive"
          value={state.drive ?? "lhd"}
          onChange={(drive) => onState({ ...state, drive })}
          options={[
            { value: "lhd", label: "Left-hand drive" },
            { value: "rhd", label: "Right-hand drive" },
          ]}
        />
      ) : null}
    </>
  );
}
