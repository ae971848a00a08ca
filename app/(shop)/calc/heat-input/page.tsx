import type { Metadata } from "next";
import { CalcCautions } from "@/components/calc/calc-cautions";
import { PageHeader } from "@/components/page-header";
import { SafetyNote } from "@/components/safety-note";
import { requireShop } from "@/lib/auth/context";
import { HeatInputCalculator } from "./_components/heat-input-calculator";

export const metadata: Metadata = { title: "Heat input" };

export default async function HeatInputPage() {
  const ctx = await requireShop("calc:use");
  return (
    <>
      <PageHeader title="Heat input" lead="Heat input of a pass, worked both ways as you type: ASME IX QW-409.1 in J/in and ISO/TR 17671-1 in kJ/mm." />
      <SafetyNote className="mb-5 max-w-4xl" />
      <HeatInputCalculator initialUnits={ctx.unitSystem} />
      <div className="mt-8 max-w-4xl">
        <CalcCautions kind="heatInput" note={false} title="Hot work" />
      </div>
    </>
  );
}
