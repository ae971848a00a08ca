import "server-only";
import { and, eq } from "drizzle-orm";
import { cookies, headers } from "next/headers";
import { redirect } from "next/navigation";
import { cache } from "react";
import { membership, shop } from "@/db/schema";
import { authorize, can, type Action, type Principal, type Role } from "@/lib/authz";
import { getAuth } from "@/lib/auth";
import { db } from "@/lib/db";

export const SHOP_COOKIE = "gusset_shop";

export type ShopContext = Omit<Principal, "roles"> & {
  user: { id: string; name: string; email: string };
  shop: { id: string; name: string; slug: string; continuityCode: "asme-ix" | "aws-d1.1" };
  roles: Role[];
  membershipId: string;
  /** the membership's legal name: what sign-offs print (a lead sets it; the account's own name never does) */
  legalName: string;
  unitSystem: "metric" | "imperial";
  shops: { id: string; name: string }[];
};

type SessionUser = { id: string; name: string; email: string };

export async function sessionFromHeaders(h: Headers): Promise<SessionUser | null> {
  const result = await getAuth(h).api.getSession({ headers: h });
  if (!result) return null;
  return { id: result.user.id, name: result.user.name, email: result.user.email };
}

// Resolve the person's shop: the one named by the cookie (or header) when they are an active member of it,
// else their first active shop. Inactive memberships never resolve.
export async function shopContextFor(user: SessionUser, wantedShopId: string | undefined): Promise<ShopContext | null> {
  const rows = await db()
    .select({
      membershipId: membership.id,
      roles: membership.roles,
      legalName: membership.legalName,
      active: membership.active,
      unitSystem: membership.unitSystem,
      shopId: shop.id,
      shopName: shop.name,
      shopSlug: shop.slug,
      continuityCode: shop.continuityCode,
    })
    .from(membership)
    .innerJoin(shop, eq(shop.id, membership.shopId))
    .where(and(eq(membership.userId, user.id), eq(membership.active, true)))
    .orderBy(shop.name);
  if (rows.length === 0) return null;
  const row = rows.find((r) => r.shopId === wantedShopId) ?? rows[0]!;
  return {
    userId: user.id,
    shopId: row.shopId,
    roles: row.roles,
    active: row.active,
    user,
    shop: { id: row.shopId, name: row.shopName, slug: row.shopSlug, continuityCode: row.continuityCode },
    membershipId: row.membershipId,
    legalName: row.legalName,
    unitSystem: row.unitSystem,
    shops: rows.map((r) => ({ id: r.shopId, name: r.shopName })),
  };
}

// For server components and server actions: one lookup per request.
export const getShopContext = cache(async (): Promise<ShopContext | null> => {
  const h = await headers();
  const user = await sessionFromHeaders(h);
  if (!user) return null;
  const wanted = (await cookies()).get(SHOP_COOKIE)?.value;
  return shopContextFor(user, wanted);
});

export const getSessionUser = cache(async () => sessionFromHeaders(await headers()));

// For server actions and other code that must answer with an error rather than a page.
export async function authorizeShop(action: Action): Promise<ShopContext> {
  const ctx = await getShopContext();
  authorize(ctx, action);
  return ctx as ShopContext;
}

// For pages: a signed-out visitor goes to sign-in, a role that may not see the page to a plain refusal.
export async function requireShop(action: Action): Promise<ShopContext> {
  const ctx = await getShopContext();
  if (!ctx) redirect((await getSessionUser()) ? "/no-shop" : "/sign-in");
  if (!can(ctx.roles, action)) redirect(`/denied?for=${encodeURIComponent(action)}`);
  return ctx;
}
