"use client";
import { CartesianGrid, Line, LineChart, ReferenceDot, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import type { SteeringResult } from "@/lib/geometry";
import { fromSI, preferredUnit } from "@/lib/units";
import { figure, type UnitSystem } from "@/components/calc/values";

// Steer over heave and over roll. One line per chart, so nothing depends on telling colours apart;
// the point the diagram shows is a ringed dot on a dashed line.

const MAX_POINTS = 401;

function thin<T>(rows: readonly T[]): T[] {
  if (rows.length <= MAX_POINTS) return [...rows];
  const stride = (rows.length - 1) / (MAX_POINTS - 1);
  return Array.from({ length: MAX_POINTS }, (_, i) => rows[Math.round(i * stride)]!);
}

const AXIS = { fill: "#171b1a", fontSize: 12 };

/** Round tick values (1, 2 or 5 × 10ⁿ apart) covering [lo, hi]. */
export function niceTicks(lo: number, hi: number, target = 6): number[] {
  if (!(hi > lo)) return [lo];
  const raw = (hi - lo) / target;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * mag).find((s) => s >= raw) ?? 10 * mag;
  const out: number[] = [];
  for (let v = Math.ceil(lo / step - 1e-9) * step; v <= hi + step * 1e-9; v += step) out.push(Math.abs(v) < step * 1e-9 ? 0 : v);
  return out;
}

function digitsFor(step: number): number {
  return Math.max(0, Math.min(4, -Math.floor(Math.log10(step) + 1e-9)));
}

function SteerChart({
  data,
  xLabel,
  current,
  testId,
  title,
  xDigits,
}: {
  data: { x: number; steer: number }[];
  xLabel: string;
  current: { x: number; steer: number } | null;
  testId: string;
  title: string;
  xDigits: number;
}) {
  const xs = data.map((d) => d.x);
  const ys = data.map((d) => d.steer);
  const xTicks = niceTicks(Math.min(...xs), Math.max(...xs));
  const yLo = Math.min(0, ...ys);
  const yHi = Math.max(0, ...ys);
  // A flat line (parallel links) still gets a readable axis of ±0.1°.
  const span = Math.max(yHi - yLo, 0.1);
  const yTicks = niceTicks(yLo - span * 0.05, yHi + span * 0.05, 5);
  const yDigits = yTicks.length > 1 ? digitsFor(yTicks[1]! - yTicks[0]!) : 1;
  const xStepDigits = xTicks.length > 1 ? digitsFor(xTicks[1]! - xTicks[0]!) : xDigits;
  return (
    <figure className="min-w-0 rounded-md border-2 border-graphite-200 bg-white p-3" data-testid={testId}>
      <figcaption className="mb-1 text-sm font-bold text-graphite-950">{title}</figcaption>
      <LineChart responsive style={{ width: "100%", height: 240 }} data={data} margin={{ top: 12, right: 16, bottom: 22, left: 4 }}>
        <CartesianGrid stroke="#cdd1cf" strokeDasharray="2 4" />
        <XAxis
          type="number"
          dataKey="x"
          domain={["dataMin", "dataMax"]}
          ticks={xTicks}
          tick={AXIS}
          tickFormatter={(v: number) => figure(v, xStepDigits)}
          label={{ value: xLabel, position: "insideBottom", offset: -14, fill: "#171b1a", fontSize: 12 }}
        />
        <YAxis tick={AXIS} width={58} ticks={yTicks} domain={[yTicks[0]!, yTicks.at(-1)!]} tickFormatter={(v: number) => figure(v, yDigits)} label={{ value: "wheel steer °", angle: -90, position: "insideLeft", fill: "#171b1a", fontSize: 12, dy: 40 }} />
        <ReferenceLine y={0} stroke="#58605d" strokeWidth={1.5} />
        {current ? <ReferenceLine x={current.x} stroke="#171b1a" strokeDasharray="5 4" /> : null}
        <Tooltip
          formatter={(v) => [`${figure(Number(v), 3, { sign: true })}°`, "wheel steer"]}
          labelFormatter={(v) => `${xLabel.split(",")[0]}: ${figure(Number(v), xDigits, { sign: true })}`}
          contentStyle={{ borderColor: "#171b1a", borderWidth: 2, color: "#171b1a" }}
        />
        <Line type="linear" dataKey="steer" stroke="#171b1a" strokeWidth={2.5} dot={false} isAnimationActive={false} name="wheel steer" />
        {current ? <ReferenceDot x={current.x} y={current.steer} r={6} fill="#aec22b" stroke="#171b1a" strokeWidth={2} /> : null}
      </LineChart>
    </figure>
  );
}

export function SteerCharts({
  result,
  units,
  mode,
  at,
}: {
  result: SteeringResult;
  units: UnitSystem;
  mode: "heave" | "roll";
  at: number;
}) {
  const lenUnit = preferredUnit("length", units);
  const heave = thin(result.heave.map((p) => ({ x: fromSI("length", p.travel, lenUnit), steer: p.wheelSteerDeg })));
  const roll = thin(result.roll.map((p) => ({ x: p.rollDeg, steer: p.wheelSteerDeg })));
  const curHeave = mode === "heave" ? result.heave.find((p) => p.travel === at) : undefined;
  const curRoll = mode === "roll" ? result.roll.find((p) => p.rollDeg === at) : undefined;
  return (
    <div className={`grid gap-3 ${roll.length ? "2xl:grid-cols-2" : ""}`}>
      <SteerChart
        testId="chart-heave"
        title="Wheel steer over heave"
        data={heave}
        xLabel={`heave ${lenUnit}, + bump`}
        xDigits={units === "imperial" ? 1 : 0}
        current={curHeave ? { x: fromSI("length", curHeave.travel, lenUnit), steer: curHeave.wheelSteerDeg } : null}
      />
      {roll.length ? (
        <SteerChart
          testId="chart-roll"
          title="Wheel steer over roll"
          data={roll}
          xLabel="roll °, + the +y side up"
          xDigits={1}
          current={curRoll ? { x: curRoll.rollDeg, steer: curRoll.wheelSteerDeg } : null}
        />
      ) : null}
    </div>
  );
}
