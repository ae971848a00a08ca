import type { Metadata } from "next";
import { PageHeader } from "@/components/page-header";
import { PinStatus } from "@/components/pin-status";
import { SafetyCautions } from "@/components/safety-cautions";
import { requireShop } from "@/lib/auth/context";
import { myPinState } from "@/db/queries/me";
import { jobsAssignedTo } from "@/db/queries/jobs";
import { repairsWaiting } from "@/db/queries/jobs-repairs";
import Link from "next/link";
import { DeskJobList } from "../../jobs/_components/desk-list";

export const metadata: Metadata = { title: "Bench" };

export default async function WelderHome() {
  const ctx = await requireShop("step:sign");
  const [pin, mine, repairs] = await Promise.all([myPinState(ctx.shopId, ctx.userId), jobsAssignedTo(ctx.shopId, ctx.userId), repairsWaiting(ctx.shopId, ctx.userId)]);
  return (
    <>
      <PageHeader title="Bench" lead={`Your work at ${ctx.shop.name}. Checklists you run are signed with your PIN.`} />
      <section className="card mb-4 p-4" aria-labelledby="mine-h">
        <h2 id="mine-h" className="font-bold">Your jobs</h2>
        <DeskJobList jobs={mine} empty="No open job is assigned to you." href={(j) => `/run/${j.id}`} testId="my-jobs" />
      </section>
      {repairs.length ? (
        <section className="card mb-4 border-4 border-graphite-950 p-4" aria-labelledby="repairs-h">
          <h2 id="repairs-h" className="font-bold"><span aria-hidden="true">↺ </span>Welds sent back for repair</h2>
          <ul className="mt-2 divide-y divide-graphite-100" data-testid="repairs-waiting">
            {repairs.map((r) => (
              <li key={`${r.jobId}-${r.stepKey}`} className="py-2">
                <Link href={`/run/${r.jobId}?step=${encodeURIComponent(r.stepKey)}`} className="block min-h-12 rounded-md px-1 hover:bg-graphite-50">
                  <span className="font-bold">{r.jointId} · repair round {r.round}</span> · <span className="figures">{r.jobNumber}</span> · {r.axleTag}
                  <span className="block text-sm text-graphite-700">
                    Rejected by {r.inspectorName}{r.rejectedItems.length ? ` for ${r.rejectedItems.join(", ")}` : ""}{r.notes ? `: ${r.notes}` : ""}
                  </span>
                </Link>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
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
