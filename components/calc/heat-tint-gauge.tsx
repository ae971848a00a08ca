import { figure } from "./values";

// Gusset's heat-tint scale for heat input: straw → bronze → purple → blue, as the oxide colours on steel
// run with temperature. Each band also has its own word and shape; the colour is never the only cue.
// The band edges are a reading aid of ours, not a code limit: the WPS range is what a weld is judged by.
export const HEAT_BANDS = [
  { key: "low", word: "Low", from: 0, to: 0.6, fill: "#d8b45a", shape: "circle" },
  { key: "moderate", word: "Moderate", from: 0.6, to: 1.2, fill: "#a4652c", shape: "triangle" },
  { key: "high", word: "High", from: 1.2, to: 2.0, fill: "#6a3f9e", shape: "square" },
  { key: "very-high", word: "Very high", from: 2.0, to: 3.0, fill: "#2d5aa6", shape: "diamond" },
] as const;

export type HeatBand = (typeof HEAT_BANDS)[number];

export function heatBand(kJPerMm: number): HeatBand {
  return HEAT_BANDS.find((b) => kJPerMm < b.to) ?? HEAT_BANDS[HEAT_BANDS.length - 1]!;
}

const SHAPE_GLYPH = { circle: "●", triangle: "▲", square: "■", diamond: "◆" } as const;

function Shape({ shape, x, y, r, fill, stroke }: { shape: HeatBand["shape"]; x: number; y: number; r: number; fill: string; stroke: string }) {
  const common = { fill, stroke, strokeWidth: 1.5 };
  switch (shape) {
    case "circle":
      return <circle cx={x} cy={y} r={r} {...common} />;
    case "triangle":
      return <path d={`M${x} ${y - r} L${x + r} ${y + r * 0.8} L${x - r} ${y + r * 0.8} Z`} {...common} />;
    case "square":
      return <rect x={x - r * 0.85} y={y - r * 0.85} width={r * 1.7} height={r * 1.7} {...common} />;
    case "diamond":
      return <path d={`M${x} ${y - r} L${x + r} ${y} L${x} ${y + r} L${x - r} ${y} Z`} {...common} />;
  }
}

export function HeatTintGauge({ value, basis }: { value: number | null; basis: string }) {
  const max = HEAT_BANDS[HEAT_BANDS.length - 1]!.to;
  const W = 600;
  const x = (v: number) => 10 + (Math.min(Math.max(v, 0), max) / max) * (W - 20);
  const band = value === null ? null : heatBand(value);
  return (
    <figure className="rounded-md border-2 border-graphite-200 bg-white p-3" data-testid="heat-gauge">
      <figcaption className="flex flex-wrap items-baseline justify-between gap-2">
        <span className="text-sm font-bold text-graphite-950">Heat tint</span>
        {band && value !== null ? (
          <span className="inline-flex items-center gap-2 rounded border-2 border-graphite-900 px-2 py-0.5 font-semibold text-graphite-950" data-testid="heat-band">
            <span aria-hidden="true">{SHAPE_GLYPH[band.shape]}</span>
            {band.word}
            <span className="figures text-graphite-700">{figure(value, 3)} kJ/mm</span>
            {value > max ? <span className="text-graphite-700">(off the scale)</span> : null}
          </span>
        ) : (
          <span className="text-sm text-graphite-700">no value yet</span>
        )}
      </figcaption>
      <svg viewBox={`0 0 ${W} 96`} className="mt-2 h-auto w-full" role="img" aria-label={band && value !== null ? `Heat tint gauge: ${band.word}, ${figure(value, 3)} kJ per mm, on a scale to ${max}` : "Heat tint gauge, no value yet"}>
        {HEAT_BANDS.map((b) => (
          <g key={b.key}>
            <rect x={x(b.from)} y={26} width={x(b.to) - x(b.from)} height={26} fill={b.fill} stroke="#171b1a" strokeWidth={1} />
            <Shape shape={b.shape} x={(x(b.from) + x(b.to)) / 2} y={39} r={7} fill={b.key === "low" ? "#171b1a" : "#ffffff"} stroke={b.key === "low" ? "#171b1a" : "#ffffff"} />
            <text x={(x(b.from) + x(b.to)) / 2} y={70} textAnchor="middle" fontSize={14} fontWeight={band?.key === b.key ? 700 : 500} fill="#171b1a">{b.word}</text>
            <text x={x(b.from)} y={88} textAnchor={b.from === 0 ? "start" : "middle"} fontSize={12} fill="#303634" className="figures">{b.from}</text>
          </g>
        ))}
        <text x={x(max)} y={88} textAnchor="end" fontSize={12} fill="#303634">{max} kJ/mm</text>
        {value !== null ? (
          <g data-testid="heat-pointer" transform={`translate(${x(value)} 0)`}>
            <path d="M-9 4 L9 4 L0 22 Z" fill="#171b1a" stroke="#ffffff" strokeWidth={1.5} />
            <line x1={0} y1={22} x2={0} y2={54} stroke="#171b1a" strokeWidth={3} />
            <line x1={0} y1={22} x2={0} y2={54} stroke="#ffffff" strokeWidth={1} />
          </g>
        ) : null}
      </svg>
      <p className="mt-1 text-xs text-graphite-700">{basis} Band edges are Gusset&apos;s reading aid, not a code limit: judge the pass against its WPS.</p>
    </figure>
  );
}
