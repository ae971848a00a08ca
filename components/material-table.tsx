// A job's material entries (ISO 3834-2 traceability: what went into the axle, by heat or lot number), in the
// order they were recorded. Entries are never changed: a correction is a new entry naming the one it
// replaces, which stays in the list struck through with the correction's reason; a withdrawal is a
// correction that says the material is no longer used. Read-only; the job page adds its actions per row.
import type { ReactNode } from "react";
import { StatusBadge } from "@/components/status-badge";
import type { MaterialView } from "@/lib/jobs/record";
import { MATERIAL_KIND_LABELS } from "@/lib/traveller/labels";

const when = (iso: string) => `${iso.slice(0, 16).replace("T", " ")} UTC`;

/** `compact` folds kind, specification, certificate and who recorded it into the description, for narrow pages. */
export function MaterialTable({ materials, actions, compact = false }: { materials: MaterialView[]; actions?: (m: MaterialView, no: number) => ReactNode; compact?: boolean }) {
  if (!materials.length) return <p className="px-4 py-3 text-graphite-700" data-testid="materials-empty">No materials recorded on this job yet.</p>;
  const no = new Map(materials.map((m, i) => [m.id, i + 1]));
  const correctionOf = new Map(materials.filter((m) => m.correctsId).map((m) => [m.correctsId!, m]));
  if (compact) return <CompactTable materials={materials} no={no} correctionOf={correctionOf} />;
  return (
    <div className="relative overflow-x-auto">
      <table className="w-full min-w-[46rem] text-left" data-testid="materials-table">
        <caption className="sr-only">Material entries in the order they were recorded</caption>
        <thead className="bg-graphite-100 text-sm">
          <tr>
            <th className="px-3 py-1">No.</th>
            <th className="px-3 py-1">Kind</th>
            <th className="px-3 py-1">Description</th>
            <th className="px-3 py-1">Specification</th>
            <th className="px-3 py-1">Heat / lot no.</th>
            <th className="px-3 py-1">Certificate</th>
            <th className="px-3 py-1">Recorded</th>
            <th className="px-3 py-1">State</th>
            {actions ? <th className="px-3 py-1"><span className="sr-only">Actions</span></th> : null}
          </tr>
        </thead>
        <tbody>
          {materials.map((m) => {
            const n = no.get(m.id)!;
            const by = correctionOf.get(m.id);
            const struck = m.superseded ? "line-through decoration-2 text-graphite-600" : "";
            return (
              <tr key={m.id} className="border-t border-graphite-100 align-top" data-testid={`material-${n}`} data-superseded={m.superseded || undefined}>
                <td className="figures px-3 py-2 font-semibold">#{n}</td>
                <td className={`px-3 py-2 ${struck}`}>{MATERIAL_KIND_LABELS[m.kind]}</td>
                <td className="px-3 py-2">
                  <span className={struck}>{m.description}</span>
                  <CorrectionNotes m={m} by={by} no={no} />
                </td>
                <td className={`px-3 py-2 ${struck}`}>{m.specification || "—"}</td>
                <td className={`figures whitespace-nowrap px-3 py-2 font-semibold ${struck}`}>{m.heatNumber}</td>
                <td className={`figures px-3 py-2 ${struck}`}>{m.certificate || "—"}</td>
                <td className="px-3 py-2 text-sm">
                  {m.recordedBy.name}
                  <time className="figures block text-graphite-700" dateTime={m.recordedAt}>{when(m.recordedAt)}</time>
                </td>
                <td className="whitespace-nowrap px-3 py-2"><StateBadge m={m} /></td>
                {actions ? <td className="px-3 py-2">{actions(m, n)}</td> : null}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

/** Which entry this one corrects, and which entry replaced it: the same words in both layouts. */
function CorrectionNotes({ m, by, no }: { m: MaterialView; by: MaterialView | undefined; no: Map<string, number> }) {
  return (
    <>
      {m.correctsId ? (
        <span className="block text-sm text-graphite-800">
          {m.withdrawn ? "Withdraws" : "Corrects"} #{no.get(m.correctsId) ?? "?"}: {m.reason}
        </span>
      ) : null}
      {m.superseded && by ? (
        <span className="block text-sm text-graphite-800" data-testid="superseded-by">
          {by.withdrawn ? "Withdrawn" : "Corrected"} by #{no.get(by.id)}: {by.reason}
        </span>
      ) : null}
    </>
  );
}

function StateBadge({ m }: { m: MaterialView }) {
  return m.superseded ? <StatusBadge tone="idle">Superseded</StatusBadge> : m.withdrawn ? <StatusBadge tone="warn">Withdrawn</StatusBadge> : <StatusBadge tone="pass">In use</StatusBadge>;
}

function CompactTable({ materials, no, correctionOf }: { materials: MaterialView[]; no: Map<string, number>; correctionOf: Map<string, MaterialView> }) {
  return (
    <table className="w-full text-left" data-testid="materials-table">
      <caption className="sr-only">Material entries in the order they were recorded</caption>
      <thead className="bg-graphite-100 text-sm">
        <tr>
          <th className="px-3 py-1">No.</th>
          <th className="px-3 py-1">Material</th>
          <th className="px-3 py-1">Heat / lot no.</th>
          <th className="px-3 py-1">State</th>
        </tr>
      </thead>
      <tbody>
        {materials.map((m) => {
          const n = no.get(m.id)!;
          const by = correctionOf.get(m.id);
          const struck = m.superseded ? "line-through decoration-2 text-graphite-600" : "";
          return (
            <tr key={m.id} className="border-t border-graphite-100 align-top" data-testid={`material-${n}`} data-superseded={m.superseded || undefined}>
              <td className="figures px-3 py-2 font-semibold">#{n}</td>
              <td className="px-3 py-2">
                <span className={struck}>
                  <strong>{MATERIAL_KIND_LABELS[m.kind]}</strong>: {m.description}
                  {m.specification ? ` · ${m.specification}` : ""}
                  {m.certificate ? <> · certificate <span className="figures">{m.certificate}</span></> : null}
                </span>
                <CorrectionNotes m={m} by={by} no={no} />
                <span className="block text-sm text-graphite-700">
                  {m.recordedBy.name} · <time className="figures" dateTime={m.recordedAt}>{when(m.recordedAt)}</time>
                </span>
              </td>
              <td className={`figures whitespace-nowrap px-3 py-2 font-semibold ${struck}`}>{m.heatNumber}</td>
              <td className="whitespace-nowrap px-3 py-2"><StateBadge m={m} /></td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
