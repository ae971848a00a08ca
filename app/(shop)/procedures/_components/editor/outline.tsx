import Link from "next/link";
import type { VersionContent } from "@/lib/procedures/schema";
import { KindBadge } from "../kind-badge";
import { SectionOps, StepOps } from "./ops";
import { SectionForm } from "./section-form";

// The draft's sections and steps in order, each step a link that opens it in the form beside.
export function Outline({ procedureId, number, content, selected, addingTo }: { procedureId: string; number: number; content: VersionContent; selected?: string; addingTo?: string }) {
  const base = `/procedures/${procedureId}/versions/${number}/edit`;
  return (
    <nav aria-label="Steps of this draft" className="space-y-4" data-testid="outline">
      {content.sections.map((section, si) => (
        <section key={section.key} className="card p-3" aria-labelledby={`out-${section.key}`} data-testid={`outline-section-${section.key}`}>
          <div className="flex flex-wrap items-start justify-between gap-2">
            <h3 id={`out-${section.key}`} className="font-bold">
              <span className="figures mr-1 text-graphite-500">{si + 1}</span>
              {section.title}
            </h3>
            <SectionOps procedureId={procedureId} number={number} sectionKey={section.key} title={section.title} stepCount={section.steps.length} />
          </div>
          <details className="mt-1 text-sm">
            <summary className="cursor-pointer py-1 text-graphite-700">Rename section</summary>
            <SectionForm procedureId={procedureId} number={number} sectionKey={section.key} title={section.title} compact />
          </details>
          <ol className="mt-2 space-y-1">
            {section.steps.map((step, ti) => {
              const current = step.key === selected;
              return (
                <li
                  key={step.key}
                  className={`rounded-md border-2 p-2 ${current ? "border-graphite-900 bg-primer-100" : "border-transparent hover:border-graphite-200"}`}
                  data-testid={`outline-step-${step.key}`}
                >
                  <Link href={`${base}?step=${encodeURIComponent(step.key)}`} className="flex min-h-11 items-start gap-2" aria-current={current ? "true" : undefined}>
                    <span className="figures mt-0.5 text-xs text-graphite-500">{si + 1}.{ti + 1}</span>
                    <span className="min-w-0 flex-1">
                      <span className="flex flex-wrap items-center gap-1">
                        <KindBadge kind={step.kind} />
                        {current ? <span className="text-xs font-bold">▸ editing</span> : null}
                      </span>
                      <span className="mt-0.5 block font-semibold leading-snug">{step.title}</span>
                    </span>
                  </Link>
                  {current ? <StepOps procedureId={procedureId} number={number} stepKey={step.key} title={step.title} /> : null}
                </li>
              );
            })}
          </ol>
          {section.steps.length === 0 ? <p className="mt-1 text-sm text-graphite-600">No steps yet.</p> : null}
          <Link
            href={`${base}?add=${encodeURIComponent(section.key)}`}
            className={`btn mt-2 w-full ${addingTo === section.key ? "btn-primary" : "btn-quiet"}`}
            data-testid={`add-step-${section.key}`}
          >
            + Add a step to “{section.title}”
          </Link>
        </section>
      ))}
      <SectionForm procedureId={procedureId} number={number} />
    </nav>
  );
}
