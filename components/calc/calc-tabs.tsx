"use client";
import Link from "next/link";
import { usePathname } from "next/navigation";

export const CALC_TABS = [
  { href: "/calc", label: "All" },
  { href: "/calc/steering", label: "Steering links" },
  { href: "/calc/heat-input", label: "Heat input" },
  { href: "/calc/fillet-weld", label: "Fillet weld" },
  { href: "/calc/coating", label: "Coating conditions" },
  { href: "/calc/dft", label: "Film thickness" },
  { href: "/calc/units", label: "Units" },
] as const;

// Tabs are links (each calculator has its own address); the open one is marked by a bar and a ▸, not colour alone.
export function CalcTabs() {
  const path = usePathname();
  return (
    <nav aria-label="Calculators" className="no-print mb-5">
      <ul className="flex flex-wrap gap-x-1 border-b-2 border-graphite-200">
        {CALC_TABS.map((t) => {
          const current = t.href === "/calc" ? path === "/calc" : path === t.href || path.startsWith(`${t.href}/`);
          return (
            <li key={t.href}>
              <Link
                href={t.href}
                aria-current={current ? "page" : undefined}
                className={`-mb-0.5 flex min-h-11 items-center gap-1 border-b-4 px-3 font-semibold ${
                  current ? "border-graphite-900 text-graphite-950" : "border-transparent text-graphite-700 hover:border-graphite-300 hover:text-graphite-950"
                }`}
              >
                {current ? <span aria-hidden="true">▸</span> : null}
                {t.label}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
