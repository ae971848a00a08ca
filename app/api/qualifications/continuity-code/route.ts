import { setContinuityCode, shopContinuityCode } from "@/db/queries/qualifications";
import { shopRoute } from "@/lib/api/route";
import { CODE_LABELS, CODE_RULES, continuityCodeSchema } from "@/lib/welding/qualification-schema";

export const dynamic = "force-dynamic";

function describe(code: keyof typeof CODE_LABELS) {
  return { code, label: CODE_LABELS[code], rule: CODE_RULES[code] };
}

// Which code's continuity rule the shop follows; a lead may switch it, and every status follows at once.
export const GET = shopRoute({ action: "job:read" }, async ({ ctx }) => ({ continuity: describe(await shopContinuityCode(ctx.shopId)) }));

export const PUT = shopRoute({ action: "qualification:write", body: continuityCodeSchema }, async ({ ctx, body }) => {
  await setContinuityCode({ shopId: ctx.shopId, code: body.code, actorId: ctx.userId });
  return { continuity: describe(body.code) };
});
