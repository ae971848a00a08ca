import "server-only";
import { and, asc, eq, isNull, sql, type SQL } from "drizzle-orm";
import { membership, qualificationNotice, shop, shopActivity, user, welderProcessUse, welderQualification, wps, wpsRevision } from "@/db/schema";
import { CODE_LABELS, rangeIssues, todayIso, type QualificationCreate, type QualificationPatch } from "@/app/api/qualifications/schema";
import { WPS_PROCESSES, type WpsPosition, type WpsProcess } from "@/app/api/wps/schema";
import { db } from "@/lib/db";
import { AppError } from "@/lib/errors";
import { continuity, LAPSING_WINDOW_DAYS, parseIsoDate, type ContinuityCode, type ContinuityResult, type ContinuityStatus } from "@/lib/welding";

type Db = ReturnType<typeof db>;
export type DbOrTx = Db | Parameters<Parameters<Db["transaction"]>[0]>[0];

export type QualificationRow = {
  id: string;
  welderUserId: string;
  welderName: string;
  process: WpsProcess;
  positions: WpsPosition[];
  thicknessMinMm: number;
  thicknessMaxMm: number | null;
  diameterMinMm: number | null;
  diameterMaxMm: number | null;
  fillerFNumber: number;
  testDate: string;
  wpsId: string | null;
  wpsReference: string | null;
  notes: string;
  /** The last use of the process on a job (logged passes, or a lead's entry from paper records). */
  lastJobUseOn: string | null;
  /** What continuity runs from: the later of the last job use and the newest test of the process. */
  lastUsedOn: string;
  continuity: ContinuityResult & { code: ContinuityCode };
  certificate: { name: string | null; contentType: string; size: number; uploadedAt: Date } | null;
  createdAt: Date;
  updatedAt: Date;
};

// --- Continuity in SQL, for filters and order; the figures shown come from lib/welding continuity() ---

const newestTest = sql`(select max(q2.test_date) from ${welderQualification} q2
  where q2.shop_id = ${welderQualification.shopId} and q2.welder_user_id = ${welderQualification.welderUserId} and q2.process = ${welderQualification.process})`;

function effectiveLastUse(today: string) {
  // Never after today: a use recorded later than the day asked about cannot make it older.
  return sql`least(greatest(${welderProcessUse.lastUsedOn}, ${newestTest}), ${today}::date)`;
}

// Postgres adds months clamping to the end of a shorter month, as lib/welding addMonthsClamped does.
// ASME IX QW-322.1 lapses on the 6-month anniversary; AWS D1.1 6.2.3.1 from the day after it.
export function expiresOnSql(code: ContinuityCode, today: string) {
  return sql`((${effectiveLastUse(today)} + interval '6 months')::date + ${code === "aws-d1.1" ? 1 : 0}::int)`;
}

export function daysLeftSql(code: ContinuityCode, today: string) {
  return sql`(${expiresOnSql(code, today)} - ${today}::date)`;
}

function statusFilter(status: ContinuityStatus, code: ContinuityCode, today: string): SQL {
  const d = daysLeftSql(code, today);
  if (status === "lapsed") return sql`${d} <= 0`;
  if (status === "lapsing") return sql`${d} between 1 and ${LAPSING_WINDOW_DAYS}`;
  return sql`${d} > ${LAPSING_WINDOW_DAYS}`;
}

const activeWelder = and(eq(membership.active, true), sql`'welder' = any(${membership.roles})`);

function rowColumns(today: string) {
  return {
    id: welderQualification.id,
    welderUserId: welderQualification.welderUserId,
    welderName: user.name,
    process: welderQualification.process,
    positions: welderQualification.positions,
    thicknessMinMm: welderQualification.thicknessMinMm,
    thicknessMaxMm: welderQualification.thicknessMaxMm,
    diameterMinMm: welderQualification.diameterMinMm,
    diameterMaxMm: welderQualification.diameterMaxMm,
    fillerFNumber: welderQualification.fillerFNumber,
    testDate: welderQualification.testDate,
    wpsId: welderQualification.wpsId,
    wpsReference: wps.reference,
    notes: welderQualification.notes,
    lastJobUseOn: welderProcessUse.lastUsedOn,
    lastUsedOn: sql<string>`to_char(${effectiveLastUse(today)}, 'YYYY-MM-DD')`,
    certificateType: welderQualification.certificateType,
    certificateName: welderQualification.certificateName,
    certificateSize: welderQualification.certificateSize,
    certificateUploadedAt: welderQualification.certificateUploadedAt,
    createdAt: welderQualification.createdAt,
    updatedAt: welderQualification.updatedAt,
  };
}

