import { StatusBadge } from "@/components/status-badge";
import type { UnitSystem } from "@/lib/units";
import type { FieldChange, Move, StepRow, VersionDiff } from "@/lib/procedures/diff";
import type { Step } from "@/lib/procedures/schema";
import { KindBadge } from "./kind-badge";
import { stepFacts } from "./step-details";

export function DiffSummary({ diff }: { diff: VersionDiff }) {
  const s = diff.summary;
  const none = s.added + s.removed + s.changed + s.moved === 0 && diff.meta.length === 0;
  return (
    <ul className="mt-2 flex flex-wrap gap-2" data-testid="diff-summary" aria-label="Summary of differences">
      {none ? <li><StatusBadge tone="idle">No differences</StatusBadge></li> : null}
      {s.added ? <li><StatusBadge tone="pass">{s.added} added</StatusBadge></li> : null}
      {s.removed ? <li><StatusBadge tone="fail">{s.removed} removed</StatusBadge></li> : null}
      {s.changed ? <li><StatusBadge tone="warn">{s.changed} changed</StatusBadge></li> : null}
      {s.moved ? <li><StatusBadge tone="info">{s.moved} moved</StatusBadge></li> : null}
      {diff.meta.length ? <li><StatusBadge tone="warn">{diff.meta.map((m) => m.label.toLowerCase()).join(", ")} changed</StatusBadge></li> : null}
      <li><StatusBadge tone="idle">{s.unchanged} unchanged</StatusBadge></li>
    </ul>
  );
}

function moveText(m: Move | null) {
  if (!m) return null;
  return m.kind === "section" ? `Moved from “${m.fromSection}”` : "Moved";
}

function StepHead({ step }: { step: Step }) {
  return (
    <div className="flex flex-wrap items-center gap-2">
      <KindBadge kind={step.kind} />
      <span className="font-semibold">{step.title}</span>
      <code className="text-xs text-graphite-500">{step.key}</code>
    </div>
  );
}

function Changes({ changes, side }: { changes: FieldChange[]; side: "before" | "after" }) {
  return (
    <dl className="mt-2 space-y-1 text-sm">
      {changes.map((c) => (
        <div key={c.field} className="border-l-4 border-verdict-warn pl-2" data-testid={`change-${c.field}`}>
          <dt className="font-semibold text-graphite-700">{c.label}</dt>
          <dd className="whitespace-pre-wrap break-words">{side === "before" ? c.before : c.after}</dd>
        </div>
      ))}
    </dl>
  );
}

function Facts({ step, system }: { step: Step; system: UnitSystem }) {
  return (
    <dl className="mt-2 grid gap-x-3 text-sm sm:grid-cols-[9rem_1fr]">
      {stepFacts(step, system).map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="font-semibold text-graphite-700">{k}</dt>
          <dd>{v}</dd>
        </div>
      ))}
    </dl>
  );
}

const Absent = ({ n }: { n: number }) => <p className="text-sm italic text-graphite-600">Not in v{n}</p>;

