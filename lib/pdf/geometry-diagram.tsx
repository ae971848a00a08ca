// Front view of the steering links (y lateral to the right, z up, mm): the lateral link solid, the drag
// link dashed, frame ends as squares, axle ends as rings, axle centre as a crossed circle. Before and
// after share one scale so a raised bracket reads as a raised line.
import type { ReactNode } from "react";
import { Circle, G, Line, Rect, Svg, Text as SvgText, View, Text } from "@react-pdf/renderer";
import type { TravellerRecord } from "./traveller-data";
import { FIGURE_FONT } from "./fonts";
import { COLOR, s } from "./theme";

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
    <SvgText x={X(p) + 5} y={Y(p) + dy} style={{ fontSize: 6.5, fontFamily: FIGURE_FONT }} fill={COLOR.body}>
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