type RawRow = {
  [K in keyof ReturnType<typeof rowColumns>]: unknown;
};

function toRow(r: RawRow, code: ContinuityCode, today: string): QualificationRow {
  const lastUsedOn = r.lastUsedOn as string;
  return {
    id: r.id as string,
    welderUserId: r.welderUserId as string,
    welderName: r.welderName as string,
    process: r.process as WpsProcess,
    positions: r.positions as WpsPosition[],
    thicknessMinMm: r.thicknessMinMm as number,
    thicknessMaxMm: r.thicknessMaxMm as number | null,
    diameterMinMm: r.diameterMinMm as number | null,
    diameterMaxMm: r.diameterMaxMm as number | null,
    fillerFNumber: r.fillerFNumber as number,
    testDate: r.testDate as string,
    wpsId: r.wpsId as string | null,
    wpsReference: r.wpsReference as string | null,
    notes: r.notes as string,
    lastJobUseOn: r.lastJobUseOn as string | null,
    lastUsedOn,
    continuity: { ...continuity(code, lastUsedOn, today), code },
    certificate: r.certificateType
      ? { name: r.certificateName as string | null, contentType: r.certificateType as string, size: r.certificateSize as number, uploadedAt: r.certificateUploadedAt as Date }
      : null,
    createdAt: r.createdAt as Date,
    updatedAt: r.updatedAt as Date,
  };
}

/** Join conditions of a qualification to its welder's membership and to the process's last recorded use. */
export const QUALIFIED_MEMBER = and(eq(membership.shopId, welderQualification.shopId), eq(membership.userId, welderQualification.welderUserId));
export const PROCESS_LAST_USE = and(
  eq(welderProcessUse.shopId, welderQualification.shopId),
  eq(welderProcessUse.welderUserId, welderQualification.welderUserId),
  eq(welderProcessUse.process, welderQualification.process),
);

function baseQuery(today: string, where: SQL | undefined) {
  return db()
    .select(rowColumns(today))
    .from(welderQualification)
    .innerJoin(user, eq(user.id, welderQualification.welderUserId))
    .innerJoin(membership, QUALIFIED_MEMBER)
    .leftJoin(welderProcessUse, PROCESS_LAST_USE)
    .leftJoin(wps, eq(wps.id, welderQualification.wpsId))
    .where(where);
}

export async function shopContinuityCode(shopId: string, tx: DbOrTx = db()): Promise<ContinuityCode> {
  const [row] = await tx.select({ code: shop.continuityCode }).from(shop).where(eq(shop.id, shopId));
  if (!row) throw new AppError("not_found", "Shop not found.");
  return row.code;
}

/**
 * Qualifications of the shop's active welders with their continuity on `today` (UTC date unless given),
 * soonest expiry first. `status` filters on the server: "lapsing" is 1 to 30 days left.
 */
