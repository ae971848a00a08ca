import { shopRoute } from "@/lib/api/route";

export const dynamic = "force-dynamic";

export const GET = shopRoute({ action: "shop:read" }, async ({ ctx }) => ({
  user: { id: ctx.user.id, name: ctx.user.name, email: ctx.user.email },
  shop: { id: ctx.shop.id, name: ctx.shop.name },
  roles: ctx.roles,
  shops: ctx.shops,
  unitSystem: ctx.unitSystem,
}));
