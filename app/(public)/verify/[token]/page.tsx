import type { Metadata } from "next";
import { headers } from "next/headers";
import Link from "next/link";
import { notFound } from "next/navigation";
import { JobStateBadge } from "@/components/job-state";
import { JobWelds } from "@/components/job-welds";
import { MaterialTable } from "@/components/material-table";
import { SafetyNote } from "@/components/safety-note";
import { getJobRecord } from "@/db/queries/jobs-core";
import { jobIdForToken, publicVerification } from "@/db/queries/records";
import { can } from "@/lib/authz";
import { getSessionUser, shopContextFor } from "@/lib/auth/context";
import { AppError } from "@/lib/errors";
import { clientAddress, limitOrThrow } from "@/lib/rate-limit";
import { isVerifyToken } from "@/lib/records/token";

export const metadata: Metadata = { title: "Check a traveller", robots: { index: false } };
export const dynamic = "force-dynamic";

export default async function VerifyPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
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
  return (
    <article className="space-y-4">
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
            ? `All ${v.integrity.entries} signed entries were recomputed and match the seal.`
            : `${v.integrityDetail.reason ?? "The chain does not verify."} Entries after it cannot be trusted either.`}
        </p>
      </section>
      <section className="card p-5">
        <dl className="grid gap-3 sm:grid-cols-2">
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
            <dt className="text-sm text-graphite-600">Seal ({v.integrity.entries} entries)</dt>
            <dd className="figures break-all text-sm" data-testid="seal">{v.integrity.seal ?? "no entries yet"}</dd>
          </div>
        </dl>
      </section>
      {member ? (
        <section className="card p-5" data-testid="member-record">
          <h2 className="font-bold">Your shop&apos;s record</h2>
          <p className="mt-1 text-graphite-700">You are signed in as a member of {v.shop}: the whole record is open to you, read-only.</p>
          <div className="mt-3 flex flex-wrap gap-2">
            <Link className="btn btn-primary" href={`/jobs/${found.jobId}`}>Open the full record</Link>
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
          Customer, vehicle and people are shown only to members of the shop.{" "}
          <Link className="font-semibold underline" href={`/sign-in?next=/verify/${token}`}>Sign in</Link> to see the whole record.
        </p>
      )}
      <SafetyNote />
    </article>
  );
}
