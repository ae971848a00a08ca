"use client";
import Link from "next/link";
import { usePathname } from "next/navigation";

export function NavLink({ href, label }: { href: string; label: string }) {
  const path = usePathname();
  const current = path === href || path.startsWith(`${href}/`);
  return (
    <Link
      href={href}
      aria-current={current ? "page" : undefined}
      className={`flex min-h-11 items-center rounded-md px-3 font-semibold ${
        current ? "bg-primer-500 text-graphite-950" : "text-graphite-100 hover:bg-graphite-700"
      }`}
    >
      {current ? <span aria-hidden="true" className="mr-2">▸</span> : null}
      {label}
    </Link>
  );
}
