import type { Metadata } from "next";
import { PageHeader } from "@/components/page-header";
import { PinStatus } from "@/components/pin-status";
import { SafetyCautions } from "@/components/safety-cautions";
import { requireShop } from "@/lib/auth/context";
import { myPinState } from "@/db/queries/me";
import { jobsAssignedTo } from "@/db/queries/jobs";
import { DeskJobList } from "../../jobs/_components/desk-list";

export const metadata: Metadata = { title: "Bench" };

export default async function WelderHome() {
  const ctx = await requireShop("step:sign");
  const [pin, mine] = await Promise.all([myPinState(ctx.shopId, ctx.userId), jobsAssignedTo(ctx.shopId, ctx.userId)]);
  return (
    <>
      <PageHeader title="Bench" lead={`Your work at ${ctx.shop.name}. Checklists you run are signed with your PIN.`} />
      <section className="card mb-4 p-4" aria-labelledby="mine-h">
        <h2 id="mine-h" className="font-bold">Your jobs</h2>
        <DeskJobList jobs={mine} empty="No open job is assigned to you." href={(j) => `/run/${j.id}`} testId="my-jobs" />
      </section>
      <div className="grid gap-4 md:grid-cols-2">
        <PinStatus hasPin={pin.hasPin} locked={pin.locked} />
        <section className="card p-4" aria-labelledby="units-h">
          <h2 id="units-h" className="font-bold">Your units</h2>
          <p className="mt-2">Entries are shown in <strong data-testid="unit-system">{ctx.unitSystem === "imperial" ? "inches, °F and lbf·ft" : "millimetres, °C and N·m"}</strong> and always stored in SI.</p>
        </section>
      </div>
      <div className="mt-4"><SafetyCautions /></div>
    </>
  );
}
