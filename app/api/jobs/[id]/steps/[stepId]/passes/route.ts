import { NextResponse } from "next/server";
import { recordWeldPass } from "@/db/queries/jobs-steps";
import { shopRoute } from "@/lib/api/route";
import { weldPassSchema } from "@/lib/jobs/schemas";
import { idParam } from "../../../../_lib/params";

export const dynamic = "force-dynamic";

// POST /api/jobs/{id}/steps/{stepId}/passes { clientKey, volts, amps, travelSpeed?: { value, unit } | beadLength + arcTimeS,
// machineEnergyKJ?, machinePowerW?, position?, preheatC, interpassC?, fillerLot } → 201 { passId, record } (200 when
// clientKey was already recorded). Checked against the step's published WPS revision: preheat below its
// minimum or the step's: 422; other values out of range are recorded and flagged. A welder without a current
// qualification for the process: 403 with the reason and the day it lapsed. A signed or accepted round: 409.
export const POST = shopRoute({ action: "weld:log", body: weldPassSchema }, async ({ ctx, params, body }) => {
  const result = await recordWeldPass(ctx, idParam(params, "id", "Job"), idParam(params, "stepId", "Step"), body);
  return NextResponse.json({ passId: result.passId, record: result.record }, { status: result.created ? 201 : 200 });
});
