import { z } from "zod";
import { travellerPdf } from "@/db/queries/traveller";
import { shopRoute } from "@/lib/api/route";
import { AppError } from "@/lib/errors";

export const dynamic = "force-dynamic";

const querySchema = z.object({ paper: z.enum(["a4", "letter"], { message: "paper is a4 or letter." }).default("a4") });

// GET /api/jobs/{id}/traveller?paper=a4|letter — members of the shop; a job not yet released prints as work in progress.
export const GET = shopRoute({ action: "job:read" }, async ({ ctx, params, query }) => {
  const id = typeof params.id === "string" && /^[0-9a-f-]{36}$/i.test(params.id) ? params.id : null;
  if (!id) throw new AppError("not_found", "Job not found.");
  const { paper } = querySchema.parse(Object.fromEntries(query));
  const { pdf, jobNumber, released } = await travellerPdf(ctx, id, paper);
  return new Response(new Uint8Array(pdf), {
    headers: {
      "Content-Type": "application/pdf",
      "Content-Disposition": `inline; filename="${jobNumber}-traveller${released ? "" : "-wip"}.pdf"`,
      "Cache-Control": "private, no-store",
    },
  });
});
