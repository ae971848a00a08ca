import type { Metadata } from "next";
import { PageHeader } from "@/components/page-header";
import { PinStatus } from "@/components/pin-status";
import { requireShop } from "@/lib/auth/context";
import { myPinState } from "@/db/queries/me";
import { holdPointsWaiting, nonconformancesWaiting } from "@/db/queries/jobs";
import { jointsAwaitingInspection } from "@/db/queries/jobs-welds";
import Link from "next/link";
import { DeskJobList } from "../../jobs/_components/desk-list";
import { WaitingJoints } from "../../inspections/_components/waiting-joints";

const DESK_WELDS = 25;

export const metadata: Metadata = { title: "Inspection desk" };

export default async function InspectorHome() {
  const ctx = await requireShop("inspection:sign");
  const [pin, holds, ncs, welds] = await Promise.all([
    myPinState(ctx.shopId, ctx.userId),
    holdPointsWaiting(ctx.shopId, ctx.userId),
    nonconformancesWaiting(ctx.shopId, ctx.userId),
    jointsAwaitingInspection(ctx.shopId, ctx.userId, { limit: DESK_WELDS }),
  ]);
  return (
    <>
      <PageHeader title="Inspection desk" lead={`Hold points and welds waiting for you at ${ctx.shop.name}.`} />
      <section className="card mb-4 p-4" aria-labelledby="welds-h">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="welds-h" className="font-bold">
            Welds waiting for inspection <span className="figures font-semibold text-graphite-700">({welds.total})</span>
          </h2>
          {welds.total > DESK_WELDS ? (
            <Link href="/inspections" className="btn btn-quiet min-h-12" data-testid="welds-more">All {welds.total} waiting →</Link>
          ) : null}
        </div>
        <WaitingJoints joints={welds.rows} empty="No weld is waiting for inspection." />
      </section>
      <div className="mb-4 grid gap-4 lg:grid-cols-2">
        <section className="card p-4" aria-labelledby="holds-h">
          <h2 id="holds-h" className="font-bold">Hold points waiting</h2>
          <DeskJobList jobs={holds} empty="No hold point is waiting." href={(j) => `/run/${j.id}`} extra={(j) => `‖ ${j.holdTitle}${j.mine ? " · assigned to you" : ""}`} testId="holds-waiting" />
        </section>
        <section className="card p-4" aria-labelledby="ncs-h">
          <h2 id="ncs-h" className="font-bold">Nonconformances to disposition</h2>
          {ncs.length ? (
            <ul className="mt-2 divide-y divide-graphite-100" data-testid="ncs-waiting">
              {ncs.map((n) => (
                <li key={n.id} className="py-2">
                  <Link href={`/jobs/${n.job_id}?tab=nonconformances`} className="block min-h-12 rounded-md px-1 hover:bg-graphite-50">
                    <span className="font-bold">✕ NC-{n.number}</span> · <span className="figures">{n.job_number}</span> · {n.step_title}
                    <span className="block text-sm text-graphite-700">{n.description} — raised by {n.raised_by_name}</span>
                  </Link>
                </li>
              ))}
            </ul>
          ) : <p className="mt-2 text-graphite-700" data-testid="ncs-waiting">None waiting for you.</p>}
        </section>
      </div>
      <div className="grid gap-4 md:grid-cols-2">
        <PinStatus hasPin={pin.hasPin} locked={pin.locked} />
        <section className="card p-4" aria-labelledby="rules-h">
          <h2 id="rules-h" className="font-bold">Your sign-offs</h2>
          <ul className="mt-2 list-disc space-y-1 pl-5">
            <li>You never inspect a weld you made a pass of, whatever roles you hold.</li>
            <li>Inspect welds once they have cooled to ambient temperature.</li>
            <li>Each acceptance or rejection is signed with your PIN and kept for good.</li>
          </ul>
        </section>
      </div>
    </>
  );
}
