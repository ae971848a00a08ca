import { evaluateDftArea } from "@/lib/coating";
import { dftRequestSchema } from "@/lib/coating/schemas";
import { calcRoute } from "../_lib/calc-route";

export const dynamic = "force-dynamic";

// SSPC-PA 2: gauge readings → spot averages → area average, each judged against the specified range.
export const POST = calcRoute(dftRequestSchema, (body) => ({
  ...evaluateDftArea({ specMin: body.specMin, specMax: body.specMax }, body.spots),
  ...(body.unit ? { unit: body.unit } : {}),
}));
