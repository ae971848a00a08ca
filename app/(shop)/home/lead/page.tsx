import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { PinStatus } from "@/components/pin-status";
import { StatusBadge } from "@/components/status-badge";
import { ROLE_LABELS, ROLES } from "@/lib/authz";
import { requireShop } from "@/lib/auth/context";
import { myPinState, shopHeadcount } from "@/db/queries/me";
import { listOpenInvitations, shopActivityPage } from "@/db/queries/people";
import { describeActivity } from "@/lib/activity";
import { jobCountsByState, jobsDueSoon, jobsReadyForRelease } from "@/db/queries/jobs";
import { JOB_STATE_LABELS, JOB_STATE_VALUES } from "@/lib/jobs/labels";
import { qualityTiles } from "@/db/queries/quality";
import { percent } from "@/lib/quality/labels";
import { defaultRange } from "@/lib/quality/schema";
import { DeskJobList } from "../../jobs/_components/desk-list";

export const metadata: Metadata = { title: "Lead desk" };

export default async function LeadHome() {
  const ctx = await requireShop("people:manage");
  const last90 = defaultRange(new Date().toISOString().slice(0, 10));
  const [pin, heads, invitations, activity, jobCounts, ready, due, quality] = await Promise.all([
    myPinState(ctx.shopId, ctx.userId),
    shopHeadcount(ctx.shopId),
    listOpenInvitations(ctx.shopId),
    shopActivityPage(ctx.shopId, 8),
    jobCountsByState(ctx.shopId),
    jobsReadyForRelease(ctx.shopId),
    jobsDueSoon(ctx.shopId),
    qualityTiles(ctx.shopId, last90.from, last90.to),
  ]);
  return (
    <>
      <PageHeader title="Lead desk" lead={`${ctx.shop.name}: people, roles and the shop's record.`}>
        <Link href="/people" className="btn btn-primary">Manage people</Link>
      </PageHeader>
      <section className="card mb-4 p-4" aria-labelledby="jobs-h">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id="jobs-h" className="font-bold">Jobs by state</h2>
          <span className="flex gap-2"><Link href="/jobs" className="btn btn-quiet">All jobs</Link><Link href="/jobs/new" className="btn btn-primary">New job</Link></span>
        </div>
        <ul className="mt-3 grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6" data-testid="job-counts">
          {JOB_STATE_VALUES.map((s) => (
            <li key={s}>
              <Link href={`/jobs?status=${s}`} className="block rounded-md bg-graphite-50 p-3 hover:bg-graphite-100">
                <StatusBadge tone={JOB_STATE_LABELS[s].tone}>{JOB_STATE_LABELS[s].label}</StatusBadge>
                <span className="figures mt-1 block text-2xl font-semibold" data-testid={`jobs-${s}`}>{jobCounts[s] ?? 0}</span>
              </Link>
            </li>
          ))}
        </ul>
        <div className="mt-4 grid gap-4 md:grid-cols-2">
          <div>
            <h3 className="font-semibold">Ready for release</h3>
            <DeskJobList jobs={ready} empty="Nothing waiting for release." href={(j) => `/jobs/${j.id}`} testId="ready-jobs" />
          </div>
          <div>
            <h3 className="font-semibold">Open jobs, soonest due</h3>
            <DeskJobList jobs={due} empty="No open jobs." href={(j) => `/jobs/${j.id}`} testId="due-jobs" />
          </div>
        </div>
      </section>
      <section className="card mb-4 p-4" aria-labelledby="quality-h">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id="quality-h" className="font-bold">Quality, last 90 days</h2>
          <Link href="/quality" className="btn btn-quiet">Quality screen</Link>
        </div>
        <ul className="mt-3 grid gap-3 sm:grid-cols-3" data-testid="quality-tiles">
          <li>
            <Link href="/quality#section-yield" className="block min-h-12 rounded-md bg-graphite-50 p-3 hover:bg-graphite-100" data-testid="tile-fpy">
              <span className="text-sm text-graphite-600">First-pass yield</span>
              <span className="figures block text-2xl font-semibold">{percent(quality.firstPassYield.ratio)}</span>
              <span className="figures block text-sm">{quality.firstPassYield.acceptedFirst} of {quality.firstPassYield.inspected} joints</span>
            </Link>
          </li>
          <li>
            <Link href="/quality#section-nc" className="block min-h-12 rounded-md bg-graphite-50 p-3 hover:bg-graphite-100" data-testid="tile-nc">
              <span className="text-sm text-graphite-600">Open nonconformances</span>
              <span className="figures block text-2xl font-semibold">{quality.openNonconformances}</span>
              <span className="block text-sm">{quality.openNonconformances ? <StatusBadge tone="warn">waiting for a disposition</StatusBadge> : <StatusBadge tone="pass">none open</StatusBadge>}</span>
            </Link>
          </li>
          <li>
            <Link href="/quality#section-wait" className="block min-h-12 rounded-md bg-graphite-50 p-3 hover:bg-graphite-100" data-testid="tile-wait">
              <span className="text-sm text-graphite-600">Joints waiting for inspection</span>
              <span className="figures block text-2xl font-semibold">{quality.waitingNow}</span>
              <span className="figures block text-sm">{quality.oldestWaitingHours === null ? "none waiting" : `oldest ${quality.oldestWaitingHours} h`}</span>
            </Link>
          </li>
        </ul>
      </section>
      <div className="grid gap-4 md:grid-cols-3">
        <section className="card p-4 md:col-span-2" aria-labelledby="crew-h">
          <h2 id="crew-h" className="font-bold">Crew by role</h2>
          <dl className="mt-3 grid grid-cols-2 gap-3 sm:grid-cols-4">
            {ROLES.map((r) => (
              <div key={r} className="rounded-md bg-graphite-50 p-3">
                <dt className="text-sm text-graphite-600">{ROLE_LABELS[r]}</dt>
                <dd className="figures text-2xl font-semibold" data-testid={`count-${r}`}>{heads.counts[r] ?? 0}</dd>
              </div>
            ))}
          </dl>
          <p className="mt-3">
            {heads.withoutPin > 0 ? (
              <StatusBadge tone="warn">{heads.withoutPin} active {heads.withoutPin === 1 ? "person has" : "people have"} no signing PIN</StatusBadge>
            ) : (
              <StatusBadge tone="pass">Everyone active has a signing PIN</StatusBadge>
            )}
          </p>
          <p className="mt-2 text-sm text-graphite-600">{invitations.length} open {invitations.length === 1 ? "invitation" : "invitations"}.</p>
        </section>
        <PinStatus hasPin={pin.hasPin} locked={pin.locked} />
      </div>
      <section className="card mt-4 p-4" aria-labelledby="act-h">
        <h2 id="act-h" className="font-bold">Recent shop activity</h2>
        {activity.length === 0 ? (
          <p className="mt-2 text-graphite-600">Nothing yet.</p>
        ) : (
          <ol className="mt-2 divide-y divide-graphite-100">
            {activity.map((a) => (
              <li key={a.id} className="flex flex-wrap justify-between gap-2 py-2">
                <span>{describeActivity(a.action, a.detail, a.actorName)}</span>
                <time className="figures text-sm text-graphite-600" dateTime={a.at.toISOString()}>{a.at.toISOString().slice(0, 16).replace("T", " ")} UTC</time>
              </li>
            ))}
          </ol>
        )}
      </section>
    </>
  );
}
