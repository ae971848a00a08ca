import "server-only";
import { randomBytes } from "node:crypto";
import { and, asc, desc, eq, isNull, sql } from "drizzle-orm";
import { job, jobStep, jobToken, photo, recordEntry, signOff, weldInspection, weldPass } from "@/db/schema";
import { db } from "@/lib/db";
import { recordEntryFor, type SignOffForChain } from "@/lib/records/entry";
import { comparePaperSeal, type PaperCheck } from "@/lib/records/paper-seal";
import { firstRowDifference, type LiveRows } from "@/lib/records/rows-check";
import { chainHash, contentHash, GENESIS_HASH, verifyChain } from "@/lib/seal";

type Tx = Parameters<Parameters<ReturnType<typeof db>["transaction"]>[0]>[0];
type Runner = Tx | ReturnType<typeof db>;

const signOffColumns = {
  id: signOff.id,
  jobId: signOff.jobId,
  shopId: signOff.shopId,
  stepId: signOff.stepId,
  nonconformanceId: signOff.nonconformanceId,
  userId: signOff.userId,
  printedName: signOff.printedName,
  role: signOff.role,
  meaning: signOff.meaning,
  signedAt: signOff.signedAt,
  contentHash: signOff.contentHash,
  amendsSignOffId: signOff.amendsSignOffId,
  reason: signOff.reason,
  round: signOff.round,
  content: signOff.content,
};

