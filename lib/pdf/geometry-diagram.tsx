// Front view of the steering links (y lateral to the right, z up, mm): the lateral link solid, the drag
// link dashed, frame ends as squares, axle ends as rings, axle centre as a crossed circle. Before and
// after share one scale so a raised bracket reads as a raised line.
import type { ReactNode } from "react";
import { Circle, G, Line, Path, Rect, Svg, Text as SvgText, View, Text } from "@react-pdf/renderer";
import type { TravellerRecord } from "./traveller-data";
import { FIGURE_FONT } from "./fonts";
import { COLOR, MIN_TEXT_PT, s } from "./theme";

type Capture = NonNullable<NonNullable<TravellerRecord["geometry"]>["before"]>;
type Pt = { y: number; z: number };

function pointsOf(c: Capture): Pt[] {
  return [c.lateralLink.frameEnd, c.lateralLink.axleEnd, c.dragLink.pitmanEnd, c.dragLink.knuckleEnd, c.axleCenter];
}

export type DiagramFrame = { yMin: number; zMin: number; scale: number; width: number; height: number; pad: number };

/** One scale for every capture, fitting all points into width × height with `pad` all round. */
export function diagramFrame(captures: readonly Capture[], width: number, height: number, pad = 14): DiagramFrame {
  const pts = captures.flatMap(pointsOf);
  const ys = pts.map((p) => p.y);
  const zs = pts.map((p) => p.z);
  const yMin = Math.min(...ys);
  const yMax = Math.max(...ys);
  const zMin = Math.min(...zs);
  const zMax = Math.max(...zs);
  const spanY = Math.max(yMax - yMin, 1);
  const spanZ = Math.max(zMax - zMin, 1);
  const scale = Math.min((width - 2 * pad) / spanY, (height - 2 * pad) / spanZ);
  // Centre the drawing in the box.
  const cy = (yMin + yMax) / 2 - (width / 2 - pad) / scale;
  const cz = (zMin + zMax) / 2 - (height / 2 - pad) / scale;
  return { yMin: cy, zMin: cz, scale, width, height, pad };
}

function Diagram({ capture, frame, title }: { capture: Capture; frame: DiagramFrame; title: string }) {
  const X = (p: Pt) => frame.pad + (p.y - frame.yMin) * frame.scale;
  const Y = (p: Pt) => frame.height - frame.pad - (p.z - frame.zMin) * frame.scale;
  const { frameEnd: F, axleEnd: A } = capture.lateralLink;
  const { pitmanEnd: P, knuckleEnd: K } = capture.dragLink;
  const C = capture.axleCenter;
  const label = (p: Pt, text: string, dy: number) => (
    <SvgText x={X(p) + 5} y={Y(p) + dy} style={{ fontSize: MIN_TEXT_PT, fontFamily: FIGURE_FONT }} fill={COLOR.body}>
      {text}
    </SvgText>
  );
  const square = (p: Pt) => <Rect x={X(p) - 2.6} y={Y(p) - 2.6} width={5.2} height={5.2} fill={COLOR.ink} />;
  const ring = (p: Pt) => <Circle cx={X(p)} cy={Y(p)} r={2.8} fill={COLOR.white} stroke={COLOR.ink} strokeWidth={1} />;
  return (
    <View style={{ width: frame.width }}>
      <Text style={[s.label, { marginBottom: 2 }]}>{title}</Text>
      <Svg width={frame.width} height={frame.height} viewBox={`0 0 ${frame.width} ${frame.height}`}>
        <Rect x={0} y={0} width={frame.width} height={frame.height} fill={COLOR.panel} />
        {/* the axle centre's level, for reference */}
        <Line x1={0} y1={Y(C)} x2={frame.width} y2={Y(C)} stroke={COLOR.ruleStrong} strokeWidth={0.6} />
        <Line x1={X(C)} y1={0} x2={X(C)} y2={frame.height} stroke={COLOR.ruleStrong} strokeWidth={0.6} />
        <Line x1={X(F)} y1={Y(F)} x2={X(A)} y2={Y(A)} stroke={COLOR.ink} strokeWidth={1.8} />
        <Line x1={X(P)} y1={Y(P)} x2={X(K)} y2={Y(K)} stroke={COLOR.ink2} strokeWidth={1.2} strokeDasharray="4 2.5" />
        <G>
          <Circle cx={X(C)} cy={Y(C)} r={4.2} fill={COLOR.white} stroke={COLOR.ink} strokeWidth={0.9} />
          <Line x1={X(C) - 4.2} y1={Y(C)} x2={X(C) + 4.2} y2={Y(C)} stroke={COLOR.ink} strokeWidth={0.7} />
          <Line x1={X(C)} y1={Y(C) - 4.2} x2={X(C)} y2={Y(C) + 4.2} stroke={COLOR.ink} strokeWidth={0.7} />
        </G>
        {square(F)}
        {square(P)}
        {ring(A)}
        {ring(K)}
        {label(F, "F", -4)}
        {label(A, "A", -4)}
        {label(P, "P", 9)}
        {label(K, "K", 9)}
        {label(C, "C", 10)}
      </Svg>
    </View>
  );
}