export async function listQualifications(
  shopId: string,
  opts: { q?: string; process?: WpsProcess; status?: ContinuityStatus; welderUserId?: string; page: number; pageSize: number; today?: string },
): Promise<{ rows: QualificationRow[]; total: number; code: ContinuityCode; today: string }> {
  const today = opts.today ?? todayIso();
  const code = await shopContinuityCode(shopId);
  const filters: SQL[] = [eq(welderQualification.shopId, shopId), activeWelder!];
  if (opts.q) {
    const like = `%${opts.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    filters.push(sql`(${user.name} ilike ${like} or ${user.email} ilike ${like})`);
  }
  if (opts.process) filters.push(eq(welderQualification.process, opts.process));
  if (opts.welderUserId) filters.push(eq(welderQualification.welderUserId, opts.welderUserId));
  if (opts.status) filters.push(statusFilter(opts.status, code, today));
  const where = and(...filters);
  const [rows, [total]] = await Promise.all([
    baseQuery(today, where)
      .orderBy(sql`${expiresOnSql(code, today)}`, asc(user.name), asc(welderQualification.process), asc(welderQualification.id))
      .limit(opts.pageSize)
      .offset((opts.page - 1) * opts.pageSize),
    db()
      .select({ n: sql<number>`count(*)::int` })
      .from(welderQualification)
      .innerJoin(user, eq(user.id, welderQualification.welderUserId))
      .innerJoin(membership, and(eq(membership.shopId, welderQualification.shopId), eq(membership.userId, welderQualification.welderUserId)))
      .leftJoin(
        welderProcessUse,
        and(
          eq(welderProcessUse.shopId, welderQualification.shopId),
          eq(welderProcessUse.welderUserId, welderQualification.welderUserId),
          eq(welderProcessUse.process, welderQualification.process),
        ),
      )
      .where(where),
  ]);
  return { rows: rows.map((r) => toRow(r, code, today)), total: total?.n ?? 0, code, today };
}

/** How many of the shop's qualifications are in each state today (for the page's summary). */
export async function continuityCounts(shopId: string, today = todayIso()) {
  const code = await shopContinuityCode(shopId);
  const d = daysLeftSql(code, today);
  const [row] = await db()
    .select({
      lapsed: sql<number>`count(*) filter (where ${d} <= 0)::int`,
      lapsing: sql<number>`count(*) filter (where ${d} between 1 and ${LAPSING_WINDOW_DAYS})::int`,
      current: sql<number>`count(*) filter (where ${d} > ${LAPSING_WINDOW_DAYS})::int`,
    })
    .from(welderQualification)
    .innerJoin(membership, QUALIFIED_MEMBER)
    .leftJoin(welderProcessUse, PROCESS_LAST_USE)
    .where(and(eq(welderQualification.shopId, shopId), activeWelder));
  return { lapsed: row?.lapsed ?? 0, lapsing: row?.lapsing ?? 0, current: row?.current ?? 0, code };
}

/** One qualification, whether or not its welder is still active; another shop's answers not_found. */
export async function getQualification(shopId: string, id: string, today = todayIso()): Promise<QualificationRow> {
  const code = await shopContinuityCode(shopId);
  const [row] = await db()
    .select(rowColumns(today))
    .from(welderQualification)
    .innerJoin(user, eq(user.id, welderQualification.welderUserId))
    .leftJoin(
      welderProcessUse,
      and(
        eq(welderProcessUse.shopId, welderQualification.shopId),
        eq(welderProcessUse.welderUserId, welderQualification.welderUserId),
        eq(welderProcessUse.process, welderQualification.process),
      ),
    )
    .leftJoin(wps, eq(wps.id, welderQualification.wpsId))
    .where(and(eq(welderQualification.id, id), eq(welderQualification.shopId, shopId)));
  if (!row) throw new AppError("not_found", "Qualification not found.");
  return toRow(row, code, today);
}

/** Active members holding the welder role: who may hold a qualification. */
export async function listShopWelders(shopId: string) {
  return db()
    .select({ userId: user.id, name: user.name, email: user.email })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(and(eq(membership.shopId, shopId), activeWelder))
    .orderBy(asc(user.name))
    .limit(500);
}

/** Active welders of the shop who hold no qualification at all. */
export async function weldersWithoutQualification(shopId: string) {
  return db()
    .select({ userId: user.id, name: user.name })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(
      and(
        eq(membership.shopId, shopId),
        activeWelder,
        sql`not exists (select 1 from ${welderQualification} q where q.shop_id = ${membership.shopId} and q.welder_user_id = ${membership.userId})`,
      ),
    )
    .orderBy(asc(user.name))
    .limit(100);
}

// --- For the jobs side ----------------------------------------------------------------------------------

function isoDateOf(date: string | Date): string {
  if (date instanceof Date) {
    if (Number.isNaN(date.getTime())) throw new AppError("bad_request", "The date of the process use is not a date.");
    return date.toISOString().slice(0, 10);
  }
  try {
    parseIsoDate(date);
  } catch {
    throw new AppError("bad_request", `"${date}" is not a calendar date (YYYY-MM-DD).`);
  }
  return date;
}

function assertProcess(process: string): asserts process is WpsProcess {
  if (!(WPS_PROCESSES as readonly string[]).includes(process)) {
    throw new AppError("bad_request", `Process is one of ${WPS_PROCESSES.join(", ")}.`, { process: ["Unknown process."] });
  }
}

/**
 * Records that a welder used a process on a day (every logged weld pass calls this inside its own
 * transaction). Keeps the latest date: a pass logged late for an earlier day never moves it back.
 * Returns the stored last use. Dates are UTC calendar days; a Date is taken as its UTC day.
 */
export async function recordProcessUse(
  tx: DbOrTx,
  args: { shopId: string; welderUserId: string; process: WpsProcess | string; date: string | Date },
): Promise<{ lastUsedOn: string }> {
  assertProcess(args.process);
  const day = isoDateOf(args.date);
  const [row] = await tx
    .insert(welderProcessUse)
    .values({ shopId: args.shopId, welderUserId: args.welderUserId, process: args.process, lastUsedOn: day })
    .onConflictDoUpdate({
      target: [welderProcessUse.shopId, welderProcessUse.welderUserId, welderProcessUse.process],
      set: { lastUsedOn: sql`greatest(${welderProcessUse.lastUsedOn}, excluded.last_used_on)`, updatedAt: new Date() },
    })
    .returning({ lastUsedOn: welderProcessUse.lastUsedOn });
  return { lastUsedOn: row!.lastUsedOn };
}

export type QualificationCheck = {
  ok: boolean;
  /** A sentence for the welder and the record: who, which process, and why (or until when). */
  reason: string;
  /** The first day the qualification is lapsed, when it is lapsed on `onDate`. */
  lapsedOn?: string;
  status?: ContinuityStatus;
  expiresOn?: string;
  lastValidOn?: string;
  daysLeft?: number;
  lastUsedOn?: string;
  code: ContinuityCode;
  source?: string;
  welderName: string | null;
  /** Qualifications of this welder for this process tested on or before `onDate` (positions, ranges). */
  qualifications: { id: string; positions: WpsPosition[]; thicknessMinMm: number; thicknessMaxMm: number | null; diameterMinMm: number | null; diameterMaxMm: number | null; fillerFNumber: number; testDate: string }[];
};

/**
 * May this welder weld with this process on `onDate` (YYYY-MM-DD, the pass's day)? Continuity runs from the
 * later of the last logged use and the newest test, by the shop's code (ASME IX QW-322.1 or AWS D1.1
 * 6.2.3.1). A refusal names the welder, the process and, when lapsed, the day it lapsed.
 */
export async function currentQualification(
  args: { shopId: string; welderUserId: string; process: WpsProcess | string; onDate: string | Date },
  tx: DbOrTx = db(),
): Promise<QualificationCheck> {
  assertProcess(args.process);
  const process = args.process;
  const onDate = isoDateOf(args.onDate);
  const code = await shopContinuityCode(args.shopId, tx);
  const [member] = await tx
    .select({ name: user.name, active: membership.active, roles: membership.roles })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(and(eq(membership.shopId, args.shopId), eq(membership.userId, args.welderUserId)));
  const base = { code, welderName: member?.name ?? null, qualifications: [] as QualificationCheck["qualifications"] };
  if (!member || !member.active || !member.roles.includes("welder")) {
    return { ...base, ok: false, reason: `${member?.name ?? "This person"} is not an active welder of this shop.` };
  }
  const quals = await tx
    .select({
      id: welderQualification.id,
      positions: welderQualification.positions,
      thicknessMinMm: welderQualification.thicknessMinMm,
      thicknessMaxMm: welderQualification.thicknessMaxMm,
      diameterMinMm: welderQualification.diameterMinMm,
      diameterMaxMm: welderQualification.diameterMaxMm,
      fillerFNumber: welderQualification.fillerFNumber,
      testDate: welderQualification.testDate,
    })
    .from(welderQualification)
    .where(and(eq(welderQualification.shopId, args.shopId), eq(welderQualification.welderUserId, args.welderUserId), eq(welderQualification.process, process)))
    .orderBy(asc(welderQualification.testDate));
  if (quals.length === 0) {
    return { ...base, ok: false, reason: `${member.name} holds no ${process} qualification in this shop.` };
  }
  const tested = quals.filter((q) => q.testDate <= onDate);
  if (tested.length === 0) {
    return { ...base, ok: false, reason: `${member.name}'s ${process} qualification was tested on ${quals[0]!.testDate}, after ${onDate}.` };
  }
  const [use] = await tx
    .select({ lastUsedOn: welderProcessUse.lastUsedOn })
    .from(welderProcessUse)
    .where(and(eq(welderProcessUse.shopId, args.shopId), eq(welderProcessUse.welderUserId, args.welderUserId), eq(welderProcessUse.process, process)));
  const newestTest = tested[tested.length - 1]!.testDate;
  let lastUsedOn = use && use.lastUsedOn > newestTest ? use.lastUsedOn : newestTest;
  if (lastUsedOn > onDate) lastUsedOn = onDate;
  const c = continuity(code, lastUsedOn, onDate);
  const common = {
    ...base,
    qualifications: tested,
    status: c.status,
    expiresOn: c.expiresOn,
    lastValidOn: c.lastValidOn,
    daysLeft: c.daysLeft,
    lastUsedOn,
    source: c.source,
  };
  if (c.status === "lapsed") {
    return {
      ...common,
      ok: false,
      lapsedOn: c.expiresOn,
      reason:
        `${member.name}'s ${process} qualification lapsed on ${c.expiresOn}: ${process} was last used on ${lastUsedOn}, ` +
        `and under ${CODE_LABELS[code]} it lapses ${code === "asme-ix" ? "after 6 months or more" : "after more than six months"} unused. ` +
        `Requalify before welding ${process} again.`,
    };
  }
  return {
    ...common,
    ok: true,
    reason:
      `${member.name} is qualified for ${process} through ${c.lastValidOn} (last used ${lastUsedOn}; ${CODE_LABELS[code]})` +
      (c.status === "lapsing" ? `: it lapses on ${c.expiresOn}, in ${c.daysLeft} day${c.daysLeft === 1 ? "" : "s"}, unless ${process} is used before then.` : "."),
  };
}

