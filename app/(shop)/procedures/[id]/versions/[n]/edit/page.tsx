import type { Metadata } from "next";
import Link from "next/link";
import { z } from "zod";
import { PageHeader } from "@/components/page-header";
import { StatusBadge } from "@/components/status-badge";
import { getVersion } from "@/db/queries/procedures";
import { can } from "@/lib/authz";
import { requireShop } from "@/lib/auth/context";
import { publishReadiness } from "@/lib/procedures/checks";
import { blankStep, nextJointId } from "@/lib/procedures/edit";
import { STEP_KINDS } from "@/lib/procedures/schema";
import { discardDraftAction } from "../../../../actions";
import { ActionButton } from "../../../../_components/action-button";
import { MetaForm } from "../../../../_components/editor/meta-form";
import { Outline } from "../../../../_components/editor/outline";
import { StepForm } from "../../../../_components/editor/step-form";
import { fmtDate } from "../../../../_components/format";
import { idOrNotFound, numberOrNotFound, orNotFound } from "../../../../_components/not-found";
import { ProcedureNote } from "../../../../_components/procedure-note";

export const metadata: Metadata = { title: "Edit draft" };

const querySchema = z.object({
  step: z.string().max(64).optional().catch(undefined),
  add: z.string().max(64).optional().catch(undefined),
  kind: z.enum(STEP_KINDS).optional().catch(undefined),
});

export default async function EditDraftPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string; n: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const ctx = await requireShop("procedure:read");
  const raw = await params;
  const id = idOrNotFound(raw.id);
  const number = numberOrNotFound(raw.n);
  const v = await orNotFound(getVersion(ctx.shopId, id, number));
  const readHref = `/procedures/${id}/versions/${number}`;
  if (!can(ctx.roles, "procedure:write")) {
    return (
      <>
        <PageHeader title="Only a lead edits procedures" lead="You can read every version of this procedure." />
        <Link href={readHref} className="btn btn-primary">Read version {number}</Link>
      </>
    );
  }
  if (v.status !== "draft") {
    return (
      <>
        <PageHeader title={`Version ${number} is ${v.status}`} lead="Published and retired versions never change. Start a new version: it begins as a draft copy of the latest." />
        <div className="flex gap-2">
          <Link href={readHref} className="btn btn-quiet">Read it</Link>
          <Link href={`/procedures/${id}`} className="btn btn-primary">Version history</Link>
        </div>
      </>
    );
  }
  const q = querySchema.parse(await searchParams);
  const sections = v.content.sections;
  const allSteps = sections.flatMap((s) => s.steps.map((step) => ({ step, section: s })));
  const adding = q.add ? sections.find((s) => s.key === q.add) : undefined;
  const selected = adding ? undefined : (allSteps.find((x) => x.step.key === q.step) ?? allSteps[0]);
  const readiness = publishReadiness(v);
  const base = `/procedures/${id}/versions/${number}/edit`;
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 flex gap-2 text-sm">
        <Link href="/procedures" className="underline">Procedures</Link>
        <span aria-hidden="true">›</span>
        <Link href={`/procedures/${id}`} className="underline">{v.title}</Link>
      </nav>
      <PageHeader title={`Draft v${number}: ${v.title}`} lead="Every change is saved to the draft at once. Nothing reaches a job until you publish.">
        <Link href={readHref} className="btn btn-quiet">Preview</Link>
        <Link href={`${readHref}/publish`} className="btn btn-primary" data-testid="go-publish">Publish…</Link>
      </PageHeader>
      <div className="mb-4 flex flex-wrap items-center gap-3 text-sm">
        <StatusBadge tone="info">Draft</StatusBadge>
        <span data-testid="draft-saved">Saved <time className="figures" dateTime={v.updatedAt.toISOString()}>{fmtDate(v.updatedAt)}</time></span>
        <span className="figures">{allSteps.length} steps in {sections.length} sections</span>
        {readiness.blockers.length ? (
          <StatusBadge tone="warn">{readiness.blockers.length} to fix before publishing</StatusBadge>
        ) : (
          <StatusBadge tone="pass">Ready to publish</StatusBadge>
        )}
      </div>
      <div className="grid gap-4 lg:grid-cols-[minmax(18rem,24rem)_1fr]">
        <Outline procedureId={id} number={number} content={v.content} selected={selected?.step.key} addingTo={adding?.key} />
        {/* The form stays in view while the outline beside it scrolls. */}
        <div className="space-y-4 lg:sticky lg:top-4 lg:max-h-[calc(100vh-2rem)] lg:self-start lg:overflow-y-auto lg:pr-1">
          {adding ? (
            <StepForm
              key={`new:${adding.key}:${q.kind ?? "check"}:${v.updatedAt.toISOString()}`}
              procedureId={id}
              number={number}
              sectionKey={adding.key}
              sectionTitle={adding.title}
              initial={blankStep(q.kind ?? "check", v.content)}
              suggestedJointId={nextJointId(v.content)}
              cancelHref={base}
            />
          ) : selected ? (
            <StepForm
              key={`${selected.step.key}:${v.updatedAt.toISOString()}`}
              procedureId={id}
              number={number}
              sectionKey={selected.section.key}
              sectionTitle={selected.section.title}
              originalKey={selected.step.key}
              initial={selected.step}
              suggestedJointId={nextJointId(v.content)}
              cancelHref={`${base}?step=${encodeURIComponent(selected.step.key)}`}
            />
          ) : (
            <p className="card p-4 text-graphite-700">No steps yet: add one to a section on the left.</p>
          )}
          <details className="card p-4" open={allSteps.length === 0}>
            <summary className="cursor-pointer font-bold">Title, scope and code</summary>
            <div className="mt-3">
              <MetaForm procedureId={id} number={number} title={v.title} scope={v.scope} code={v.code} />
            </div>
          </details>
          <section className="card p-4" aria-labelledby="discard-h">
            <h2 id="discard-h" className="mb-2 font-bold">Discard this draft</h2>
            <ActionButton
              action={discardDraftAction}
              fields={{ procedureId: id, number }}
              label="Discard draft"
              tone="danger"
              confirm={number === 1 ? "This procedure has never been published: discarding deletes it." : "The draft's changes are lost; published versions stay."}
              testId="discard"
            />
          </section>
          <ProcedureNote />
        </div>
      </div>
    </>
  );
}
