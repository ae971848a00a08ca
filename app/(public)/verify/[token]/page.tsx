import type { Metadata } from "next";
import { headers } from "next/headers";
import Link from "next/link";
import { notFound } from "next/navigation";
import { JobStateBadge } from "@/components/job-state";
import { JobWelds } from "@/components/job-welds";
import { MaterialTable } from "@/components/material-table";
import { SafetyNote } from "@/components/safety-note";
import { getJobRecord } from "@/db/queries/jobs-core";
import { jobIdForToken, paperCheck, publicVerification } from "@/db/queries/records";
import { can } from "@/lib/authz";
import { getSessionUser, shopContextFor } from "@/lib/auth/context";
import { AppError } from "@/lib/errors";
import { clientAddress, limitOrThrow } from "@/lib/rate-limit";
import type { PaperCheck } from "@/lib/records/paper-seal";
import { verifyQuerySchema } from "@/lib/records/schemas";
import { isVerifyToken } from "@/lib/records/token";

export const metadata: Metadata = { title: "Check a traveller", robots: { index: false } };
export const dynamic = "force-dynamic";

const PAPER_LOOK = {
  agrees: { mark: "●", title: "Paper and record agree", box: "border-verdict-pass bg-verdict-passbg text-verdict-pass" },
  earlier: { mark: "▲", title: "Paper printed earlier", box: "border-verdict-warn bg-verdict-warnbg text-verdict-warn" },
  disagrees: { mark: "✕", title: "Paper and record disagree", box: "border-verdict-fail bg-verdict-failbg text-verdict-fail" },
} as const;

function PaperVerdict({ check }: { check: PaperCheck }) {
  const look = PAPER_LOOK[check.verdict];
  return (
    <section data-testid="paper-verdict" data-verdict={check.verdict} className={`rounded-lg border-4 border-dashed p-5 ${look.box}`}>
      <p className="flex items-center gap-3 text-2xl font-bold">
        <span aria-hidden="true" className="text-3xl">{look.mark}</span>
        {look.title}
      </p>
      <p className="mt-2 text-graphite-900">{check.message}</p>
      <p className="mt-2 text-sm text-graphite-800">
        Seal on the paper: <span className="figures break-all" data-testid="paper-seal">{check.seal}</span>
      </p>
    </section>
  );
}

