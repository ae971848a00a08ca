import { getJobRecord } from "@/db/queries/jobs-core";
import { shownIntegrity, verifyJobRecord } from "@/db/queries/records";
import { shopRoute } from "@/lib/api/route";
import { AppError } from "@/lib/errors";
import { recordCsv } from "@/lib/records/csv";

export const dynamic = "force-dynamic";

export const GET = shopRoute({ action: "job:read" }, async ({ ctx, params }) => {
  const id = typeof params.id === "string" && /^[0-9a-f-]{36}$/i.test(params.id) ? params.id : null;
  if (!id) throw new AppError("not_found", "Job not found.");
  const record = await getJobRecord(ctx, id);
  const integrity = await verifyJobRecord(id);
  const csv = recordCsv(record, shownIntegrity(integrity));
  return new Response(csv, {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="${record.job.number}-record.csv"`,
      "Cache-Control": "no-store",
    },
  });
});
