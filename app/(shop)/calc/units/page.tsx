import type { Metadata } from "next";
import { CalcCautions } from "@/components/calc/calc-cautions";
import { PageHeader } from "@/components/page-header";
import { SafetyNote } from "@/components/safety-note";
import { requireShop } from "@/lib/auth/context";
import { UnitsConverter } from "./_components/units-converter";

export const metadata: Metadata = { title: "Units" };

export default async function UnitsPage() {
  const ctx = await requireShop("calc:use");
  return (
    <>
      <PageHeader title="Units" lead="Type a value the way the shop says it and read it in every unit." />
      <SafetyNote className="mb-5 max-w-4xl" />
      <UnitsConverter initialUnits={ctx.unitSystem} />
      <div className="mt-8 max-w-4xl">
        <CalcCautions kind="units" note={false} />
      </div>
    </>
  );
}
