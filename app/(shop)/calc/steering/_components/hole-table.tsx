import { StatusBadge } from "@/components/status-badge";
import { toeAtRim, type OptimumResult, type Point2, type SteeringResult } from "@/lib/geometry";
import { figure, shown, shownValue, symbolFor, type UnitSystem } from "@/components/calc/values";

const L = { metric: 1, imperial: 3 } as const;

const RANK_WORDS = { heave: "heave alone", heaveAndRoll: "heave and roll, each on its own", combined: "heave and roll together (every heave point at every roll angle)" } as const;

// Candidate holes, best first by the chosen measure, with the best height on the hole line as its own
// "drill here" row. Each row gives wheel steer over heave, roll and combined, and what that is at the steering
// wheel and at the rim.
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
  const ranked = (v: number | null) => (v === null ? null : v);
  const extras = (v: number | null) => (
    <>
      {ratio !== undefined ? <td className="px-3 py-2 text-right">{v === null ? "—" : `${figure(v * ratio, 1, { sign: true })}°`}</td> : null}
      {rimDiameter !== undefined ? <td className="px-3 py-2 text-right">{v === null ? "—" : shown("length", toeAtRim(v, rimDiameter), units, { metric: 1, imperial: 3 }, { sign: true })}</td> : null}
    </>
  );
  return (
    <div className="card overflow-x-auto">
      <table className="w-full border-collapse text-left text-sm" data-testid="hole-ranking">
        <caption className="sr-only">Candidate holes ranked by the largest wheel steer over {RANK_WORDS[result.rankBy ?? "heave"]}, smallest first</caption>
        <thead className="bg-graphite-100">
          <tr>
            <th scope="col" className="px-3 py-2">Rank</th>
            <th scope="col" className="px-3 py-2">Hole</th>
            <th scope="col" className="px-3 py-2 text-right">Height z, {u}</th>
            <th scope="col" className="px-3 py-2 text-right">Bar, {u}</th>
            <th scope="col" className="px-3 py-2 text-right">Heave</th>
            {hasRoll ? <th scope="col" className="px-3 py-2 text-right">Roll</th> : null}
            {hasCombined ? <th scope="col" className="px-3 py-2 text-right">Both</th> : null}
            {ratio !== undefined ? <th scope="col" className="px-3 py-2 text-right">Steering wheel</th> : null}
            {rimDiameter !== undefined ? <th scope="col" className="px-3 py-2 text-right">Toe at rim</th> : null}
          </tr>
        </thead>
        <tbody className="figures">
          <tr className="border-t-2 border-graphite-900 bg-white" data-testid="optimum-row">
            <td className="px-3 py-2"><StatusBadge tone="info">drill here</StatusBadge></td>
            <td className="px-3 py-2 font-sans font-semibold">Best height on the line</td>
            <td className="px-3 py-2 text-right font-semibold" data-testid="optimum-z">{shownValue("length", optimum.z, units, L)}</td>
            <td className="px-3 py-2 text-right">{shownValue("length", optimum.barLength, units, L)}</td>
            <td className="px-3 py-2 text-right">{steer(optimum.heaveWheelSteerDeg)}</td>
            {hasRoll ? <td className="px-3 py-2 text-right">{steer(optimum.rollWheelSteerDeg)}</td> : null}
            {hasCombined ? <td className="px-3 py-2 text-right">{steer(optimum.combinedWheelSteerDeg)}</td> : null}
            {extras(ranked(hasCombined ? optimum.combinedWheelSteerDeg : optimum.heaveWheelSteerDeg))}
          </tr>
          {holes.map((h) => {
            const bar = Math.hypot(h.y - fixedEnd.y, h.z - fixedEnd.z);
            const here = Math.abs(h.y - currentEnd.y) < 1e-6 && Math.abs(h.z - currentEnd.z) < 1e-6;
            return (
              <tr key={`${h.rank}-${h.label}`} className={`border-t border-graphite-200 ${h.rank === 1 ? "bg-primer-100" : ""}`} data-testid={`hole-row-${h.rank}`}>
                <td className="px-3 py-2 font-semibold">
                  {h.rank === 1 ? <StatusBadge tone="pass">1 best</StatusBadge> : h.rank}
                </td>
                <td className="px-3 py-2 font-sans font-semibold" data-testid={`hole-label-${h.rank}`}>
                  {h.label}
                  {here ? <span className="ml-2"><StatusBadge tone="info">as fitted</StatusBadge></span> : null}
                </td>
                <td className="px-3 py-2 text-right">{shownValue("length", h.z, units, L)}</td>
                <td className="px-3 py-2 text-right">{shownValue("length", bar, units, L)}</td>
                <td className="px-3 py-2 text-right font-semibold" data-testid={`hole-steer-${h.rank}`}>{steer(h.worstWheelSteerDeg)}</td>
                {hasRoll ? <td className="px-3 py-2 text-right">{steer(h.rollWheelSteerDeg)}</td> : null}
                {hasCombined ? <td className="px-3 py-2 text-right">{steer(h.combinedWheelSteerDeg)}</td> : null}
                {extras(h.rankedWheelSteerDeg)}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
