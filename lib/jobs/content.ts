// What a sign-off signs: the step's canonical content. Its SHA-256 over RFC 8785 JSON (lib/seal) is stored
// with the sign-off; anyone holding the record can rebuild this object and check the hash.
import type { StepKind } from "@/lib/procedures/schema";

export const STEP_CONTENT_SCHEMA = "gusset.step-content/1";

export type SignedPhoto = { id: string; sha256: string };
export type SignedPass = {
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
  /** weld joints: the round, the WPS revision, how the pass stood against it and a lead's override */
  round?: number;
  position?: string;
  wps?: { reference: string; revision: number | null };
  outOfRange?: boolean;
  override?: { leadId: string; reason: string } | null;
};

export type StepContentInput = {
  jobId: string;
  jobNumber: string;
  stepId: string;
  stepKey: string;
  kind: StepKind;
  /** contentHash of the step as pinned from the procedure version */
  specHash: string;
  meaning: string;
  value: Record<string, unknown> | null;
  photos: readonly SignedPhoto[];
  passes: readonly SignedPass[];
  /** nonconformances whose "use as is" this sign-off relies on */
  acceptedUnder: readonly number[];
  /** for an amendment: the sign-off it corrects and why */
  amends?: { signOffId: string; reason: string } | undefined;
  /** weld joints: the round signed (1, then one per repair) and the rejection a repair answers */
  round?: { number: number; repairOf: string | null } | undefined;
};

/** Plain JSON, ordered where order means nothing (photos by hash, passes by number), so equal work hashes equal. */
export function stepContent(i: StepContentInput): Record<string, unknown> {
  const content: Record<string, unknown> = {
    schema: STEP_CONTENT_SCHEMA,
    job: { id: i.jobId, number: i.jobNumber },
    step: { id: i.stepId, key: i.stepKey, kind: i.kind, specHash: i.specHash },
    meaning: i.meaning,
    value: stripUndefined(i.value ?? {}),
    photos: [...i.photos].map((p) => ({ id: p.id, sha256: p.sha256 })).sort((a, b) => (a.sha256 < b.sha256 ? -1 : a.sha256 > b.sha256 ? 1 : 0)),
    passes: [...i.passes].sort((a, b) => a.passNumber - b.passNumber).map((p) => ({ ...p })),
    acceptedUnder: [...i.acceptedUnder].sort((a, b) => a - b),
  };
  if (i.amends) content.amends = { signOffId: i.amends.signOffId, reason: i.amends.reason };
  if (i.round) content.round = { number: i.round.number, repairOf: i.round.repairOf };
  return stripUndefined(content);
}

// JSON drops undefined members anyway; doing it here keeps the stored content and the hashed text identical.
function stripUndefined(value: unknown): Record<string, unknown> {
  return JSON.parse(JSON.stringify(value)) as Record<string, unknown>;
}

/** Content of a disposition's or a release's sign-off. */
export function recordContent(kind: "disposition" | "release" | "inspection", body: Record<string, unknown>): Record<string, unknown> {
  return { schema: `gusset.${kind}-content/1`, ...stripUndefined(body) };
}

/** Content of the release sign-off: each step's latest signed hash, as the lead saw them when releasing. */
export function releaseContent(r: {
  job: { id: string; number: string };
  procedure: { versionId: string; number: number };
  steps: { key: string; signOff: string | null }[];
  nonconformances: { number: number; disposition: string | null }[];
  /** the materials in use (lib/jobs/materials materialsInUse) */
  materials: { id: string; kind: string; description: string; specification: string; heatNumber: string; certificate: string }[];
  /** where each weld joint is (lib/weld-map sealedWeldMap); left out when the job has no map, so older releases hash as they did */
  weldMap?: Record<string, unknown> | null;
}): Record<string, unknown> {
  const { weldMap, ...rest } = r;
  return recordContent("release", weldMap ? { ...rest, weldMap } : rest);
}

/** Content of an inspection's sign-off: the round inspected, what was observed, what the criteria said, the decision. */
export function inspectionContent(i: {
  job: { id: string; number: string };
  step: { id: string; key: string; jointId: string; specHash: string };
  round: number;
  /** the welder's sign-off of the round inspected */
  performed: string | null;
  passes: { passNumber: number; welderId: string; heatInputKJPerMm: number }[];
  criteria: string;
  observations: Record<string, unknown>;
  items: { item: string; ok: boolean; limit: string; measured: string }[];
  judged: "accept" | "reject";
  decision: "accepted" | "rejected";
  notes: string;
  photos: readonly SignedPhoto[];
}): Record<string, unknown> {
  return recordContent("inspection", {
    ...i,
    passes: [...i.passes].sort((a, b) => a.passNumber - b.passNumber),
    items: i.items.map((x) => ({ item: x.item, ok: x.ok, limit: x.limit, measured: x.measured })),
    photos: [...i.photos].map((p) => ({ id: p.id, sha256: p.sha256 })).sort((a, b) => (a.sha256 < b.sha256 ? -1 : a.sha256 > b.sha256 ? 1 : 0)),
  });
}
