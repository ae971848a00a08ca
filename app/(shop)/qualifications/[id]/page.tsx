import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { z } from "zod";
import { FormMessage } from "@/components/form-message";
import { PageHeader } from "@/components/page-header";
import { can } from "@/lib/authz";
import { requireShop } from "@/lib/auth/context";
import { AppError } from "@/lib/errors";
import { getQualification } from "@/db/queries/qualifications";
import { listPublishedWps } from "@/db/queries/wps";
import { CODE_LABELS } from "@/lib/welding/qualification-schema";
import { ContinuityBadge } from "../../wps/_components/badges";
import { day } from "../../wps/_components/format";
import { CertificateUpload } from "../_components/certificate-upload";
import { QualificationForm } from "../_components/qualification-form";
import { diameterText, thicknessText } from "../_components/views";

export const metadata: Metadata = { title: "Qualification" };

function Row({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="grid gap-1 border-t border-graphite-100 py-2 sm:grid-cols-[12rem_1fr]">
      <dt className="font-semibold text-graphite-700">{label}</dt>
      <dd>{children}</dd>
    </div>
  );
}

export default async function QualificationPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<Record<string, string | undefined>> }) {
  const ctx = await requireShop("job:read");
  const { id } = await params;
  if (!z.string().uuid().safeParse(id).success) notFound();
  let q;
  try {
    q = await getQualification(ctx.shopId, id);
  } catch (error) {
    if (error instanceof AppError && error.code === "not_found") notFound();
    throw error;
  }
  const added = (await searchParams).added === "1";
  const lead = can(ctx.roles, "qualification:write");
  const wpsOptions = lead ? await listPublishedWps(ctx.shopId, q.process) : [];
  const c = q.continuity;
  return (
    <>
      <PageHeader title={`${q.welderName} · ${q.process}`} lead={`Continuity by ${CODE_LABELS[c.code]}.`}>
        <Link href="/qualifications" className="btn btn-quiet">← Qualifications</Link>
      </PageHeader>
      {added ? <div className="mb-4"><FormMessage ok="Qualification added." testId="added" /></div> : null}
      <div className="grid gap-4 xl:grid-cols-[1fr_26rem]">
        <div className="space-y-4">
          <section className="card p-4" aria-labelledby="cont-h" data-testid="continuity">
            <h2 id="cont-h" className="font-bold">Continuity today</h2>
            <div className="mt-2"><ContinuityBadge status={c.status} daysLeft={c.daysLeft} expiresOn={c.expiresOn} testId="continuity-badge" /></div>
            <dl className="mt-2">
              <Row label="Last used">
                <span className="figures">{q.lastUsedOn}</span>
                <span className="block text-sm text-graphite-600">
                  {q.lastJobUseOn && q.lastJobUseOn >= q.testDate ? "On a job." : "The test itself: no later use on a job is recorded."}
                </span>
              </Row>
              <Row label={c.status === "lapsed" ? "Lapsed on" : "Lapses on"}><span className="figures">{c.expiresOn}</span></Row>
              <Row label="Last day it holds"><span className="figures">{c.lastValidOn}</span></Row>
              <Row label="Days left"><span className="figures">{c.daysLeft > 0 ? c.daysLeft : "none"}</span></Row>
              <Row label="Rule"><span className="text-sm">{c.source}</span></Row>
            </dl>
          </section>
          <section className="card p-4" aria-labelledby="rec-h">
            <h2 id="rec-h" className="font-bold">What the qualification covers</h2>
            <dl className="mt-2">
              <Row label="Positions"><span className="figures">{q.positions.join(" ")}</span></Row>
              <Row label="Thickness"><span className="figures">{thicknessText(q, ctx.unitSystem)}</span></Row>
              <Row label="Diameter"><span className="figures">{diameterText(q, ctx.unitSystem)}</span></Row>
              <Row label="Filler F-No."><span className="figures">{q.fillerFNumber}</span></Row>
              <Row label="Test date"><span className="figures">{q.testDate}</span></Row>
              <Row label="WPS followed">{q.wpsId && q.wpsReference ? <Link className="underline" href={`/wps/${q.wpsId}`}>{q.wpsReference}</Link> : "—"}</Row>
              {q.notes ? <Row label="Notes">{q.notes}</Row> : null}
            </dl>
          </section>
          {lead ? (
            <QualificationForm
              defaults={{ ...q, diameterMinMm: q.diameterMinMm, notes: q.notes }}
              welders={[]}
              wpsOptions={wpsOptions}
              fixedWelderName={q.welderName}
            />
          ) : null}
        </div>
        <section className="card h-fit space-y-3 p-4" aria-labelledby="cert-h">
          <h2 id="cert-h" className="font-bold">Certificate</h2>
          {q.certificate ? (
            <p data-testid="certificate-present">
              <a className="btn btn-quiet" href={`/api/qualifications/${q.id}/certificate`} download>Download the certificate</a>
              <span className="mt-1 block text-sm text-graphite-600">
                {q.certificate.name ?? "certificate"} · {q.certificate.contentType === "application/pdf" ? "PDF" : "photo"} ·{" "}
                <span className="figures">{Math.max(1, Math.round(q.certificate.size / 1024))} KB</span> · uploaded <span className="figures">{day(q.certificate.uploadedAt)}</span>
              </span>
            </p>
          ) : (
            <p className="text-graphite-600" data-testid="certificate-missing">No certificate uploaded yet.</p>
          )}
          {lead ? <CertificateUpload qualificationId={q.id} hasCertificate={q.certificate !== null} /> : null}
        </section>
      </div>
    </>
  );
}
