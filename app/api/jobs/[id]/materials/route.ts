import { NextResponse } from "next/server";
import { getJobRecord } from "@/db/queries/jobs-core";
import { recordMaterial } from "@/db/queries/jobs-welds";
import { shopRoute } from "@/lib/api/route";
import { materialSchema } from "@/lib/jobs/schemas";
import { idParam } from "../../_lib/params";

export const dynamic = "force-dynamic";

// GET /api/jobs/{id}/materials → { materials } (corrections included, each pointing at what it replaces)
export const GET = shopRoute({ action: "job:read" }, async ({ ctx, params }) => {
  const record = await getJobRecord(ctx, idParam(params, "id", "Job"));
  return { materials: record.materials };
});

// POST /api/jobs/{id}/materials { kind, description, specification?, heatNumber, certificate?, correctsId?, withdrawn?, reason? }
// → 201 { materialId, record }. Entries are never changed: a correction is a new entry naming the old one.
export const POST = shopRoute({ action: "material:record", body: materialSchema }, async ({ ctx, params, body }) => {
  const result = await recordMaterial(ctx, idParam(params, "id", "Job"), body);
  return NextResponse.json(result, { status: 201 });
});
