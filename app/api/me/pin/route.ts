import { assertAccountPassword, setOwnPin } from "@/db/queries/people";
import { shopRoute } from "@/lib/api/route";
import { pinApiSchema } from "@/lib/schemas/people";

export const dynamic = "force-dynamic";

export const PUT = shopRoute({ action: "shop:read", body: pinApiSchema }, async ({ ctx, body }) => {
  await assertAccountPassword(ctx.userId, body.password);
  await setOwnPin({ shopId: ctx.shopId, userId: ctx.userId, pin: body.pin });
  return { pin: { set: true } };
});