// --- Writing --------------------------------------------------------------------------------------------

async function assertWelder(tx: DbOrTx, shopId: string, welderUserId: string) {
  const [row] = await tx
    .select({ name: user.name })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(and(eq(membership.shopId, shopId), eq(membership.userId, welderUserId), activeWelder));
  if (!row) throw new AppError("unprocessable", "That person is not an active welder of this shop.", { welderUserId: ["Choose an active member with the welder role."] });
  return row;
}

async function assertWpsFor(tx: DbOrTx, shopId: string, wpsId: string, process: WpsProcess) {
  const rows = await tx
    .select({ process: wpsRevision.process, status: wpsRevision.status })
    .from(wps)
    .innerJoin(wpsRevision, eq(wpsRevision.wpsId, wps.id))
    .where(and(eq(wps.id, wpsId), eq(wps.shopId, shopId)));
  if (rows.length === 0) throw new AppError("unprocessable", "That WPS is not in this shop's library.", { wpsId: ["Choose a WPS from the library."] });
  if (!rows.some((r) => r.process === process)) {
    throw new AppError("unprocessable", `That WPS is not a ${process} procedure.`, { wpsId: [`Choose a ${process} WPS, or none.`] });
  }
}

export async function createQualification(args: { shopId: string; actorId: string; input: QualificationCreate }) {
  const v = args.input;
  return db().transaction(async (tx) => {
    const welder = await assertWelder(tx, args.shopId, v.welderUserId);
    if (v.wpsId) await assertWpsFor(tx, args.shopId, v.wpsId, v.process);
    const [row] = await tx
      .insert(welderQualification)
      .values({
        shopId: args.shopId,
        welderUserId: v.welderUserId,
        process: v.process,
        positions: v.positions,
        thicknessMinMm: v.thicknessMinMm,
        thicknessMaxMm: v.thicknessMaxMm ?? null,
        diameterMinMm: v.diameterMinMm ?? null,
        diameterMaxMm: v.diameterMaxMm ?? null,
        fillerFNumber: v.fillerFNumber,
        testDate: v.testDate,
        wpsId: v.wpsId ?? null,
        notes: v.notes ?? "",
        createdBy: args.actorId,
      })
      .returning({ id: welderQualification.id });
    if (v.lastUsedOn) await recordProcessUse(tx, { shopId: args.shopId, welderUserId: v.welderUserId, process: v.process, date: v.lastUsedOn });
    await tx.insert(shopActivity).values({
      shopId: args.shopId,
      actorId: args.actorId,
      action: "qualification.added",
      detail: { qualificationId: row!.id, welderUserId: v.welderUserId, welderName: welder.name, process: v.process },
    });
    return { id: row!.id };
  });
}

