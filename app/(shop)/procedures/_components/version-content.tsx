import type { UnitSystem } from "@/lib/units";
import { Markdown } from "@/lib/procedures/markdown-view";
import type { VersionContent } from "@/lib/procedures/schema";
import { KindBadge } from "./kind-badge";
import { StepFacts } from "./step-details";

export function VersionContentView({ content, system }: { content: VersionContent; system: UnitSystem }) {
  if (content.sections.length === 0) return <p className="text-graphite-600">No sections yet.</p>;
  return (
    <ol className="space-y-6" data-testid="version-content">
      {content.sections.map((section, si) => (
        <li key={section.key} aria-labelledby={`sec-${section.key}`}>
          <h2 id={`sec-${section.key}`} className="mb-2 flex items-baseline gap-2 text-lg font-bold">
            <span className="figures text-graphite-500">{si + 1}</span>
            {section.title}
          </h2>
          {section.steps.length === 0 ? (
            <p className="text-graphite-600">No steps in this section.</p>
          ) : (
            <ol className="space-y-3">
              {section.steps.map((step, ti) => (
                <li
                  key={step.key}
                  className={`card p-4 ${step.kind === "caution" || step.kind === "hold" ? "border-2 border-graphite-900" : ""}`}
                  data-testid={`step-${step.key}`}
                >
                  <div className="flex flex-wrap items-center gap-2">
                    <span className="figures text-sm text-graphite-500">{si + 1}.{ti + 1}</span>
                    <KindBadge kind={step.kind} />
                    <h3 className="font-semibold">{step.title}</h3>
                    <code className="ml-auto text-xs text-graphite-500">{step.key}</code>
                  </div>
                  {step.instructions ? <Markdown source={step.instructions} className="mt-2 text-graphite-900" /> : null}
                  <div className="mt-3">
                    <StepFacts step={step} system={system} />
                  </div>
                </li>
              ))}
            </ol>
          )}
        </li>
      ))}
    </ol>
  );
}
