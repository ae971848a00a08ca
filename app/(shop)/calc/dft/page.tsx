import type { Metadata } from "next";
import { CalcCautions } from "@/components/calc/calc-cautions";
import { PageHeader } from "@/components/page-header";
import { SafetyNote } from "@/components/safety-note";
import { requireShop } from "@/lib/auth/context";
import { DftCalculator } from "./_components/dft-calculator";

export const metadata: Metadata = { title: "Film thickness" };

export default async function DftPage() {
  const ctx = await requireShop("calc:use");
  return (
    <>
      <PageHeader title="Film thickness" lead="Dry film thickness per SSPC-PA 2: gauge readings to spot averages to the area average, each against the specified range." />
      <SafetyNote className="mb-5 max-w-4xl" />
      <DftCalculator initialUnits={ctx.unitSystem} />
      <div className="mt-8 max-w-4xl">
        <CalcCautions kind="coating" note={false} title="Coatings" />
      </div>
    </>
  );
}
