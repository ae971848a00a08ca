import type { Metadata } from "next";
import { CalcCautions } from "@/components/calc/calc-cautions";
import { PageHeader } from "@/components/page-header";
import { SafetyNote } from "@/components/safety-note";
import { requireShop } from "@/lib/auth/context";
import { can } from "@/lib/authz";
import { SteeringWorkbench } from "./_components/steering-workbench";

export const metadata: Metadata = { title: "Steering links" };

export default async function SteeringPage() {
  const ctx = await requireShop("calc:use");
  return (
    <>
      <PageHeader
        title="Steering links"
        lead="Where to put the lateral link's new bracket so it stays parallel to the drag link: bump steer over heave and roll, worked out exactly from the link arcs, and candidate holes ranked by the wheel steer they leave."
      />
      <SafetyNote className="max-w-4xl" />
      <p className="mb-5 mt-2 max-w-4xl rounded-md border-2 border-graphite-900 bg-verdict-warnbg px-3 py-2 text-sm text-graphite-950" data-testid="steer-caution">
        <span aria-hidden="true" className="mr-1 font-bold">▲</span>
        <strong>Steering and axle-locating parts.</strong> A bad weld or a wrong geometry can put a vehicle off the road: measure twice, have the result checked, and road-test slowly.
      </p>
      <SteeringWorkbench initialUnits={ctx.unitSystem} canSave={can(ctx.roles, "step:sign")} />
      <div className="mt-8 max-w-4xl">
        <CalcCautions kind="steering" note={false} title="Steering parts: before you rely on this" />
      </div>
    </>
  );
}
