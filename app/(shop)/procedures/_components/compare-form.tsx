import type { VersionSummary } from "@/db/queries/procedures";
import { VERSION_STATUS_LABELS } from "@/lib/procedures/labels";

// A plain GET form: the comparison is a page of its own, linkable and printable.
export function CompareForm({ procedureId, versions, from, to }: { procedureId: string; versions: VersionSummary[]; from: number; to: number }) {
  return (
    <form action={`/procedures/${procedureId}/diff`} method="get" className="card space-y-3 p-4" data-testid="compare-form">
      <h2 className="font-bold">Compare two versions</h2>
      <div className="grid gap-2 sm:grid-cols-2 xl:grid-cols-1">
        {(
          [
            ["from", "Older", from],
            ["to", "Newer", to],
          ] as const
        ).map(([name, label, value]) => (
          <div key={name}>
            <label className="field-label" htmlFor={`cmp-${name}`}>{label}</label>
            <select id={`cmp-${name}`} name={name} defaultValue={value} className="field-input">
              {versions.map((v) => (
                <option key={v.number} value={v.number}>v{v.number} · {VERSION_STATUS_LABELS[v.status]}</option>
              ))}
            </select>
          </div>
        ))}
      </div>
      <button type="submit" className="btn btn-quiet w-full">Show differences</button>
    </form>
  );
}
