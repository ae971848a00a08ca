import { redirect } from "next/navigation";
import { homePathFor } from "@/lib/authz";
import { getShopContext } from "@/lib/auth/context";

// `/home` is what people type or bookmark: it sends each person to the desk of their main role.
export default async function Home() {
  const ctx = await getShopContext();
  if (!ctx) redirect("/no-shop");
  redirect(homePathFor(ctx.roles));
}
