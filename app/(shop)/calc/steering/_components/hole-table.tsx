import { StatusBadge } from "@/components/status-badge";
import type { Point2, SteeringResult } from "@/lib/geometry";
import { figure, shownValue, symbolFor, type UnitSystem } from "@/components/calc/values";

const L = { metric: 1, imperial: 3 } as const;

// Candidate holes, best first: the one that keeps wheel steer smallest over the heave sweep.
export function HoleTable({
  result,
  units,
  fixedEnd,
  currentEnd,
  ratio,
}: {
  result: SteeringResult;
  units: UnitSystem;
  /** The lateral-link end that stays put, for each hole's bar length. */
  fixedEnd: Point2;
  /** The end the holes replace, to mark a hole that is where the bracket is now. */
  currentEnd: Point2;
  ratio: number | undefined;
}) {
  const holes = result.holes ?? [];
  const u = symbolFor("length", units);
  return (
    <div className="card overflow-x-auto">
      <table className="w-full border-collapse text-left" data-testid="hole-ranking">
        <caption className="sr-only">Candidate holes ranked by the largest wheel steer over the heave sweep, smallest first</caption>
        <thead className="bg-graphite-100 text-sm">
          <tr>
            <th scope="col" className="px-3 py-2">Rank</th>
            <th scope="col" className="px-3 py-2">Hole</th>
            <th scope="col" className="px-3 py-2 text-right">y, {u}</th>
            <th scope="col" className="px-3 py-2 text-right">z, {u}</th>
            <th scope="col" className="px-3 py-2 text-right">Bar length, {u}</th>
            <th scope="col" className="px-3 py-2 text-right">Lateral link angle</th>
            <th scope="col" className="px-3 py-2 text-right">Drag − lateral</th>
            <th scope="col" className="px-3 py-2 text-right">Worst wheel steer</th>
            {ratio !== undefined ? <th scope="col" className="px-3 py-2 text-right">Steering wheel</th> : null}
          </tr>
        </thead>
        <tbody className="figures">
          {holes.map((h) => {
            const bar = Math.hypot(h.y - fixedEnd.y, h.z - fixedEnd.z);
            const here = Math.abs(h.y - currentEnd.y) < 1e-6 && Math.abs(h.z - currentEnd.z) < 1e-6;
            const diff = result.dragLinkAngleDeg - h.trackBarAngleDeg;
            return (
              <tr key={`${h.rank}-${h.label}`} className={`border-t border-graphite-200 ${h.rank === 1 ? "bg-primer-100" : ""}`} data-testid={`hole-row-${h.rank}`}>
                <td className="px-3 py-2 font-semibold">
                  {h.rank === 1 ? <StatusBadge tone="pass">1 best</StatusBadge> : h.rank}
                </td>
                <td className="px-3 py-2 font-sans font-semibold">
                  {h.label}
                  {here ? <span className="ml-2"><StatusBadge tone="info">as fitted</StatusBadge></span> : null}
                </td>
                <td className="px-3 py-2 text-right">{shownValue("length", h.y, units, L)}</td>
                <td className="px-3 py-2 text-right">{shownValue("length", h.z, units, L)}</td>
                <td className="px-3 py-2 text-right">{shownValue("length", bar, units, L)}</td>
                <td className="px-3 py-2 text-right">{figure(h.trackBarAngleDeg, 2, { sign: true })}°</td>
                <td className="px-3 py-2 text-right">{figure(diff, 2, { sign: true })}°</td>
                <td className="px-3 py-2 text-right font-semibold" data-testid={`hole-steer-${h.rank}`}>{figure(h.worstWheelSteerDeg, 2, { sign: true })}°</td>
                {ratio !== undefined ? <td className="px-3 py-2 text-right">{figure(h.worstWheelSteerDeg * ratio, 1, { sign: true })}°</td> : null}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
