import { Fragment, type ReactNode } from "react";
import { StatusBadge } from "@/components/status-badge";
import { toeAtRim, type OptimumResult, type Point2, type SteeringResult } from "@/lib/geometry";
import { figure, shown, shownValue, symbolFor, type UnitSystem } from "@/components/calc/values";

const L = { metric: 1, imperial: 3 } as const;

const RANK_WORDS = { heave: "heave alone", heaveAndRoll: "heave and roll, each on its own", combined: "heave and roll together (every heave point at every roll angle)" } as const;

// Candidate holes, best first by the chosen measure, with the best height on the hole line as its own
// "drill here" row. Each row gives the ranked wheel steer with what that is at the steering wheel and at the
// rim, and under it the figure of each sweep (heave, roll, both together) and the bar length.
export function HoleTable({
  result,
  units,
  fixedEnd,
  currentEnd,
  ratio,
  rimDiameter,
  optimum,
}: {
  result: SteeringResult;
  units: UnitSystem;
  /** The lateral-link end that stays put, for each hole's bar length. */
  fixedEnd: Point2;
  /** The end the holes replace, to mark a hole that is where the bracket is now. */
  currentEnd: Point2;
  ratio: number | undefined;
  rimDiameter: number | undefined;
  optimum: OptimumResult;
}) {
  const holes = result.holes ?? [];
  const u = symbolFor("length", units);
  const hasRoll = result.roll.length > 0;
  const hasCombined = result.worst.combined !== null;
  const steer = (v: number | null) => (v === null ? "—" : `${figure(v, 2, { sign: true })}°`);
  // What the ranked figure is at the steering wheel and at the rim, under it in the same cell.
  const atWheelAndRim = (v: number | null) =>
    v === null
      ? null
      : [ratio !== undefined ? `wheel ${figure(v * ratio, 1, { sign: true })}°` : null, rimDiameter !== undefined ? `rim ${shown("length", toeAtRim(v, rimDiameter), units, { metric: 1, imperial: 3 }, { sign: true })}` : null]
          .filter(Boolean)
          .join(" · ");
  // Every sweep's own figure and the bar length, on a line of its own under the row: the table stays three
  // columns wide, so it fits beside the drawing on a tablet without scrolling sideways.
  const detail = (heave: ReactNode, roll: number | null, both: number | null, bar: number) => (
    <>
      heave {heave}
      {hasRoll ? <> · roll {steer(roll)}</> : null}
      {hasCombined ? <> · both {steer(both)}</> : null} · bar {shown("length", bar, units, L)}
    </>
  );
  const optimumRanked = result.rankBy === "combined" ? optimum.combinedWheelSteerDeg : result.rankBy === "heaveAndRoll" ? (Math.abs(optimum.rollWheelSteerDeg ?? 0) > Math.abs(optimum.heaveWheelSteerDeg) ? optimum.rollWheelSteerDeg : optimum.heaveWheelSteerDeg) : optimum.heaveWheelSteerDeg;
  const cell = "px-2 py-2";
  return (
    <div className="card min-w-0">
      <table className="w-full table-fixed border-collapse text-left text-sm" data-testid="hole-ranking">
        <caption className="sr-only">Candidate holes ranked by the largest wheel steer over {RANK_WORDS[result.rankBy ?? "heave"]}, smallest first</caption>
        <colgroup>
          <col />
          <col className="w-[28%]" />
          <col className="w-[30%]" />
        </colgroup>
        <thead className="bg-graphite-100">
          <tr>
            <th scope="col" className={cell}>Hole</th>
            <th scope="col" className={`${cell} text-right`}>Height, {u}</th>
            <th scope="col" className={`${cell} text-right`}>Worst steer</th>
          </tr>
        </thead>
        <tbody className="figures">
          <tr className="border-t-2 border-graphite-900 bg-white" data-testid="optimum-row">
            <td className={`${cell} font-sans font-semibold`}>
              <StatusBadge tone="info">drill here</StatusBadge> <span className="block">Best height on the line</span>
            </td>
            <td className={`${cell} text-right font-semibold`} data-testid="optimum-z">{shownValue("length", optimum.z, units, L)}</td>
            <td className={`${cell} text-right font-semibold`}>
              {steer(optimumRanked)}
              <span className="block text-xs font-normal text-graphite-700">{atWheelAndRim(optimumRanked)}</span>
            </td>
          </tr>
          <tr className="bg-white">
            <td colSpan={3} className="px-2 pb-2 text-xs text-graphite-700">{detail(steer(optimum.heaveWheelSteerDeg), optimum.rollWheelSteerDeg, optimum.combinedWheelSteerDeg, optimum.barLength)}</td>
          </tr>
          {holes.map((h) => {
            const bar = Math.hypot(h.y - fixedEnd.y, h.z - fixedEnd.z);
            const here = Math.abs(h.y - currentEnd.y) < 1e-6 && Math.abs(h.z - currentEnd.z) < 1e-6;
            const tint = h.rank === 1 ? "bg-primer-100" : "";
            return (
              <Fragment key={`${h.rank}-${h.label}`}>
                <tr className={`border-t border-graphite-200 ${tint}`} data-testid={`hole-row-${h.rank}`}>
                  <td className={`${cell} font-sans font-semibold`}>
                    {h.rank === 1 ? <StatusBadge tone="pass">1 best</StatusBadge> : <span className="figures">{h.rank}.</span>}{" "}
                    <span data-testid={`hole-label-${h.rank}`}>{h.label}</span>
                    {here ? <span className="ml-1"><StatusBadge tone="info">as fitted</StatusBadge></span> : null}
                  </td>
                  <td className={`${cell} text-right`}>{shownValue("length", h.z, units, L)}</td>
                  <td className={`${cell} text-right font-semibold`} data-testid={`hole-ranked-${h.rank}`}>
                    {h.rankedWheelSteerDeg === null ? "cannot reach" : steer(h.rankedWheelSteerDeg)}
                    <span className="block text-xs font-normal text-graphite-700">{atWheelAndRim(h.rankedWheelSteerDeg)}</span>
                  </td>
                </tr>
                <tr className={tint}>
                  <td colSpan={3} className="px-2 pb-2 text-xs text-graphite-700">{detail(<span data-testid={`hole-steer-${h.rank}`}>{steer(h.worstWheelSteerDeg)}</span>, h.rollWheelSteerDeg, h.combinedWheelSteerDeg, bar)}</td>
                </tr>
              </Fragment>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
