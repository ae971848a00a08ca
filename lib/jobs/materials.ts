// The materials a job's record stands on: the latest entry of each correction chain, leaving out those
// withdrawn. Used by the release sign-off (app and seed) so both seal the same list.
type MaterialRow = { id: string; kind: string; description: string; specification: string; heatNumber: string; certificate: string; correctsId: string | null; withdrawn: boolean };

export function materialsInUse(rows: readonly MaterialRow[]) {
  const replaced = new Set(rows.map((r) => r.correctsId).filter(Boolean));
  return rows
    .filter((r) => !replaced.has(r.id) && !r.withdrawn)
    .map((r) => ({ id: r.id, kind: r.kind, description: r.description, specification: r.specification, heatNumber: r.heatNumber, certificate: r.certificate }));
}
