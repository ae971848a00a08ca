"use client";
import type { HoleResult, OptimumResult, Point2, SteeringInput, SteeringResult } from "@/lib/geometry";
import { fromSI, preferredUnit } from "@/lib/units";
import { figure, shown, type UnitSystem } from "@/components/calc/values";
import { poseAt, type Pose } from "./pose";

// Front view drawn to scale: one SVG unit is one millimetre (svg x = y, svg y = −z), so the axle moves on
// screen by exactly the travel it is at. The frame is fixed; everything on the axle moves with the pose.

const TUBE_R = 38; // Ø 76 mm housing tube: a drawing aid only, not an input
const INK = "#171b1a";
const GHOST = "#a8aeab";

type Box = { minY: number; maxY: number; minZ: number; maxZ: number };

function housingOf(input: SteeringInput, holes: readonly Point2[]) {
  // A solid axle runs wheel to wheel, wider than both links: span every point of the layout.
  const ys = [
    input.trackBar.axleEnd.y,
    input.trackBar.frameEnd.y,
    input.dragLink.knuckleEnd.y,
    input.dragLink.pitmanEnd.y,
    input.axleCenter.y,
    ...holes.map((h) => h.y),
  ];
  return { y0: Math.min(...ys) - 70, y1: Math.max(...ys) + 70, z: input.axleCenter.z };
}

function rect(y0: number, y1: number, z0: number, z1: number): Point2[] {
  return [
    { y: y0, z: z0 },
    { y: y1, z: z0 },
    { y: y1, z: z1 },
    { y: y0, z: z1 },
  ];
}

const path = (pts: readonly Point2[]) => pts.map((p, i) => `${i ? "L" : "M"}${p.y.toFixed(2)} ${(-p.z).toFixed(2)}`).join(" ") + " Z";

function axleBodies(input: SteeringInput, axleHoles: readonly Point2[]) {
  const h = housingOf(input, axleHoles);
  const A = input.trackBar.axleEnd;
  const K = input.dragLink.knuckleEnd;
  const plateYs = [A.y, ...axleHoles.map((p) => p.y)];
  const plateZs = [A.z, ...axleHoles.map((p) => p.z)];
  const up = Math.max(...plateZs) >= h.z;
  const plateTop = up ? Math.max(...plateZs) + 20 : Math.min(...plateZs) - 20;
  return {
    tube: rect(h.y0, h.y1, h.z - TUBE_R, h.z + TUBE_R),
    plate: rect(Math.min(...plateYs) - 22, Math.max(...plateYs) + 22, h.z, plateTop),
    arm: rect(K.y - 14, K.y + 14, h.z, K.z + (K.z >= h.z ? 16 : -16)),
  };
}

function bounds(points: readonly Point2[]): Box {
  const b: Box = { minY: Infinity, maxY: -Infinity, minZ: Infinity, maxZ: -Infinity };
  for (const p of points) {
    b.minY = Math.min(b.minY, p.y);
    b.maxY = Math.max(b.maxY, p.y);
    b.minZ = Math.min(b.minZ, p.z);
    b.maxZ = Math.max(b.maxZ, p.z);
  }
  return b;
}

const NICE_MM = [25, 50, 100, 200, 250, 500, 1000];
const NICE_IN = [1, 2, 4, 6, 12, 24, 48];

function scaleBar(widthMm: number, units: UnitSystem) {
  const target = widthMm / 6;
  if (units === "imperial") {
    const inches = NICE_IN.reduce((a, b) => (Math.abs(b * 25.4 - target) < Math.abs(a * 25.4 - target) ? b : a));
    return { mm: inches * 25.4, label: `${inches} in` };
  }
  const mm = NICE_MM.reduce((a, b) => (Math.abs(b - target) < Math.abs(a - target) ? b : a));
  return { mm, label: `${mm} mm` };
}

function FrameMount({ at, k, id }: { at: Point2; k: number; id: string }) {
  const top = -(at.z + 34 * k);
  const w = 34 * k;
  return (
    <g aria-hidden="true" data-testid={`${id}-mount`}>
      <line x1={at.y} y1={-at.z} x2={at.y} y2={top} stroke={INK} strokeWidth={2} vectorEffect="non-scaling-stroke" />
      <line x1={at.y - w} y1={top} x2={at.y + w} y2={top} stroke={INK} strokeWidth={3} vectorEffect="non-scaling-stroke" />
      {[-0.75, -0.25, 0.25, 0.75].map((f) => (
        <line key={f} x1={at.y + f * w} y1={top} x2={at.y + f * w + 9 * k} y2={top - 9 * k} stroke={INK} strokeWidth={1.5} vectorEffect="non-scaling-stroke" />
      ))}
    </g>
  );
}

