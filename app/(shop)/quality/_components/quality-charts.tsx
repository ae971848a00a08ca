"use client";
// The Quality screen's charts (recharts, loaded only on this screen). Each has its table and CSV beside it;
// state is shown by shape and words as well as colour.
import { Bar, BarChart, CartesianGrid, ComposedChart, LabelList, Line, ReferenceLine, Scatter, Tooltip, XAxis, YAxis } from "recharts";
import { individualsChart, outOfControl } from "@/lib/quality/control-chart";
import { defectLabel } from "@/lib/quality/labels";
import type { QualityFigures } from "@/lib/quality/schema";

const AXIS = { fill: "#171b1a", fontSize: 12 };
const INK = "#171b1a";
const ACCENT = "#6f8f1f";

// One horizontal bar per row, its value written at the bar's end.
function HorizontalBars(props: {
  testId: string;
  data: { name: string; value: number }[];
  fill: string;
  labelWidth: number;
  percent?: boolean;
}) {
  const { data, percent } = props;
  const unit = (v: unknown) => (percent ? `${String(v)} %` : String(v));
  return (
    <div data-testid={props.testId} aria-hidden="true">
      <BarChart responsive layout="vertical" style={{ width: "100%", height: 44 + data.length * 40 }} data={data} margin={{ top: 4, right: 48, bottom: 4, left: 8 }}>
        <CartesianGrid stroke="#cdd1cf" strokeDasharray="2 4" horizontal={false} />
        {percent ? <XAxis type="number" domain={[0, 100]} tick={AXIS} tickFormatter={unit} /> : <XAxis type="number" allowDecimals={false} tick={AXIS} />}
        <YAxis type="category" dataKey="name" tick={AXIS} width={props.labelWidth} />
        <Bar dataKey="value" fill={props.fill} stroke={INK} isAnimationActive={false}>
          <LabelList dataKey="value" position="right" formatter={unit} style={{ fill: INK, fontSize: 12 }} />
        </Bar>
      </BarChart>
    </div>
  );
}

export function YieldChart({ rows, testId }: { rows: { name: string; ratio: number | null; inspected: number }[]; testId: string }) {
  const data = rows.filter((r) => r.ratio !== null).map((r) => ({ name: r.name, value: Math.round((r.ratio ?? 0) * 1000) / 10 }));
  return <HorizontalBars testId={testId} data={data} fill={ACCENT} labelWidth={120} percent />;
}

export function DefectsChart({ defects }: { defects: QualityFigures["defects"] }) {
  const data = [...defects].sort((a, b) => b.count - a.count).map((d) => ({ name: defectLabel(d.criterion), value: d.count }));
  return <HorizontalBars testId="defects-chart" data={data} fill="#58605d" labelWidth={130} />;
}

type Mark = "in" | "signal" | "over";
type Pt = { i: number; kJ: number; limit: number | null; mark: Mark; label: string };

// Shapes: ● inside the WPS limit and the control limits; ▲ outside the control limits (look for a cause);
// ✕ above the WPS heat-input limit.
function Dot(props: { cx?: number; cy?: number; payload?: Pt }) {
  const { cx, cy, payload } = props;
  if (cx === undefined || cy === undefined || !payload) return null;
  if (payload.mark === "over") {
    return <path d={`M${cx - 6},${cy - 6}L${cx + 6},${cy + 6}M${cx - 6},${cy + 6}L${cx + 6},${cy - 6}`} stroke="#a3261b" strokeWidth={3} data-mark="over" />;
  }
  if (payload.mark === "signal") {
    return <path d={`M${cx},${cy - 7}L${cx + 7},${cy + 6}L${cx - 7},${cy + 6}Z`} fill="#b06f00" stroke={INK} strokeWidth={1} data-mark="signal" />;
  }
  return <circle cx={cx} cy={cy} r={4} fill={INK} data-mark="in" />;
}

export function HeatChart({ series }: { series: QualityFigures["heatInput"][number] }) {
  const chart = individualsChart(series.points.map((p) => p.kJPerMm));
  const data: Pt[] = series.points.map((p, i) => ({
    i: i + 1,
    kJ: p.kJPerMm,
    limit: p.limitKJPerMm,
    mark: !p.within ? "over" : outOfControl(chart, p.kJPerMm) ? "signal" : "in",
    label: `${p.jobNumber} ${p.jointId} round ${p.round} pass ${p.passNumber}`,
  }));
  const limits = data.map((d) => d.limit).filter((v): v is number => v !== null);
  const hi = Math.max(...data.map((d) => d.kJ), ...limits, chart?.ucl ?? 0);
  const lo = Math.min(...data.map((d) => d.kJ), chart?.lcl ?? Infinity, 0);
  return (
    <div data-testid={`heat-chart-${series.reference}`} aria-hidden="true">
      <ComposedChart responsive style={{ width: "100%", height: 260 }} data={data} margin={{ top: 12, right: 70, bottom: 22, left: 4 }}>
        <CartesianGrid stroke="#cdd1cf" strokeDasharray="2 4" />
        <XAxis type="number" dataKey="i" domain={[1, Math.max(2, data.length)]} allowDecimals={false} tick={AXIS} label={{ value: "pass, in welding order", position: "insideBottom", offset: -14, fill: INK, fontSize: 12 }} />
        <YAxis tick={AXIS} width={52} domain={[Math.max(0, lo - (hi - lo) * 0.1), hi + (hi - lo) * 0.1 + 0.05]} tickFormatter={(v: number) => v.toFixed(2)} label={{ value: "kJ/mm", angle: -90, position: "insideLeft", fill: INK, fontSize: 12 }} />
        {chart ? <ReferenceLine y={chart.mean} stroke={INK} label={{ value: "CL", position: "right", fill: INK, fontSize: 12 }} /> : null}
        {chart?.ucl != null ? <ReferenceLine y={chart.ucl} stroke={INK} strokeDasharray="6 4" label={{ value: "UCL", position: "right", fill: INK, fontSize: 12 }} /> : null}
        {chart?.lcl != null ? <ReferenceLine y={chart.lcl} stroke={INK} strokeDasharray="6 4" label={{ value: "LCL", position: "right", fill: INK, fontSize: 12 }} /> : null}
        {limits.length ? <Line dataKey="limit" type="stepAfter" stroke="#a3261b" strokeWidth={3} strokeDasharray="2 3" dot={false} isAnimationActive={false} name="WPS limit" /> : null}
        <Line dataKey="kJ" stroke="#8a918e" strokeWidth={1} dot={false} isAnimationActive={false} />
        <Scatter dataKey="kJ" shape={<Dot />} isAnimationActive={false} />
        <Tooltip formatter={(v, name) => [`${Number(v).toFixed(3)} kJ/mm`, name === "limit" ? "WPS limit" : "pass"]} labelFormatter={(v) => data[Number(v) - 1]?.label ?? ""} contentStyle={{ borderColor: INK, borderWidth: 2, color: INK }} />
      </ComposedChart>
    </div>
  );
}