export async function updateQualification(args: { shopId: string; actorId: string; id: string; patch: QualificationPatch }) {
  const p = args.patch;
  return db().transaction(async (tx) => {
    const [cur] = await tx
      .select({
        welderUserId: welderQualification.welderUserId,
        process: welderQualification.process,
        thicknessMinMm: welderQualification.thicknessMinMm,
        thicknessMaxMm: welderQualification.thicknessMaxMm,
        diameterMinMm: welderQualification.diameterMinMm,
        diameterMaxMm: welderQualification.diameterMaxMm,
      })
      .from(welderQualification)
      .where(and(eq(welderQualification.id, args.id), eq(welderQualification.shopId, args.shopId)))
      .for("update");
    if (!cur) throw new AppError("not_found", "Qualification not found.");
    const merged = {
      thicknessMinMm: p.thicknessMinMm ?? cur.thicknessMinMm,
      thicknessMaxMm: p.thicknessMaxMm !== undefined ? p.thicknessMaxMm : cur.thicknessMaxMm,
      diameterMinMm: p.diameterMinMm !== undefined ? p.diameterMinMm : cur.diameterMinMm,
      diameterMaxMm: p.diameterMaxMm !== undefined ? p.diameterMaxMm : cur.diameterMaxMm,
    };
    const issues = rangeIssues(merged);
    if (issues.length) {
      const fields: Record<string, string[]> = {};
      for (const i of issues) (fields[i.path] ??= []).push(i.message);
      throw new AppError("bad_request", "Some fields are not valid.", fields);
    }
    if (p.wpsId) await assertWpsFor(tx, args.shopId, p.wpsId, cur.process);
    const set: Partial<typeof welderQualification.$inferInsert> = { ...merged, updatedAt: new Date() };
    if (p.positions) set.positions = p.positions;
    if (p.fillerFNumber !== undefined) set.fillerFNumber = p.fillerFNumber;
    if (p.testDate !== undefined) set.testDate = p.testDate;
    if (p.wpsId !== undefined) set.wpsId = p.wpsId;
    if (p.notes !== undefined) set.notes = p.notes;
    await tx.update(welderQualification).set(set).where(and(eq(welderQualification.id, args.id), eq(welderQualification.shopId, args.shopId)));
    if (p.lastUsedOn) await recordProcessUse(tx, { shopId: args.shopId, welderUserId: cur.welderUserId, process: cur.process, date: p.lastUsedOn });
    await tx.insert(shopActivity).values({
      shopId: args.shopId,
      actorId: args.actorId,
      action: "qualification.changed",
      detail: { qualificationId: args.id, fields: Object.keys(p) },
    });
  });
}

