import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { SafetyNote } from "@/components/safety-note";
import { requireShop } from "@/lib/auth/context";

export const metadata: Metadata = { title: "Calculators" };

const CARDS = [
  {
    href: "/calc/steering",
    title: "Steering links",
    what: "Front view of the lateral link and drag link at ride height: bump steer over heave and roll, and which bracket hole steers least.",
    basis: "Link arcs solved exactly; first order d ≈ h·(tan θ link − tan θ drag)",
    mark: "links",
  },
  {
    href: "/calc/heat-input",
    title: "Heat input",
    what: "Volts, amps and travel speed to J/in and kJ/mm as you type, with a heat-tint gauge.",
    basis: "ASME IX QW-409.1 · ISO/TR 17671-1",
    mark: "heat",
  },
  {
    href: "/calc/fillet-weld",
    title: "Fillet weld",
    what: "Throat, design strength and minimum size of a bracket's fillet welds, checked against a load.",
    basis: "AISC 360-16 J2.2a, J2.4 · AWS D1.1:2020 Table 7.7",
    mark: "fillet",
  },
  {
    href: "/calc/coating",
    title: "Coating conditions",
    what: "Dew point from air temperature and humidity; is the steel warm enough above it to coat?",
    basis: "Magnus (Alduchov & Eskridge 1996) · 3 °C rule · RH 85 %",
    mark: "drop",
  },
  {
    href: "/calc/dft",
    title: "Film thickness",
    what: "Gauge readings to spot and area averages, each judged against the specified dry film thickness.",
    basis: "SSPC-PA 2 (2015, ed. 2018)",
    mark: "film",
  },
  {
    href: "/calc/units",
    title: "Units",
    what: "Type a value as the shop says it (3 1/4\", 65 ft-lb, 300F) and read it in every unit.",
    basis: "NIST SP 811 (2008) Appendix B factors",
    mark: "units",
  },
] as const;

// Small line drawings of what each calculator is about, in the accent colour on graphite.
function Mark({ kind }: { kind: (typeof CARDS)[number]["mark"] }) {
  const common = { fill: "none", stroke: "currentColor", strokeWidth: 2.5, strokeLinecap: "round" as const, strokeLinejoin: "round" as const };
  return (
    <svg viewBox="0 0 32 32" className="h-8 w-8">
      {kind === "links" ? (
        <>
          <path d="M5 12 L27 8 M5 22 L27 18" {...common} />
          <circle cx="5" cy="12" r="2.5" fill="currentColor" />
          <circle cx="5" cy="22" r="2.5" fill="currentColor" />
        </>
      ) : kind === "heat" ? (
        <path d="M4 10 q4 -4 8 0 t8 0 t8 0 M4 17 q4 -4 8 0 t8 0 t8 0 M4 24 q4 -4 8 0 t8 0 t8 0" {...common} />
      ) : kind === "fillet" ? (
        <path d="M6 5 V27 H28 M6 27 L17 16 M6 14 L18 27" {...common} />
      ) : kind === "drop" ? (
        <path d="M16 4 C11 12 8 16 8 20 a8 8 0 0 0 16 0 c0 -4 -3 -8 -8 -16 Z" {...common} />
      ) : kind === "film" ? (
        <path d="M4 9 H28 M4 16 H28 M4 23 H28 M10 9 V23 M22 9 V23" {...common} />
      ) : (
        <path d="M5 11 H25 l-4 -4 M27 21 H7 l4 4" {...common} />
      )}
    </svg>
  );
}

export default async function CalcIndexPage() {
  await requireShop("calc:use");
  return (
    <>
      <PageHeader title="Calculators" lead="Shop-floor figures for bracket jobs. Each computes in your browser as you type; the same computations answer at /api/calc for other tools." />
      <ul className="grid gap-4 md:grid-cols-2 xl:grid-cols-3" data-testid="calc-index">
        {CARDS.map((c) => (
          <li key={c.href}>
            <Link href={c.href} className="card flex h-full min-h-11 gap-4 p-4 hover:border-graphite-600 focus-visible:border-graphite-900">
              <span aria-hidden="true" className="flex h-12 w-12 shrink-0 items-center justify-center rounded-md bg-graphite-900 text-primer-400">
                <Mark kind={c.mark} />
              </span>
              <span>
                <span className="block text-lg font-bold text-graphite-950">{c.title} <span aria-hidden="true">→</span></span>
                <span className="mt-1 block text-graphite-800">{c.what}</span>
                <span className="mt-2 block text-sm text-graphite-600">{c.basis}</span>
              </span>
            </Link>
          </li>
        ))}
      </ul>
      <SafetyNote className="mt-6" />
    </>
  );
}
