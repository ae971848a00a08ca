import type { Metadata } from "next";
import { CalcCautions } from "@/components/calc/calc-cautions";
import { PageHeader } from "@/components/page-header";
import { SafetyNote } from "@/components/safety-note";
import { requireShop } from "@/lib/auth/context";
import { FilletCalculator } from "./_components/fillet-calculator";

export const metadata: Metadata = { title: "Fillet weld" };

export default async function FilletWeldPage() {
  const ctx = await requireShop("calc:use");
  return (
    <>
      <PageHeader title="Fillet weld" lead="Throat, design strength and minimum size of a bracket's fillet welds (AISC 360-16 J2, AWS D1.1:2020 Table 7.7), and whether they hold a given load." />
      <SafetyNote className="mb-5 max-w-4xl" />
      <FilletCalculator initialUnits={ctx.unitSystem} />
      <div className="mt-8 max-w-4xl">
        <CalcCautions kind="fillet" note={false} title="What this does not check" />
      </div>
    </>
  );
}
