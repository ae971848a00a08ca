// The measuring guide: one drawing per joint of the steering links, front view of a solid-axle truck seen from
// ahead, with the joint to measure ringed and the two tapes drawn: up from the floor to the joint's centre,
// and across from the vehicle's centre line. Shapes and words carry the meaning, not colour.
import type { PointKey } from "./steering-request";

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