function Row({ row, diff, system }: { row: StepRow; diff: VersionDiff; system: UnitSystem }) {
  if (row.type === "same") {
    return (
      <tr className="border-t border-graphite-100" data-testid={`diff-row-${row.key}`} data-change="same">
        <td colSpan={2} className="px-3 py-2 text-sm text-graphite-700">
          <span className="flex flex-wrap items-center gap-2">
            {row.moved ? <StatusBadge tone="info">{moveText(row.moved)}</StatusBadge> : <StatusBadge tone="idle">Unchanged</StatusBadge>}
            <span>{row.after.title}</span>
            <code className="text-xs text-graphite-500">{row.key}</code>
          </span>
        </td>
      </tr>
    );
  }
  const badge =
    row.type === "added" ? (
      <StatusBadge tone="pass">Added</StatusBadge>
    ) : row.type === "removed" ? (
      <StatusBadge tone="fail">Removed</StatusBadge>
    ) : (
      <span className="flex flex-wrap gap-1">
        <StatusBadge tone="warn">Changed: {row.changes.length} {row.changes.length === 1 ? "field" : "fields"}</StatusBadge>
        {row.moved ? <StatusBadge tone="info">{moveText(row.moved)}</StatusBadge> : null}
      </span>
    );
  return (
    <tr className="border-t border-graphite-200 align-top" data-testid={`diff-row-${row.key}`} data-change={row.type}>
      <td className={`w-1/2 px-3 py-3 ${row.type === "removed" ? "bg-verdict-failbg" : ""}`}>
        {row.type === "added" ? (
          <Absent n={diff.from} />
        ) : (
          <>
            <div className="mb-1">{badge}</div>
            <StepHead step={row.before} />
            {row.type === "changed" ? <Changes changes={row.changes} side="before" /> : <Facts step={row.before} system={system} />}
          </>
        )}
      </td>
      <td className={`w-1/2 border-l-2 border-graphite-200 px-3 py-3 ${row.type === "added" ? "bg-verdict-passbg" : ""}`}>
        {row.type === "removed" ? (
          <Absent n={diff.to} />
        ) : (
          <>
            <div className="mb-1">{badge}</div>
            <StepHead step={row.after} />
            {row.type === "changed" ? <Changes changes={row.changes} side="after" /> : <Facts step={row.after} system={system} />}
          </>
        )}
      </td>
    </tr>
  );
}

export function DiffView({ diff, system, fromLabel, toLabel }: { diff: VersionDiff; system: UnitSystem; fromLabel: string; toLabel: string }) {
  return (
    <div className="space-y-4" data-testid="diff-view">
      {diff.meta.length ? (
        <table className="card w-full table-fixed border-collapse text-left">
          <caption className="px-3 py-2 text-left font-bold">Procedure details</caption>
          <thead className="bg-graphite-100 text-sm">
            <tr><th scope="col" className="px-3 py-2">{fromLabel}</th><th scope="col" className="px-3 py-2">{toLabel}</th></tr>
          </thead>
          <tbody>
            {diff.meta.map((m) => (
              <tr key={m.field} className="border-t border-graphite-200 align-top" data-testid={`meta-change-${m.field}`}>
                <td className="px-3 py-2 text-sm"><div className="font-semibold">{m.label}</div><div className="whitespace-pre-wrap">{m.before}</div></td>
                <td className="border-l-2 border-graphite-200 px-3 py-2 text-sm"><div className="font-semibold">{m.label}</div><div className="whitespace-pre-wrap">{m.after}</div></td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {diff.sections.map((s) => (
        <table key={s.key} className="card w-full table-fixed border-collapse text-left" data-testid={`diff-section-${s.key}`}>
          <caption className="px-3 py-2 text-left">
            <span className="flex flex-wrap items-center gap-2">
              <span className="font-bold">{s.afterTitle ?? s.beforeTitle}</span>
              {s.status === "added" ? <StatusBadge tone="pass">Section added</StatusBadge> : null}
              {s.status === "removed" ? <StatusBadge tone="fail">Section removed</StatusBadge> : null}
              {s.status === "renamed" ? <StatusBadge tone="warn">Renamed from “{s.beforeTitle}”</StatusBadge> : null}
            </span>
          </caption>
          <thead className="bg-graphite-100 text-sm">
            <tr>
              <th scope="col" className="px-3 py-2">{fromLabel}</th>
              <th scope="col" className="border-l-2 border-graphite-200 px-3 py-2">{toLabel}</th>
            </tr>
          </thead>
          <tbody>
            {s.rows.length === 0 ? (
              <tr><td colSpan={2} className="px-3 py-2 text-sm text-graphite-600">No steps on either side.</td></tr>
            ) : (
              s.rows.map((row) => <Row key={row.key} row={row} diff={diff} system={system} />)
            )}
          </tbody>
        </table>
      ))}
    </div>
  );
}
