import { NextResponse } from "next/server";
import { dispositionNonconformance } from "@/db/queries/jobs-nc";
import { shopRoute } from "@/lib/api/route";
import { dispositionSchema } from "@/lib/jobs/schemas";
import { idParam } from "../../../../_lib/params";

export const dynamic = "force-dynamic";

// POST /api/jobs/{id}/nonconformances/{ncId}/disposition { disposition, notes, pin } → 201 { record }.
// The person who raised it is refused (403); a second disposition answers 409.
export const POST = shopRoute({ action: "nonconformance:disposition", body: dispositionSchema }, async ({ ctx, params, body }) => {
  const result = await dispositionNonconformance(ctx, idParam(params, "id", "Job"), idParam(params, "ncId", "Nonconformance"), body);
  return NextResponse.json(result, { status: 201 });
});
