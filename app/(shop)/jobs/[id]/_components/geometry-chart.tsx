// Bump steer against travel for each geometry capture, drawn as plain SVG. Lines differ by dash and marker
// as well as shade, and each carries its name, so it reads in black and white.
import type { GeometryResults } from "@/lib/jobs/values";

const STYLES = [
  { stroke: "#171b1a", dash: "", marker: "circle" },
  { stroke: "#5f6c12", dash: "8 4", marker: "square" },
  { stroke: "#424946", dash: "2 4", marker: "triangle" },
  { stroke: "#2d5aa6", dash: "12 4 2 4", marker: "diamond" },
] as const;

export function GeometryChart({ series, wheel = false }: { series: { label: string; results: GeometryResults }[]; wheel?: boolean }) {
  if (!series.length) return null;
  const W = 640;
  const H = 260;
  const pad = { l: 56, r: 16, t: 16, b: 40 };
  const pts = series.flatMap((s) => s.results.curve);
  const xs = pts.map((p) => p[0]);
  const ys = pts.map((p) => p[1]);
  const xMin = Math.min(...xs);
  const xMax = Math.max(...xs);
  const yAbs = Math.max(wheel ? 1 : 0.1, ...ys.map(Math.abs));
  const x = (v: number) => pad.l + ((v - xMin) / Math.max(1e-9, xMax - xMin)) * (W - pad.l - pad.r);
  const y = (v: number) => pad.t + ((yAbs - v) / (2 * yAbs)) * (H - pad.t - pad.b);
  return (
    <figure className="card p-3">
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full" role="img" aria-label={wheel ? "Steering-wheel angle against suspension travel, before and after" : "Wheel steer against suspension travel for each capture"} data-testid="geometry-chart">
        <line x1={pad.l} x2={W - pad.r} y1={y(0)} y2={y(0)} stroke="#7b8380" />
        <line x1={x(0)} x2={x(0)} y1={pad.t} y2={H - pad.b} stroke="#7b8380" />
        <text x={pad.l - 6} y={y(yAbs) + 4} textAnchor="end" fontSize="12" fill="#171b1a">{yAbs.toFixed(2)}°</text>
        <text x={pad.l - 6} y={y(-yAbs) + 4} textAnchor="end" fontSize="12" fill="#171b1a">{(-yAbs).toFixed(2)}°</text>
        <text x={x(xMin)} y={H - 12} fontSize="12" fill="#171b1a">{xMin.toFixed(0)} mm droop</text>
        <text x={x(xMax)} y={H - 12} textAnchor="end" fontSize="12" fill="#171b1a">bump {xMax.toFixed(0)} mm</text>
        {series.map((s, i) => {
          const st = STYLES[i % STYLES.length]!;
          const d = s.results.curve.map((p, j) => `${j ? "L" : "M"}${x(p[0]).toFixed(1)},${y(p[1]).toFixed(1)}`).join(" ");
          const last = s.results.curve[s.results.curve.length - 1]!;
          return (
            <g key={s.label}>
              <path d={d} fill="none" stroke={st.stroke} strokeWidth="3" strokeDasharray={st.dash} />
              <text x={x(last[0]) - 4} y={y(last[1]) - 6} textAnchor="end" fontSize="12" fontWeight="600" fill={st.stroke}>{s.label}</text>
            </g>
          );
        })}
      </svg>
      <figcaption className="mt-1 text-sm text-graphite-700">{wheel ? "Steering-wheel angle (°)" : "Wheel steer (°), no steering ratio given,"} from droop to bump; a flat line at 0 means no bump steer.</figcaption>
    </figure>
  );
}
