// The rows a screen reads (a step's value, its passes, photos, inspections) against what was sealed in the
// sign-offs. A database rewrite that leaves the sign-offs and the chain alone but edits these rows would
// otherwise show false values beside "intact"; this names the first such difference. Pure.
import { canonicalJson } from "@/lib/seal/canonical-json";
import { recordContent, STEP_CONTENT_SCHEMA } from "@/lib/jobs/content";
import { sealedWeldMap, type JobWeldMap } from "@/lib/weld-map";

type SealedSignOff = { id: string; stepId: string | null; content: Record<string, unknown> };

export type LiveRows = {
  steps: { id: string; title: string; value: Record<string, unknown> | null }[];
  passes: {
    stepId: string;
    passNumber: number;
    welderId: string;
    process: string;
    volts: number;
    amps: number;
    travelSpeedMmPerMin: number;
    preheatC: number;
    interpassC: number | null;
    fillerLot: string;
    heatInputKJPerMm: number;
  }[];
  photos: { id: string; sha256: string }[];
  inspections: { signOffId: string; criteria: string; observations: unknown; judged: string; decision: string; notes: string }[];
  /** the job's weld map as stored (job.weld_map); the release seals it */
  weldMap?: JobWeldMap | null;
};

const RELEASE_CONTENT_SCHEMA = recordContent("release", {}).schema;

export type RowDifference = { signOffId: string; reason: string };

const PASS_FIELDS = ["welderId", "process", "volts", "amps", "travelSpeedMmPerMin", "preheatC", "interpassC", "fillerLot", "heatInputKJPerMm"] as const;

function same(a: unknown, b: unknown): boolean {
  try {
    return canonicalJson(a ?? null) === canonicalJson(b ?? null);
  } catch {
    return false;
  }
}

// JSON drops undefined members; so did the signing code before hashing.
function plain(value: unknown): unknown {
  return JSON.parse(JSON.stringify(value ?? {})) as unknown;
}

function asArray(value: unknown): Record<string, unknown>[] {
  return Array.isArray(value) ? value.filter((x): x is Record<string, unknown> => typeof x === "object" && x !== null) : [];
}

/** The first stored row that no longer says what its sign-off sealed, or null when every row agrees. */
export function firstRowDifference(signOffs: readonly SealedSignOff[], rows: LiveRows): RowDifference | null {
  const steps = new Map(rows.steps.map((s) => [s.id, s]));
  const photos = new Map(rows.photos.map((p) => [p.id, p.sha256]));
  const inspections = new Map(rows.inspections.map((i) => [i.signOffId, i]));
  for (const so of signOffs) {
    const c = so.content;
    const step = so.stepId ? steps.get(so.stepId) : undefined;
    const where = step ? `"${step.title}"` : "a signed entry";
    if (c.schema === STEP_CONTENT_SCHEMA && step) {
      // An amendment signs a corrected value of its own; the step's stored value stays the one first signed.
      if (c.amends === undefined && !same(plain(step.value), c.value)) {
        return { signOffId: so.id, reason: `the stored value of ${where} differs from the value that was signed` };
      }
      for (const p of asArray(c.passes)) {
        const row = rows.passes.find((r) => r.stepId === so.stepId && r.passNumber === p.passNumber);
        if (!row) return { signOffId: so.id, reason: `pass ${String(p.passNumber)} of ${where} is missing from the stored passes` };
        const changed = PASS_FIELDS.find((f) => !same(row[f], p[f]));
        if (changed) return { signOffId: so.id, reason: `pass ${String(p.passNumber)} of ${where} is stored with a ${changed} different from the one signed` };
      }
    }
    for (const p of asArray(c.photos)) {
      const stored = photos.get(String(p.id));
      if (stored !== p.sha256) return { signOffId: so.id, reason: `a photo signed with ${where} is ${stored === undefined ? "missing" : "stored with different bytes"}` };
    }
    // A release seals where each joint is; a marker moved or an image swapped afterwards shows here.
    if (c.schema === RELEASE_CONTENT_SCHEMA && rows.weldMap !== undefined && !same(sealedWeldMap(rows.weldMap), c.weldMap ?? null)) {
      return { signOffId: so.id, reason: "the stored weld map differs from the one sealed at release" };
    }
    const inspection = inspections.get(so.id);
    if (inspection) {
      const fields = ["criteria", "observations", "judged", "decision", "notes"] as const;
      const changed = fields.find((f) => !same(plain({ v: inspection[f] }), plain({ v: c[f] })));
      if (changed) return { signOffId: so.id, reason: `the stored inspection of ${where} has a ${changed} different from the one signed` };
    }
  }
  return null;
}