function Legend() {
  const item = (shape: ReactNode, text: string) => (
    <View style={{ flexDirection: "row", alignItems: "center", marginRight: 12 }}>
      <Svg width={18} height={8} viewBox="0 0 18 8">
        {shape}
      </Svg>
      <Text style={[s.tiny, { marginLeft: 3, color: COLOR.body }]}>{text}</Text>
    </View>
  );
  return (
    <View style={{ flexDirection: "row", flexWrap: "wrap", marginTop: 4 }}>
      {item(<Line x1={1} y1={4} x2={17} y2={4} stroke={COLOR.ink} strokeWidth={1.8} />, "lateral link (track bar) F-A")}
      {item(<Line x1={1} y1={4} x2={17} y2={4} stroke={COLOR.ink2} strokeWidth={1.2} strokeDasharray="4 2.5" />, "drag link P-K")}
      {item(<Rect x={6} y={1.5} width={5} height={5} fill={COLOR.ink} />, "frame end")}
      {item(<Circle cx={9} cy={4} r={2.7} fill={COLOR.white} stroke={COLOR.ink} strokeWidth={1} />, "axle end")}
      {item(
        <G>
          <Circle cx={9} cy={4} r={3.4} fill={COLOR.white} stroke={COLOR.ink} strokeWidth={0.9} />
          <Line x1={5.6} y1={4} x2={12.4} y2={4} stroke={COLOR.ink} strokeWidth={0.6} />
          <Line x1={9} y1={0.6} x2={9} y2={7.4} stroke={COLOR.ink} strokeWidth={0.6} />
        </G>,
        "axle centre C",
      )}
      <Text style={[s.tiny, { color: COLOR.muted }]}>Front view: y to the right, z up; one scale for both.</Text>
    </View>
  );
}

export function GeometryDiagrams({ before, after, width }: { before: Capture | null; after: Capture | null; width: number }) {
  const caps = [before, after].filter((c): c is Capture => c !== null);
  if (caps.length === 0) return null;
  const gap = 14;
  const each = (width - gap) / 2;
  const frame = diagramFrame(caps, each, 118);
  return (
    <View wrap={false} style={{ marginTop: 8 }}>
      <View style={{ flexDirection: "row" }}>
        {before ? <Diagram capture={before} frame={frame} title="Before" /> : <View style={{ width: each }} />}
        <View style={{ width: gap }} />
        {after ? <Diagram capture={after} frame={frame} title="After" /> : <View style={{ width: each }} />}
      </View>
      <Legend />
    </View>
  );
}

/**
 * One chart for both captures: steering-wheel degrees (wheel steer × the capture's ratio; road-wheel degrees
 * when no ratio was given) over the travel range. Before dashed, after solid, each named at its end, so it
 * reads in black and white.
 */
