import Link from "next/link";
import { redirect } from "next/navigation";
import { Logo } from "@/components/logo";
import { ROLE_LABELS } from "@/lib/authz";
import { getSessionUser, getShopContext } from "@/lib/auth/context";
import { env } from "@/lib/env";
import { navFor } from "@/lib/nav";
import { switchShop } from "./actions";
import { NavLink } from "./_components/nav-link";
import { SignOutButton } from "./_components/sign-out-button";

export default async function ShopLayout({ children }: { children: React.ReactNode }) {
  const user = await getSessionUser();
  if (!user) redirect("/sign-in");
  const ctx = await getShopContext();
  if (!ctx) redirect("/no-shop");
  const items = navFor(ctx.roles, env().LOCAL_MAILBOX === "on");
  return (
    <div className="min-h-screen lg:grid lg:grid-cols-[15rem_1fr]">
      <aside className="no-print bg-graphite-900 text-white lg:min-h-screen">
        <div className="flex items-center gap-2 px-4 py-4">
          <Logo />
          <span className="text-lg font-bold">Gusset</span>
        </div>
        <div className="px-4 pb-3">
          {ctx.shops.length > 1 ? (
            <form action={switchShop} className="flex gap-2" data-testid="shop-switcher">
              <label htmlFor="shop-switch" className="sr-only">Shop</label>
              <select id="shop-switch" name="shopId" defaultValue={ctx.shop.id} className="min-h-11 w-full rounded-md bg-graphite-800 px-2 text-white">
                {ctx.shops.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
              </select>
              <button className="btn btn-primary px-3" type="submit">Go</button>
            </form>
          ) : (
            <p className="text-sm font-semibold text-graphite-100" data-testid="shop-name">{ctx.shop.name}</p>
          )}
        </div>
        <nav aria-label="Main" className="flex flex-wrap gap-2 px-2 pb-4 lg:flex-col lg:flex-nowrap">
          {items.map((item) => <NavLink key={item.href} href={item.href} label={item.label} />)}
        </nav>
        <details className="mx-2 mb-4 rounded-md bg-graphite-800 p-3" data-testid="account-menu">
          <summary className="flex min-h-11 cursor-pointer list-none flex-col justify-center">
            <span className="font-semibold">{ctx.user.name}</span>
            <span className="text-xs text-graphite-200">{ctx.roles.map((r) => ROLE_LABELS[r]).join(" · ")}</span>
          </summary>
          <div className="mt-3 space-y-2">
            <Link href="/account" className="btn btn-quiet w-full">Account and PIN</Link>
            <SignOutButton />
          </div>
        </details>
      </aside>
      <main className="min-w-0 px-4 py-6 lg:px-8">{children}</main>
    </div>
  );
}
