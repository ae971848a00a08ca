import { computeSteeringGeometry } from "@/lib/geometry";
import { AppError } from "@/lib/errors";
import { calcRoute } from "../_lib/calc-route";
import { ANONYMOUS_WORK_BUDGET, steeringRequestSchema, steeringWork } from "@/lib/calc/steering-request";

export const dynamic = "force-dynamic";

// Front-view steering links at ride height: link angles, heave and roll sweeps, worst steer, hole ranking,
// and the best axle-end (and frame-end) height on each end's vertical line.
export const POST = calcRoute(
  steeringRequestSchema,
  (body) => computeSteeringGeometry(body),
  async (body, principal) => {
    const work = steeringWork(body);
    if (work <= ANONYMOUS_WORK_BUDGET) return;
    if (await principal()) return;
    throw new AppError(
      "payload_too_large",
      `This sweep needs ${work.toLocaleString("en-US")} link evaluations; without signing in at most ${ANONYMOUS_WORK_BUDGET.toLocaleString("en-US")} are worked out per request. Use a larger travel step or fewer holes, or sign in.`,
      { "travel.step": [`at most ${ANONYMOUS_WORK_BUDGET.toLocaleString("en-US")} link evaluations without signing in`] },
      { reason: "anonymous_work_limit", work, limit: ANONYMOUS_WORK_BUDGET },
    );
  },
);