export async function setCertificate(args: {
  shopId: string;
  id: string;
  actorId: string;
  key: string;
  contentType: string;
  name: string | null;
  size: number;
  sha256: string;
}) {
  return db().transaction(async (tx) => {
    const updated = await tx
      .update(welderQualification)
      .set({
        certificateKey: args.key,
        certificateType: args.contentType,
        certificateName: args.name,
        certificateSize: args.size,
        certificateSha256: args.sha256,
        certificateUploadedAt: new Date(),
        certificateUploadedBy: args.actorId,
        updatedAt: new Date(),
      })
      .where(and(eq(welderQualification.id, args.id), eq(welderQualification.shopId, args.shopId)))
      .returning({ id: welderQualification.id });
    if (!updated.length) throw new AppError("not_found", "Qualification not found.");
    await tx.insert(shopActivity).values({
      shopId: args.shopId,
      actorId: args.actorId,
      action: "qualification.certificate_uploaded",
      detail: { qualificationId: args.id, contentType: args.contentType, size: args.size, sha256: args.sha256 },
    });
  });
}

export async function certificateOf(shopId: string, id: string) {
  const [row] = await db()
    .select({
      key: welderQualification.certificateKey,
      contentType: welderQualification.certificateType,
      name: welderQualification.certificateName,
      sha256: welderQualification.certificateSha256,
      process: welderQualification.process,
      welderName: user.name,
    })
    .from(welderQualification)
    .innerJoin(user, eq(user.id, welderQualification.welderUserId))
    .where(and(eq(welderQualification.id, id), eq(welderQualification.shopId, shopId)));
  if (!row) throw new AppError("not_found", "Qualification not found.");
  return row;
}