export function SteeringDiagram({
  input,
  result,
  pose,
  units,
  bestHole,
  optimum,
}: {
  input: SteeringInput;
  result: SteeringResult;
  pose: Pose;
  units: UnitSystem;
  bestHole: HoleResult | undefined;
  /** The best height on the hole line, marked "drill here" (carried by the axle when it is an axle-end hole). */
  optimum?: OptimumResult;
}) {
  const F = input.trackBar.frameEnd;
  const A = input.trackBar.axleEnd;
  const P = input.dragLink.pitmanEnd;
  const K = input.dragLink.knuckleEnd;
  const C = input.axleCenter;
  const onFrame = input.candidateEnd === "frame";
  const holes = result.holes ?? [];
  const axleHoles = onFrame ? [] : holes;
  const body = axleBodies(input, axleHoles);
  const plateRight = body.plate[1]!.y;
  const isAxleEnd = (h: Point2) => !onFrame && Math.abs(h.y - A.y) < 1e-6 && Math.abs(h.z - A.z) < 1e-6;
  const axleEndIsHole = holes.some(isAxleEnd);

  // The view box holds every pose of both sweeps, so it never jumps while the slider moves.
  const extremes: Pose[] = [];
  const ride = poseAt(input, result, "heave", result.heave.findIndex((p) => p.travel === 0));
  for (const p of [poseAt(input, result, "heave", 0), poseAt(input, result, "heave", result.heave.length - 1), poseAt(input, result, "roll", 0), poseAt(input, result, "roll", result.roll.length - 1), ride]) {
    if (p) extremes.push(p);
  }
  const opt = optimum ? { y: optimum.y, z: optimum.z } : null;
  const optOnAxle = optimum?.end === "axle";
  const carried = [...body.tube, ...body.plate, ...body.arm, A, K, ...axleHoles, ...(opt && optOnAxle ? [opt] : [])];
  const all: Point2[] = [F, P, C, ...(onFrame ? holes : []), ...(opt && !optOnAxle ? [opt] : [])];
  for (const e of extremes) for (const q of carried) all.push(e.carry(q));
  const b = bounds(all);
  const width0 = b.maxY - b.minY;
  const pad = Math.max(60, width0 * 0.07);
  // Room on the right for the hole labels, which are written beside the bracket.
  const padRight = pad + (holes.length ? Math.max(160, width0 * 0.24) : 0);
  let minZ = b.minZ - pad;
  let maxZ = b.maxZ + pad + 40;
  const width = width0 + pad + padRight;
  // A flat layout still gets room for labels above and below.
  const minHeight = width * 0.42;
  if (maxZ - minZ < minHeight) {
    const grow = (minHeight - (maxZ - minZ)) / 2;
    minZ -= grow;
    maxZ += grow;
  }
  const height = maxZ - minZ;
  // mm per CSS pixel at a 640 px wide drawing (about what it gets beside the ranking, tablet to desktop): sizes
  // text and marks so the labels stay readable there.
  const k = width / 640;
  const font = 14 * k;

  const at = pose.carry;
  const A1 = at(A);
  const Krigid = at(K);
  const K1 = { y: Krigid.y + pose.dragLinkError, z: Krigid.z };
  const moved = pose.at !== 0;
  const bar = scaleBar(width, units);
  const lenUnit = preferredUnit("length", units);
  const atText =
    pose.mode === "heave"
      ? `${pose.at === 0 ? "ride height" : `${figure(fromSI("length", pose.at, lenUnit), units === "imperial" ? 2 : 0, { sign: true })} ${units === "imperial" ? "in" : "mm"} ${pose.at > 0 ? "bump" : "droop"}`}`
      : `${figure(pose.at, 1, { sign: true })}° roll`;
  const steerText = `${figure(pose.wheelSteerDeg, 2, { sign: true })}° wheel steer`;
  const errorText = `arm end moved ${shown("length", pose.dragLinkError, units, { metric: 2, imperial: 3 }, { sign: true })}`;

  const title = `Front view at ${atText}`;
  const desc = `Lateral link from the frame end to the axle end, drag link from the pitman arm to the steering arm, axle moved ${shown("length", pose.axleShift, units, { metric: 1, imperial: 3 }, { sign: true })} sideways; ${errorText}, ${steerText}.`;

  const pivot = (p: Point2, testId: string, filled = false) => (
    <circle data-testid={testId} cx={p.y} cy={-p.z} r={6 * k} fill={filled ? INK : "#ffffff"} stroke={INK} strokeWidth={2} vectorEffect="non-scaling-stroke" />
  );
  const label = (p: Point2, text: string, dy: number, anchor: "start" | "middle" | "end" = "middle", bold = false) => (
    <text x={p.y} y={-p.z + dy * k} fontSize={font} textAnchor={anchor} fill={INK} fontWeight={bold ? 700 : 500} paintOrder="stroke" stroke="#ffffff" strokeWidth={4 * k} strokeLinejoin="round">
      {text}
    </text>
  );

  return (
    <svg
      viewBox={`${b.minY - pad} ${-maxZ} ${width} ${height}`}
      className="h-auto max-h-[28rem] w-full rounded-md border-2 border-graphite-200 bg-white"
      role="img"
      aria-labelledby="steer-svg-title steer-svg-desc"
      data-testid="steering-diagram"
      data-mode={pose.mode}
      data-at={pose.at}
      preserveAspectRatio="xMidYMid meet"
    >
      <title id="steer-svg-title">{title}</title>
      <desc id="steer-svg-desc">{desc}</desc>
      <defs>
        <pattern id="steer-hatch" width={10 * k} height={10 * k} patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <line x1={0} y1={0} x2={0} y2={10 * k} stroke="#7b8380" strokeWidth={2 * k} />
        </pattern>
      </defs>

      {/* Ride height, as a ghost, whenever the axle is somewhere else. */}
      {moved ? (
        <g data-testid="ride-ghost" opacity={0.9}>
          <path d={path(body.tube)} fill="none" stroke={GHOST} strokeWidth={1.5} strokeDasharray="6 4" vectorEffect="non-scaling-stroke" />
          <line x1={F.y} y1={-F.z} x2={A.y} y2={-A.z} stroke={GHOST} strokeWidth={3} strokeDasharray="6 4" vectorEffect="non-scaling-stroke" />
          <line x1={P.y} y1={-P.z} x2={K.y} y2={-K.z} stroke={GHOST} strokeWidth={3} strokeDasharray="2 4" vectorEffect="non-scaling-stroke" />
        </g>
      ) : null}

      {/* The axle and everything welded to it. */}
      <g data-testid="axle-body">
        <path d={path(body.tube.map(at))} fill="#e7e9e8" stroke={INK} strokeWidth={2} vectorEffect="non-scaling-stroke" />
        <path d={path(body.plate.map(at))} fill="url(#steer-hatch)" stroke={INK} strokeWidth={2} vectorEffect="non-scaling-stroke" />
        <path d={path(body.arm.map(at))} fill="#cdd1cf" stroke={INK} strokeWidth={2} vectorEffect="non-scaling-stroke" />
        <circle cx={at(C).y} cy={-at(C).z} r={9 * k} fill="#ffffff" stroke={INK} strokeWidth={2} vectorEffect="non-scaling-stroke" />
        <path d={`M${at(C).y - 9 * k} ${-at(C).z} h${18 * k} M${at(C).y} ${-at(C).z - 9 * k} v${18 * k}`} stroke={INK} strokeWidth={1.5} vectorEffect="non-scaling-stroke" />
      </g>

      {/* Candidate holes: ring = candidate, ring with a diamond = the best ranked. */}
      <g data-testid="diagram-holes">
        {holes.map((h) => {
          const p = onFrame ? h : at(h);
          const best = bestHole?.label === h.label && bestHole.y === h.y && bestHole.z === h.z;
          return (
            <g key={`${h.label}-${h.y}-${h.z}`}>
              <circle cx={p.y} cy={-p.z} r={5 * k} fill="#ffffff" stroke={INK} strokeWidth={1.5} vectorEffect="non-scaling-stroke" />
              {best ? <path d={`M${p.y} ${-p.z - 9 * k} l${9 * k} ${9 * k} l${-9 * k} ${9 * k} l${-9 * k} ${-9 * k} Z`} fill="none" stroke={INK} strokeWidth={2} vectorEffect="non-scaling-stroke" /> : null}
              {(() => {
                const right = onFrame ? { y: p.y + 12 * k, z: p.z } : at({ y: plateRight + 6 * k, z: h.z });
                const text = `${h.label}${isAxleEnd(h) ? " (axle end now)" : ""}${best ? " ◆ best" : ""}`;
                return label(right, text, 4, "start", best);
              })()}
            </g>
          );
        })}
      </g>


      <FrameMount at={F} k={k} id="frame-end" />
      <FrameMount at={P} k={k} id="pitman-end" />
      {onFrame && holes.length ? <FrameMount at={{ y: holes[0]!.y, z: Math.max(...holes.map((h) => h.z)) }} k={k} id="frame-holes" /> : null}

      {/* Lateral link: one solid bar. Drag link: an open (outlined) bar, so the two differ by shape. */}
      <line data-testid="lateral-link" x1={F.y} y1={-F.z} x2={A1.y} y2={-A1.z} stroke={INK} strokeWidth={7} strokeLinecap="round" vectorEffect="non-scaling-stroke" />
      <line x1={P.y} y1={-P.z} x2={K1.y} y2={-K1.z} stroke={INK} strokeWidth={9} strokeLinecap="round" vectorEffect="non-scaling-stroke" />
      <line data-testid="drag-link" x1={P.y} y1={-P.z} x2={K1.y} y2={-K1.z} stroke="#f1f6cf" strokeWidth={4} strokeLinecap="round" vectorEffect="non-scaling-stroke" />

      {pivot(F, "frame-end")}
      {pivot(P, "pitman-end")}
      {pivot(A1, "axle-end", true)}
      {/* Where the axle carries the arm end (ring) and where the drag link holds it (dot): the gap is the error. */}
      {moved ? <circle data-testid="arm-carried" cx={Krigid.y} cy={-Krigid.z} r={9 * k} fill="none" stroke={INK} strokeWidth={1.5} strokeDasharray="3 2" vectorEffect="non-scaling-stroke" /> : null}
      {pivot(K1, "arm-end", true)}

      {/* The best height: a cross in a square, with its words, so it reads without colour; drawn over the links so they never hide it. */}
      {opt
        ? (() => {
            const q = optOnAxle ? at(opt) : opt;
            const r = 8 * k;
            return (
              <g data-testid="diagram-optimum">
                <rect x={q.y - r} y={-q.z - r} width={2 * r} height={2 * r} fill="#f1f6cf" stroke={INK} strokeWidth={2} vectorEffect="non-scaling-stroke" />
                <path d={`M${q.y - r} ${-q.z - r} L${q.y + r} ${-q.z + r} M${q.y + r} ${-q.z - r} L${q.y - r} ${-q.z + r}`} stroke={INK} strokeWidth={1.5} vectorEffect="non-scaling-stroke" />
                {label({ y: q.y - 14 * k, z: q.z }, `drill here ${shown("length", opt.z, units, { metric: 1, imperial: 2 })}`, 4, "end", true)}
              </g>
            );
          })()
        : null}

      {label(F, "frame end", -44, "middle")}
      {label(P, "pitman arm", 26, "middle")}
      {axleEndIsHole ? null : label(at({ y: plateRight + 6 * k, z: A.z }), "axle end", 4, "start")}
      {label(at({ y: K.y, z: C.z - TUBE_R }), "steering arm", 18, "middle")}
      {moved ? (
        <text data-testid="diagram-callout" x={b.minY - pad + width - 12 * k} y={-maxZ + 22 * k} fontSize={font} textAnchor="end" fill={INK} fontWeight={700}>
          {errorText} · {steerText}
        </text>
      ) : null}

      {/* Scale bar and axes. */}
      <g transform={`translate(${b.minY - pad + 16 * k} ${-minZ - 18 * k})`}>
        <path d={`M0 0 h${bar.mm} M0 ${-6 * k} v${12 * k} M${bar.mm} ${-6 * k} v${12 * k}`} stroke={INK} strokeWidth={2} vectorEffect="non-scaling-stroke" />
        <text x={bar.mm / 2} y={-8 * k} fontSize={font} textAnchor="middle" fill={INK} data-testid="scale-bar">{bar.label}</text>
      </g>
      <g transform={`translate(${b.minY - pad + width - 90 * k} ${-minZ - 18 * k})`}>
        <path d={`M0 0 h${40 * k} M${34 * k} ${-5 * k} l${6 * k} ${5 * k} l${-6 * k} ${5 * k} M0 0 v${-40 * k} M${-5 * k} ${-34 * k} l${5 * k} ${-6 * k} l${5 * k} ${6 * k}`} stroke={INK} strokeWidth={1.5} fill="none" vectorEffect="non-scaling-stroke" />
        <text x={46 * k} y={4 * k} fontSize={font} fill={INK}>y</text>
        <text x={-4 * k} y={-46 * k} fontSize={font} fill={INK}>z</text>
      </g>
    </svg>
  );
}
