import { archiveAddress, setArchiveAddress } from "@/db/queries/shop-settings";
import { shopRoute } from "@/lib/api/route";
import { archiveAddressSchema } from "@/lib/schemas/people";

export const dynamic = "force-dynamic";

// Where each release's seal is mailed, so a copy of it lives outside the database (a lead sets it).
export const GET = shopRoute({ action: "shop:manage" }, async ({ ctx }) => ({ archive: await archiveAddress(ctx.shopId) }));

export const PUT = shopRoute({ action: "shop:manage", body: archiveAddressSchema }, async ({ ctx, body }) => {
  await setArchiveAddress({ shopId: ctx.shopId, email: body.email, actorId: ctx.userId });
  return { archive: await archiveAddress(ctx.shopId) };
});
