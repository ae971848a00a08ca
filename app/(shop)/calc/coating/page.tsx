import type { Metadata } from "next";
import { CalcCautions } from "@/components/calc/calc-cautions";
import { PageHeader } from "@/components/page-header";
import { SafetyNote } from "@/components/safety-note";
import { requireShop } from "@/lib/auth/context";
import { DewPointCalculator } from "./_components/dew-point-calculator";

export const metadata: Metadata = { title: "Coating conditions" };

export default async function CoatingPage() {
  const ctx = await requireShop("calc:use");
  return (
    <>
      <PageHeader title="Coating conditions" lead="Dew point from the air temperature and humidity, and whether the steel is warm enough above it to take a coating." />
      <SafetyNote className="mb-5 max-w-4xl" />
      <DewPointCalculator initialUnits={ctx.unitSystem} />
      <div className="mt-8 max-w-4xl">
        <CalcCautions kind="coating" note={false} title="Coatings" />
      </div>
    </>
  );
}