export function SteeringWheelChart({ before, after, width }: { before: Capture | null; after: Capture | null; width: number }) {
  type Series = { name: string; c: Capture | null; dash: string | undefined; stroke: string };
  const all: Series[] = [
    { name: "before", c: before, dash: "4 2.5", stroke: COLOR.ink2 },
    { name: "after", c: after, dash: undefined, stroke: COLOR.ink },
  ];
  const series = all.filter((x): x is Series & { c: Capture } => !!x.c?.curve?.length);
  if (!series.length) return null;
  const wheel = series.every((x) => x.c.steeringRatio !== undefined);
  const pts = series.map((x) => ({ ...x, pts: x.c.curve!.map(([t, w]) => [t, wheel ? w * x.c.steeringRatio! : w] as const) }));
  const xs = pts.flatMap((x) => x.pts.map((p) => p[0]));
  const ys = pts.flatMap((x) => x.pts.map((p) => Math.abs(p[1])));
  const xMin = Math.min(...xs);
  const xMax = Math.max(...xs);
  const yAbs = Math.max(wheel ? 1 : 0.1, ...ys) * 1.1;
  const H = 120;
  const pad = { l: 40, r: 44, t: 8, b: 18 };
  const X = (v: number) => pad.l + ((v - xMin) / Math.max(1e-9, xMax - xMin)) * (width - pad.l - pad.r);
  const Y = (v: number) => pad.t + ((yAbs - v) / (2 * yAbs)) * (H - pad.t - pad.b);
  const t = (x: number, y: number, text: string, anchor: "start" | "end" | "middle" = "start") => (
    <SvgText x={x} y={y} textAnchor={anchor} style={{ fontSize: MIN_TEXT_PT, fontFamily: FIGURE_FONT }} fill={COLOR.body}>
      {text}
    </SvgText>
  );
  return (
    <View wrap={false} style={{ marginTop: 8 }}>
      <Text style={[s.label, { marginBottom: 2 }]}>{wheel ? "Steering-wheel angle over the travel range" : "Road-wheel steer over the travel range (no steering ratio given)"}</Text>
      <Svg width={width} height={H} viewBox={`0 0 ${width} ${H}`}>
        <Rect x={0} y={0} width={width} height={H} fill={COLOR.panel} />
        <Line x1={pad.l} y1={Y(0)} x2={width - pad.r} y2={Y(0)} stroke={COLOR.ruleStrong} strokeWidth={0.6} />
        {xMin <= 0 && xMax >= 0 ? <Line x1={X(0)} y1={pad.t} x2={X(0)} y2={H - pad.b} stroke={COLOR.ruleStrong} strokeWidth={0.6} /> : null}
        {t(pad.l - 3, Y(yAbs) + 6, `+${yAbs.toFixed(1)}°`, "end")}
        {t(pad.l - 3, Y(0) + 2, "0°", "end")}
        {t(pad.l - 3, Y(-yAbs), `-${yAbs.toFixed(1)}°`, "end")}
        {t(X(xMin), H - 5, `${xMin.toFixed(0)} mm droop`)}
        {t(X(xMax), H - 5, `bump +${xMax.toFixed(0)} mm`, "end")}
        {pts.map((x) => {
          const d = x.pts.map((p, i) => `${i ? "L" : "M"}${X(p[0]).toFixed(1)} ${Y(p[1]).toFixed(1)}`).join(" ");
          const last = x.pts[x.pts.length - 1]!;
          return (
            <G key={x.name}>
              <Path d={d} fill="none" stroke={x.stroke} strokeWidth={x.name === "after" ? 1.6 : 1.1} {...(x.dash ? { strokeDasharray: x.dash } : {})} />
              {t(X(last[0]) + 3, Y(last[1]) + (x.name === "after" ? -2 : 7), x.name)}
            </G>
          );
        })}
      </Svg>
    </View>
  );
}