export default async function VerifyPage({ params, searchParams }: { params: Promise<{ token: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { token } = await params;
  const rawSeal = (await searchParams).seal;
  const sealQuery = verifyQuerySchema.safeParse({ seal: typeof rawSeal === "string" && rawSeal ? rawSeal : undefined });
  try {
    await limitOrThrow("verify", clientAddress(await headers()), { max: 60, windowSeconds: 60 });
  } catch (error) {
    if (error instanceof AppError) {
      return <p className="card p-4" data-testid="verify-limited">{error.message}</p>;
    }
    throw error;
  }
  const found = isVerifyToken(token) ? await jobIdForToken(token) : null;
  if (!found) notFound();
  const v = await publicVerification(found.jobId);
  const user = await getSessionUser();
  const ctx = user ? await shopContextFor(user, v.shopId) : null;
  const member = !!ctx && ctx.shopId === v.shopId && can(ctx.roles, "job:read");
  // A member reads the record itself: weld joints with their inspections, and the materials by heat number.
  const record = member && ctx ? await getJobRecord(ctx, found.jobId) : null;
  const intact = v.integrity.intact;
  const paper = sealQuery.success && sealQuery.data.seal ? paperCheck(v.integrityDetail, sealQuery.data.seal) : null;
  return (
    <article className="space-y-4">
      {/* The paper is the copy outside the database, so its comparison comes first. */}
      {paper ? <PaperVerdict check={paper} /> : null}
      <section
        data-testid="verdict"
        className={`rounded-lg border-4 p-5 ${intact ? "border-verdict-pass bg-verdict-passbg text-verdict-pass" : "border-verdict-fail bg-verdict-failbg text-verdict-fail"}`}
      >
        <p className="flex items-center gap-3 text-2xl font-bold">
          <span aria-hidden="true" className="text-3xl">{intact ? "●" : "✕"}</span>
          {intact ? "Record intact" : `Record altered at entry ${v.integrityDetail.firstBrokenSeq ?? "?"}`}
        </p>
        <p className="mt-2 text-graphite-900">
          {intact
            ? `All ${v.integrity.entries} signed entries were recomputed and match the record's own seal${paper && !paper.agrees ? ", which is not the seal on the paper" : ""}.`
            : `${v.integrityDetail.reason ?? "The chain does not verify."} Entries after it cannot be trusted either.`}
        </p>
      </section>
      {!sealQuery.success ? (
        <p className="card p-4" data-testid="paper-unreadable">
          <span aria-hidden="true">▲ </span>The seal in this link cannot be read: {sealQuery.error.issues[0]?.message} The record itself was still checked above.
        </p>
      ) : null}
      {!paper && sealQuery.success ? (
        <p className="card p-4 text-graphite-700" data-testid="paper-none">
          No seal from the paper was given, so only the record itself was checked. Scan the traveller&apos;s QR code, or{" "}
          <Link className="font-semibold underline" href="/scan" prefetch={false}>type the seal printed on it</Link>, to compare the paper with the record.
        </p>
      ) : null}
      <section className="card p-5">
        <p className="mb-3 text-graphite-700">Check the axle tag and the VIN&apos;s last 6 against the housing and vehicle in front of you: a traveller belongs to one housing.</p>
        <dl className="grid gap-3 sm:grid-cols-2">
          <div>
            <dt className="text-sm text-graphite-600">Axle tag</dt>
            <dd className="figures text-xl font-semibold" data-testid="axle-tag">{v.axleTag || "none recorded"}</dd>
          </div>
          <div>
            <dt className="text-sm text-graphite-600">VIN, last 6</dt>
            <dd className="figures text-xl font-semibold" data-testid="vin-last6">{v.vinLast6 || "none recorded"}</dd>
          </div>
          <div>
            <dt className="text-sm text-graphite-600">Job</dt>
            <dd className="figures text-xl font-semibold" data-testid="job-number">{v.jobNumber}</dd>
          </div>
          <div>
            <dt className="text-sm text-graphite-600">Shop</dt>
            <dd className="text-lg font-semibold">{v.shop}</dd>
          </div>
          <div>
            <dt className="text-sm text-graphite-600">State</dt>
            <dd><JobStateBadge status={v.status} /></dd>
          </div>
          <div>
            <dt className="text-sm text-graphite-600">Released</dt>
            <dd className="figures">{v.releasedAt ? `${v.releasedAt.slice(0, 16).replace("T", " ")} UTC` : "Not released: work in progress"}</dd>
          </div>
          <div className="sm:col-span-2">
            <dt className="text-sm text-graphite-600">Seal of the record ({v.integrity.entries} entries)</dt>
            <dd className="figures break-all text-sm" data-testid="seal">{v.integrity.seal ?? "no entries yet"}</dd>
          </div>
        </dl>
      </section>
      {member ? (
        <section className="card p-5" data-testid="member-record">
          <h2 className="font-bold">Your shop&apos;s record</h2>
          <p className="mt-1 text-graphite-700">You are signed in as a member of {v.shop}: the whole record is open to you, read-only.</p>
          <div className="mt-3 flex flex-wrap gap-2">
            <Link className="btn btn-primary" href={`/jobs/${found.jobId}`} prefetch={false}>Open the full record</Link>
            <a className="btn btn-quiet" href={`/api/jobs/${found.jobId}/traveller`}>Traveller PDF</a>
            <a className="btn btn-quiet" href={`/api/jobs/${found.jobId}/export.csv`}>Record as CSV</a>
          </div>
          {record ? (
            <div className="mt-5 space-y-5">
              <section aria-labelledby="verify-welds-h" data-testid="member-welds">
                <h3 id="verify-welds-h" className="mb-2 text-lg font-bold">Weld joints and their inspections</h3>
                <JobWelds record={record} system={ctx?.unitSystem ?? "metric"} compact />
              </section>
              <section aria-labelledby="verify-materials-h" className="card" data-testid="member-materials">
                <h3 id="verify-materials-h" className="px-4 pt-3 text-lg font-bold">Materials</h3>
                <p className="px-4 text-sm text-graphite-700">By heat or lot number, in the order recorded; corrected entries stay struck through beside their correction.</p>
                <div className="mt-2">
                  <MaterialTable materials={record.materials} compact />
                </div>
              </section>
            </div>
          ) : null}
        </section>
      ) : (
        <p className="card p-4 text-graphite-700">
          Customer and people are shown only to members of the shop.{" "}
          <Link className="font-semibold underline" href={`/sign-in?next=/verify/${token}`} prefetch={false}>Sign in</Link> to see the whole record.
        </p>
      )}
      <SafetyNote />
    </article>
  );
}
