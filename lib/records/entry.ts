// The record-chain entry of one sign-off: who signed what, when, meaning what, over which content hash.
// Rebuilt from the sign-off row at every verification, so a changed row no longer matches its hash.
const RECORD_ENTRY_SCHEMA = "gusset.record-entry/1";

export type SignOffForChain = {
  id: string;
  jobId: string;
  stepId: string | null;
  nonconformanceId: string | null;
  userId: string;
  printedName: string;
  role: string;
  meaning: string;
  signedAt: Date;
  contentHash: string;
  amendsSignOffId: string | null;
  reason: string | null;
  /** weld joints' sign-offs carry their round; other entries leave it out, so their form never changed */
  round?: number | null;
};

export function recordEntryFor(s: SignOffForChain): Record<string, unknown> {
  return {
    schema: RECORD_ENTRY_SCHEMA,
    signOff: s.id,
    job: s.jobId,
    step: s.stepId,
    nonconformance: s.nonconformanceId,
    signer: { id: s.userId, printedName: s.printedName, role: s.role },
    meaning: s.meaning,
    signedAt: s.signedAt.toISOString(),
    contentHash: s.contentHash,
    amends: s.amendsSignOffId,
    reason: s.reason,
    ...(s.round != null ? { round: s.round } : {}),
  };
}