export async function qualificationExists(shopId: string, id: string) {
  const [row] = await db()
    .select({ id: welderQualification.id })
    .from(welderQualification)
    .where(and(eq(welderQualification.id, id), eq(welderQualification.shopId, shopId)));
  if (!row) throw new AppError("not_found", "Qualification not found.");
}

export async function setContinuityCode(args: { shopId: string; code: ContinuityCode; actorId: string }) {
  await db().transaction(async (tx) => {
    const [before] = await tx.select({ code: shop.continuityCode }).from(shop).where(eq(shop.id, args.shopId)).for("update");
    if (!before) throw new AppError("not_found", "Shop not found.");
    if (before.code === args.code) return;
    await tx.update(shop).set({ continuityCode: args.code }).where(eq(shop.id, args.shopId));
    await tx.insert(shopActivity).values({ shopId: args.shopId, actorId: args.actorId, action: "shop.continuity_code_set", detail: { from: before.code, to: args.code } });
  });
}

// --- Lapsing notices (the daily job) -------------------------------------------------------------------

export type LapsingForNotice = {
  qualificationId: string;
  shopId: string;
  shopName: string;
  code: ContinuityCode;
  welderName: string;
  process: WpsProcess;
  positions: WpsPosition[];
  lastUsedOn: string;
  expiresOn: string;
  daysLeft: number;
};

/** Every shop's active-welder qualifications that lapse within the window, as of `today`. */
export async function lapsingForNotices(today: string): Promise<LapsingForNotice[]> {
  const shops = await db().select({ id: shop.id, name: shop.name, code: shop.continuityCode }).from(shop).orderBy(asc(shop.name));
  const out: LapsingForNotice[] = [];
  for (const s of shops) {
    let page = 1;
    for (;;) {
      const { rows, total } = await listQualifications(s.id, { status: "lapsing", page, pageSize: 100, today });
      for (const r of rows) {
        out.push({
          qualificationId: r.id,
          shopId: s.id,
          shopName: s.name,
          code: r.continuity.code,
          welderName: r.welderName,
          process: r.process,
          positions: r.positions,
          lastUsedOn: r.lastUsedOn,
          expiresOn: r.continuity.expiresOn,
          daysLeft: r.continuity.daysLeft,
        });
      }
      if (page * 100 >= total) break;
      page++;
    }
  }
  return out;
}

export async function shopLeads(shopId: string) {
  return db()
    .select({ userId: user.id, name: user.name, email: user.email })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(and(eq(membership.shopId, shopId), eq(membership.active, true), sql`'lead' = any(${membership.roles})`))
    .orderBy(asc(user.name));
}

/** Claims the right to mail one notice; false when that qualification, lead and day (or stage) has one. */
export async function claimNotice(args: { shopId: string; qualificationId: string; recipientUserId: string; noticeOn: string; expiresOn: string; stage: number }) {
  const rows = await db().insert(qualificationNotice).values(args).onConflictDoNothing().returning({ id: qualificationNotice.id });
  return rows[0]?.id ?? null;
}

export async function attachNoticeMail(noticeId: string, mailId: string) {
  await db().update(qualificationNotice).set({ mailId }).where(eq(qualificationNotice.id, noticeId));
}

/** Gives a claim back when its mail could not even be queued, so the next run tries again. */
export async function releaseNotice(noticeId: string) {
  await db().delete(qualificationNotice).where(and(eq(qualificationNotice.id, noticeId), isNull(qualificationNotice.mailId)));
}
