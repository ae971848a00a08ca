"use server";
import { cookies, headers } from "next/headers";
import { redirect } from "next/navigation";
import { z } from "zod";
import { homePathFor } from "@/lib/authz";
import { secureCookiesFor } from "@/lib/auth";
import { getSessionUser, SHOP_COOKIE, shopContextFor } from "@/lib/auth/context";

const switchSchema = z.object({ shopId: z.string().uuid() });

// Switching shops only ever selects a shop the person is an active member of.
export async function switchShop(formData: FormData) {
  const user = await getSessionUser();
  if (!user) redirect("/sign-in");
  const parsed = switchSchema.safeParse({ shopId: formData.get("shopId") });
  if (!parsed.success) redirect("/");
  const ctx = await shopContextFor(user, parsed.data.shopId);
  if (!ctx || ctx.shop.id !== parsed.data.shopId) redirect("/");
  (await cookies()).set(SHOP_COOKIE, ctx.shop.id, { httpOnly: true, sameSite: "lax", path: "/", secure: secureCookiesFor(await headers()) });
  redirect(homePathFor(ctx.roles));
}
