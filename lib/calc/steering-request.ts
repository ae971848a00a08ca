import { z } from "zod";
import { holeRangeCount, steeringInputSchema, sweepCount } from "@/lib/geometry";

/**
 * Work budget of one request: link evaluations = heave points × (1 + candidate holes) + roll points.
 * The library's own bounds (10,001 points, 500 holes) allow about 5 million, ≈ 0.2 s of one core; the
 * route is open to anyone, so one request may cost at most a million (≈ 40 ms). A real layout needs far
 * less: 1,000 points × 50 holes is 51,000. The screen checks the same budget, so both refuse alike.
 */
const STEERING_WORK_BUDGET = 1_000_000;

/**
 * Without a session the same route allows far less: a screen's worth of layout (41 points × 5 holes is about
 * 250) fits many times over, a bulk sweep does not. Signed-in members keep STEERING_WORK_BUDGET.
 */
export const ANONYMOUS_WORK_BUDGET = 50_000;

export function steeringWork(v: z.output<typeof steeringInputSchema>): number {
  const heave = sweepCount(-v.travel.droop, v.travel.bump, v.travel.step);
  const roll = v.roll ? sweepCount(-v.roll.maxDeg, v.roll.maxDeg, v.roll.stepDeg) : 0;
  const holes =
    (v.candidateHoles?.length ?? 0) + (v.holeRange ? holeRangeCount(v.holeRange.zMin, v.holeRange.zMax, v.holeRange.pitch) : 0);
  return heave * (1 + holes) + roll;
}

/** Body of POST /api/calc/steering: the library's schema (mm, degrees) plus the work budget. */
export const steeringRequestSchema = steeringInputSchema.superRefine((v, ctx) => {
  const work = steeringWork(v);
  if (work > STEERING_WORK_BUDGET) {
    ctx.addIssue({
      code: "custom",
      path: ["travel", "step"],
      message: `travel step and hole count give ${work.toLocaleString("en-US")} link evaluations; at most ${STEERING_WORK_BUDGET.toLocaleString("en-US")} per request: use a larger step or fewer holes`,
    });
  }
});

export type SteeringRequest = z.input<typeof steeringRequestSchema>;
