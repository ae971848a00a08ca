import { releasedJobPage } from "@/db/queries/audit";
import { getJobRecord } from "@/db/queries/jobs-core";
import { shopRoute } from "@/lib/api/route";
import { bulkCsvHeader, bulkCsvLines } from "@/lib/records/bulk-csv";
import { auditExportQuerySchema } from "@/lib/schemas/audit";

export const dynamic = "force-dynamic";

// Jobs read per round trip: enough to keep the stream busy, few enough that memory stays flat however many
// jobs the range holds.
const PAGE = 25;

// Released jobs as one CSV, a row per recorded value: GET /api/records/export.csv?from=&to=&q=
// Streamed page by page, so a year of jobs starts downloading at once and is never held whole in memory.
export const GET = shopRoute({ action: "audit:search" }, async ({ ctx, query }) => {
  const q = auditExportQuerySchema.parse(Object.fromEntries(query));
  let after: { releasedAt: Date; id: string } | null = null;
  let done = false;
  const encoder = new TextEncoder();
  const stream = new ReadableStream<Uint8Array>({
    start(controller) {
      controller.enqueue(encoder.encode(bulkCsvHeader()));
    },
    async pull(controller) {
      if (done) return;
      try {
        const page = await releasedJobPage(ctx.shopId, q, after, PAGE);
        for (const row of page) controller.enqueue(encoder.encode(bulkCsvLines(await getJobRecord(ctx, row.id))));
        if (page.length < PAGE) {
          done = true;
          controller.close();
        } else {
          after = page.at(-1)!;
        }
      } catch (error) {
        // Headers are gone by now: end the download as failed rather than hand over a file cut short.
        console.error("records export failed", error);
        done = true;
        controller.error(error);
      }
    },
  });
  const name = ["released-jobs", q.from, q.to].filter(Boolean).join("_");
  return new Response(stream, {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="${name}.csv"`,
      "Cache-Control": "no-store",
    },
  });
});
