import { publishVersion } from "@/db/queries/procedures";
import { shopRoute } from "@/lib/api/route";
import { publishBody } from "@/lib/procedures/forms";
import { procedureIdFrom, versionNumberFrom } from "../../../../_lib/params";

export const dynamic = "force-dynamic";

// Seals a draft: computes its SHA-256, records the change note and publisher. By default the previously
// published version is retired in the same transaction, so new jobs take the new one.
export const POST = shopRoute({ action: "procedure:write", body: publishBody }, async ({ ctx, params, body }) => {
  const r = await publishVersion({
    shopId: ctx.shopId,
    procedureId: procedureIdFrom(params),
    number: versionNumberFrom(params),
    actorId: ctx.userId,
    changeNote: body.changeNote,
    retirePrevious: body.retirePrevious,
  });
  return { version: { number: r.number, status: "published", contentHash: r.contentHash, publishedAt: r.publishedAt }, retired: r.retired };
});
