import { redirect } from "next/navigation";
import { homePathFor } from "@/lib/authz";
import { getSessionUser, getShopContext } from "@/lib/auth/context";

export default async function Root() {
  const user = await getSessionUser();
  if (!user) redirect("/sign-in");
  const ctx = await getShopContext();
  if (!ctx) redirect("/no-shop");
  redirect(homePathFor(ctx.roles));
}