// Appends a sign-off to its job's chain, inside the transaction that wrote the sign-off.
// An advisory lock per job keeps two tablets from taking the same sequence number.
export async function appendToChain(tx: Tx, signOffId: string): Promise<{ seq: number; hash: string }> {
  const [s] = await tx.select(signOffColumns).from(signOff).where(eq(signOff.id, signOffId));
  if (!s) throw new Error(`sign-off ${signOffId} not found for the record chain`);
  await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${s.jobId}::text, 7177))`);
  const [last] = await tx
    .select({ seq: recordEntry.seq, hash: recordEntry.hash })
    .from(recordEntry)
    .where(eq(recordEntry.jobId, s.jobId))
    .orderBy(desc(recordEntry.seq))
    .limit(1);
  const prevHash = last?.hash ?? GENESIS_HASH;
  const seq = (last?.seq ?? 0) + 1;
  const hash = chainHash(prevHash, recordEntryFor(s as SignOffForChain));
  await tx.insert(recordEntry).values({ shopId: s.shopId, jobId: s.jobId, seq, signOffId: s.id, prevHash, hash });
  return { seq, hash };
}

type Integrity = {
  intact: boolean;
  entries: number;
  seal: string | null;
  /** the head as stored, shown even when the chain no longer verifies */
  storedSeal: string | null;
  /** each entry's stored hash in order: an earlier print of an open job carries one of these */
  entryHashes: string[];
  firstBrokenSeq?: number;
  reason?: string;
};

// The seal to print or show: the verified head, or the stored head of a chain that no longer verifies.
export function shownIntegrity(i: Integrity): { intact: boolean; entries: number; seal: string | null } {
  return { intact: i.intact, entries: i.entries, seal: i.intact ? i.seal : i.storedSeal };
}

// Recomputes the whole chain from the sign-off rows and names the first entry that no longer matches:
// a changed sign-off, a changed content hash, a changed or missing chain entry, or a sign-off left off the chain.
export async function verifyJobRecord(jobId: string, runner: Runner = db()): Promise<Integrity> {
  const rows = await runner
    .select({ seq: recordEntry.seq, prevHash: recordEntry.prevHash, hash: recordEntry.hash, signOffId: recordEntry.signOffId })
    .from(recordEntry)
    .where(eq(recordEntry.jobId, jobId))
    .orderBy(asc(recordEntry.seq));
  const signOffs = await runner.select(signOffColumns).from(signOff).where(eq(signOff.jobId, jobId));
  const byId = new Map(signOffs.map((s) => [s.id, s]));
  const storedSeal = rows.at(-1)?.hash ?? null;
  const entryHashes = rows.map((r) => r.hash);
  const broken = (seq: number, reason: string): Integrity => ({ intact: false, entries: rows.length, seal: null, storedSeal, entryHashes, firstBrokenSeq: seq, reason });

  for (const row of rows) {
    const s = byId.get(row.signOffId);
    if (!s) return broken(row.seq, "the sign-off this entry records is missing");
    if (contentHash(s.content) !== s.contentHash) return broken(row.seq, "the signed content no longer matches its hash: a value, photo or pass was changed");
  }
  const chain = verifyChain(
    rows.map((r) => ({ seq: r.seq, prevHash: r.prevHash, hash: r.hash, entry: recordEntryFor(byId.get(r.signOffId) as SignOffForChain) })),
  );
  if (!chain.intact) {
    return broken(chain.firstBrokenSeq ?? rows.length, chain.reason ?? "the chain does not verify");
  }
  if (signOffs.length !== rows.length) {
    return broken(rows.length + 1, `${signOffs.length - rows.length} sign-off(s) are not on the record chain`);
  }
  // The chain holds; the rows the screens read must still say what was sealed.
  const difference = firstRowDifference(signOffs, await liveRows(runner, jobId));
  if (difference) {
    const seq = rows.find((r) => r.signOffId === difference.signOffId)?.seq ?? rows.length;
    return broken(seq, `${difference.reason}: the record was changed after it was signed`);
  }
  return { intact: true, entries: rows.length, seal: chain.seal, storedSeal, entryHashes };
}

async function liveRows(runner: Runner, jobId: string): Promise<LiveRows> {
  const [steps, passes, photos, inspections, maps] = await Promise.all([
    runner.select({ id: jobStep.id, title: jobStep.title, value: jobStep.value }).from(jobStep).where(eq(jobStep.jobId, jobId)),
    runner
      .select({
        stepId: weldPass.stepId,
        passNumber: weldPass.passNumber,
        welderId: weldPass.welderId,
        process: weldPass.process,
        volts: weldPass.volts,
        amps: weldPass.amps,
        travelSpeedMmPerMin: weldPass.travelSpeedMmPerMin,
        preheatC: weldPass.preheatC,
        interpassC: weldPass.interpassC,
        fillerLot: weldPass.fillerLot,
        heatInputKJPerMm: weldPass.heatInputKJPerMm,
      })
      .from(weldPass)
      .where(and(eq(weldPass.jobId, jobId), isNull(weldPass.removedAt))),
    runner.select({ id: photo.id, sha256: photo.sha256 }).from(photo).where(eq(photo.jobId, jobId)),
    runner
      .select({
        signOffId: weldInspection.signOffId,
        criteria: weldInspection.criteria,
        observations: weldInspection.observations,
        judged: weldInspection.judged,
        decision: weldInspection.decision,
        notes: weldInspection.notes,
      })
      .from(weldInspection)
      .where(eq(weldInspection.jobId, jobId)),
    runner.select({ weldMap: job.weldMap }).from(job).where(eq(job.id, jobId)),
  ]);
  return { steps, passes, photos, inspections, weldMap: maps[0]?.weldMap ?? null };
}

/** The seal printed on a traveller against this record. */
export function paperCheck(integrity: Integrity, paperSeal: string): PaperCheck {
  return comparePaperSeal(paperSeal, { intact: integrity.intact, seal: integrity.seal, entryHashes: integrity.entryHashes });
}

export async function tokenForJob(runner: Runner, args: { shopId: string; jobId: string }): Promise<string> {
  const [existing] = await runner.select({ token: jobToken.token }).from(jobToken).where(eq(jobToken.jobId, args.jobId));
  if (existing) return existing.token;
  const token = randomBytes(20).toString("base64url");
  await runner.insert(jobToken).values({ jobId: args.jobId, shopId: args.shopId, token }).onConflictDoNothing();
  const [row] = await runner.select({ token: jobToken.token }).from(jobToken).where(eq(jobToken.jobId, args.jobId));
  return row!.token;
}

export async function jobIdForToken(token: string): Promise<{ jobId: string; shopId: string } | null> {
  const [row] = await db().select({ jobId: jobToken.jobId, shopId: jobToken.shopId }).from(jobToken).where(eq(jobToken.token, token));
  return row ?? null;
}

type PublicVerification = {
  jobNumber: string;
  /** the tag on the axle housing and the VIN's last 6, so a traveller moved to another housing shows it */
  axleTag: string;
  vinLast6: string;
  shop: string;
  status: string;
  releasedAt: string | null;
  integrity: { intact: boolean; entries: number; seal: string | null };
};

// What anyone holding the traveller may see: the housing's tag and the VIN's tail, no customer, no people.
export async function publicVerification(jobId: string): Promise<PublicVerification & { shopId: string; integrityDetail: Integrity }> {
  const rows = await db().execute<{ number: string; status: string; released_at: Date | null; shop_name: string; shop_id: string; axle_tag: string; vin: string }>(
    sql`select j.number, j.status, j.released_at, j.axle_tag, j.vin, s.name as shop_name, s.id as shop_id from job j join shop s on s.id = j.shop_id where j.id = ${jobId}`,
  );
  const j = rows.rows[0];
  if (!j) throw new Error("job of a token not found");
  const integrity = await verifyJobRecord(jobId);
  return {
    jobNumber: j.number,
    axleTag: j.axle_tag,
    vinLast6: j.vin.replace(/\s+/g, "").slice(-6).toUpperCase(),
    shop: j.shop_name,
    shopId: j.shop_id,
    status: j.status,
    releasedAt: j.released_at ? new Date(j.released_at).toISOString() : null,
    integrity: shownIntegrity(integrity),
    integrityDetail: integrity,
  };
}
