import { redirect } from "next/navigation";
import { getSessionUser, getShopContext } from "@/lib/auth/context";

// The runner takes the whole tablet screen: no side navigation, its own top bar. Same checks as (shop).
export default async function RunnerLayout({ children }: { children: React.ReactNode }) {
  const user = await getSessionUser();
  if (!user) redirect("/sign-in");
  const ctx = await getShopContext();
  if (!ctx) redirect("/no-shop");
  return <div className="min-h-screen bg-graphite-50">{children}</div>;
}
