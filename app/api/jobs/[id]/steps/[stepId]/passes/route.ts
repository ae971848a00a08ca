import { NextResponse } from "next/server";
import { recordWeldPass } from "@/db/queries/jobs-steps";
import { shopRoute } from "@/lib/api/route";
import { weldPassSchema } from "@/lib/jobs/schemas";
import { idParam } from "../../../../_lib/params";

export const dynamic = "force-dynamic";

// POST /api/jobs/{id}/steps/{stepId}/passes { clientKey, volts, amps, travelSpeed: { value, unit }, preheatC, interpassC?, fillerLot }
// → 201 { passId, record } (200 when clientKey was already recorded). Preheat below the step's minimum: 422.
export const POST = shopRoute({ action: "weld:log", body: weldPassSchema }, async ({ ctx, params, body }) => {
  const result = await recordWeldPass(ctx, idParam(params, "id", "Job"), idParam(params, "stepId", "Step"), body);
  return NextResponse.json({ passId: result.passId, record: result.record }, { status: result.created ? 201 : 200 });
});
