import "server-only";
import { and, desc, eq, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { shopActivity, user, wps, wpsRevision } from "@/db/schema";
import {
  applyPatch,
  contentIssues,
  EMPTY_CONTENT,
  issuesToFields,
  publishIssues,
  toWpsRanges,
  type WpsContent,
  type WpsPatch,
  type WpsProcess,
  type WpsState,
  type WpsStatus,
} from "@/lib/welding/wps-schema";
import { db } from "@/lib/db";
import { AppError, withDatabaseRefusals } from "@/lib/errors";
import type { WpsRanges } from "@/lib/welding";

type Db = ReturnType<typeof db>;
type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

type WpsListRow = {
  id: string;
  reference: string;
  title: string;
  process: WpsProcess | null;
  iso4063: number | null;
  state: WpsState;
  publishedNumber: number | null;
  draftNumber: number | null;
  latestNumber: number;
  /** The revision the row describes: published, else the last retired, else the draft. */
  shownNumber: number;
  changedAt: Date;
};

export type RevisionSummary = {
  id: string;
  number: number;
  status: WpsStatus;
  title: string;
  changeNote: string | null;
  authorName: string | null;
  publisherName: string | null;
  retiredByName: string | null;
  retireNote: string | null;
  createdAt: Date;
  updatedAt: Date;
  publishedAt: Date | null;
  retiredAt: Date | null;
};

type RevisionDetail = RevisionSummary & { wpsId: string; reference: string; content: WpsContent };

const publisher = alias(user, "publisher");
const retirer = alias(user, "retirer");

const contentColumns = {
  title: wpsRevision.title,
  process: wpsRevision.process,
  iso4063: wpsRevision.iso4063,
  baseMetals: wpsRevision.baseMetals,
  thicknessMinMm: wpsRevision.thicknessMinMm,
  thicknessMaxMm: wpsRevision.thicknessMaxMm,
  fillerClassification: wpsRevision.fillerClassification,
  fillerDiameterMm: wpsRevision.fillerDiameterMm,
  shieldingGas: wpsRevision.shieldingGas,
  gasFlowLPerMin: wpsRevision.gasFlowLPerMin,
  currentType: wpsRevision.currentType,
  polarity: wpsRevision.polarity,
  voltsMin: wpsRevision.voltsMin,
  voltsMax: wpsRevision.voltsMax,
  ampsMin: wpsRevision.ampsMin,
  ampsMax: wpsRevision.ampsMax,
  travelSpeedMinMmPerMin: wpsRevision.travelSpeedMinMmPerMin,
  travelSpeedMaxMmPerMin: wpsRevision.travelSpeedMaxMmPerMin,
  heatInputMaxKJPerMm: wpsRevision.heatInputMaxKJPerMm,
  heatInputBasis: wpsRevision.heatInputBasis,
  preheatMinC: wpsRevision.preheatMinC,
  interpassMaxC: wpsRevision.interpassMaxC,
  positions: wpsRevision.positions,
  notes: wpsRevision.notes,
};

const summaryColumns = {
  id: wpsRevision.id,
  number: wpsRevision.number,
  status: wpsRevision.status,
  title: wpsRevision.title,
  changeNote: wpsRevision.changeNote,
  authorName: user.name,
  publisherName: publisher.name,
  retiredByName: retirer.name,
  retireNote: wpsRevision.retireNote,
  createdAt: wpsRevision.createdAt,
  updatedAt: wpsRevision.updatedAt,
  publishedAt: wpsRevision.publishedAt,
  retiredAt: wpsRevision.retiredAt,
};

function pickContent(row: Record<string, unknown>): WpsContent {
  const out = {} as Record<string, unknown>;
  for (const k of Object.keys(EMPTY_CONTENT)) out[k] = row[k] ?? EMPTY_CONTENT[k as keyof WpsContent];
  return out as WpsContent;
}

function splitDetail(row: Record<string, unknown>): RevisionDetail {
  const content = pickContent(row);
  const summary = {} as Record<string, unknown>;
  for (const k of Object.keys(summaryColumns)) summary[k] = row[k];
  return { ...(summary as RevisionSummary), wpsId: row.wpsId as string, reference: row.reference as string, content };
}

// --- Reading ------------------------------------------------------------------------------------------

// Per WPS: the revision shown in the list is the published one, else the last retired one, else the draft.
const shownRevision = sql`coalesce(
  (select r.id from ${wpsRevision} r where r.wps_id = ${wps.id} and r.status = 'published'),
  (select r.id from ${wpsRevision} r where r.wps_id = ${wps.id} and r.status = 'retired' order by r.number desc limit 1),
  (select r.id from ${wpsRevision} r where r.wps_id = ${wps.id} order by r.number desc limit 1))`;
const publishedNumber = sql<number | null>`(select r.number from ${wpsRevision} r where r.wps_id = ${wps.id} and r.status = 'published')`;
const draftNumber = sql<number | null>`(select r.number from ${wpsRevision} r where r.wps_id = ${wps.id} and r.status = 'draft')`;
const everRetired = sql`exists (select 1 from ${wpsRevision} r where r.wps_id = ${wps.id} and r.status = 'retired')`;
const stateSql = sql<WpsState>`case when ${publishedNumber} is not null then 'published' when ${everRetired} then 'retired' else 'draft' end`;

export async function listWps(
  shopId: string,
  opts: { q?: string; state?: WpsState; process?: WpsProcess; page: number; pageSize: number },
): Promise<{ rows: WpsListRow[]; total: number }> {
  const filters: SQL[] = [eq(wps.shopId, shopId)];
  if (opts.q) {
    const like = `%${opts.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    filters.push(sql`(${wps.reference} ilike ${like} or ${wpsRevision.title} ilike ${like} or ${wpsRevision.fillerClassification} ilike ${like} or ${wpsRevision.baseMetals} ilike ${like})`);
  }
  if (opts.process) filters.push(eq(wpsRevision.process, opts.process));
  if (opts.state) filters.push(sql`${stateSql} = ${opts.state}`);
  const where = and(...filters);
  const [rows, [total]] = await Promise.all([
    db()
      .select({
        id: wps.id,
        reference: wps.reference,
        title: wpsRevision.title,
        process: wpsRevision.process,
        iso4063: wpsRevision.iso4063,
        state: stateSql,
        publishedNumber,
        draftNumber,
        latestNumber: sql<number>`(select max(r.number) from ${wpsRevision} r where r.wps_id = ${wps.id})`,
        shownNumber: wpsRevision.number,
        changedAt: sql<string>`(select max(greatest(r.updated_at, coalesce(r.published_at, r.updated_at), coalesce(r.retired_at, r.updated_at))) from ${wpsRevision} r where r.wps_id = ${wps.id})`,
      })
      .from(wps)
      .innerJoin(wpsRevision, sql`${wpsRevision.id} = ${shownRevision}`)
      .where(where)
      .orderBy(wps.reference, wps.id)
      .limit(opts.pageSize)
      .offset((opts.page - 1) * opts.pageSize),
    db().select({ n: sql<number>`count(*)::int` }).from(wps).innerJoin(wpsRevision, sql`${wpsRevision.id} = ${shownRevision}`).where(where),
  ]);
  return { rows: rows.map((r) => ({ ...r, changedAt: new Date(r.changedAt) })) as WpsListRow[], total: total?.n ?? 0 };
}

export async function getWps(shopId: string, wpsId: string) {
  const [row] = await db()
    .select({ id: wps.id, reference: wps.reference, createdAt: wps.createdAt, createdByName: user.name })
    .from(wps)
    .leftJoin(user, eq(user.id, wps.createdBy))
    .where(and(eq(wps.id, wpsId), eq(wps.shopId, shopId)));
  if (!row) throw new AppError("not_found", "WPS not found.");
  const revisions = (await db()
    .select(summaryColumns)
    .from(wpsRevision)
    .leftJoin(user, eq(user.id, wpsRevision.authorId))
    .leftJoin(publisher, eq(publisher.id, wpsRevision.publisherId))
    .leftJoin(retirer, eq(retirer.id, wpsRevision.retiredBy))
    .where(and(eq(wpsRevision.wpsId, wpsId), eq(wpsRevision.shopId, shopId)))
    .orderBy(desc(wpsRevision.number))) as RevisionSummary[];
  const published = revisions.find((r) => r.status === "published") ?? null;
  const draft = revisions.find((r) => r.status === "draft") ?? null;
  const state: WpsState = published ? "published" : revisions.some((r) => r.status === "retired") ? "retired" : "draft";
  // The revision a reader sees first: the one in use, else the last one that was (a retired WPS), else the draft.
  const shownNumber = (published ?? revisions.find((r) => r.status === "retired") ?? revisions[0])!.number;
  return { ...row, state, revisions, publishedNumber: published?.number ?? null, draftNumber: draft?.number ?? null, shownNumber };
}

const detailSelect = { ...summaryColumns, ...contentColumns, wpsId: wpsRevision.wpsId, reference: wps.reference };

function detailQuery(where: SQL | undefined) {
  return db()
    .select(detailSelect)
    .from(wpsRevision)
    .innerJoin(wps, eq(wps.id, wpsRevision.wpsId))
    .leftJoin(user, eq(user.id, wpsRevision.authorId))
    .leftJoin(publisher, eq(publisher.id, wpsRevision.publisherId))
    .leftJoin(retirer, eq(retirer.id, wpsRevision.retiredBy))
    .where(where);
}

export async function getRevision(shopId: string, wpsId: string, number: number): Promise<RevisionDetail> {
  const [row] = await detailQuery(and(eq(wpsRevision.wpsId, wpsId), eq(wpsRevision.shopId, shopId), eq(wpsRevision.number, number)));
  if (!row) throw new AppError("not_found", `Revision ${number} of this WPS not found.`);
  return splitDetail(row);
}

async function getRevisionById(shopId: string, revisionId: string): Promise<RevisionDetail> {
  const [row] = await detailQuery(and(eq(wpsRevision.id, revisionId), eq(wpsRevision.shopId, shopId)));
  if (!row) throw new AppError("not_found", "WPS revision not found.");
  return splitDetail(row);
}

// --- For the jobs side: what a weld pass is checked against --------------------------------------------

type WpsForPass = {
  wpsId: string;
  revisionId: string;
  reference: string;
  number: number;
  status: WpsStatus;
  title: string;
  process: WpsProcess | null;
  positions: string[];
  ranges: WpsRanges;
};

function forPass(r: RevisionDetail): WpsForPass {
  return {
    wpsId: r.wpsId,
    revisionId: r.id,
    reference: r.reference,
    number: r.number,
    status: r.status,
    title: r.content.title,
    process: r.content.process,
    positions: r.content.positions,
    ranges: toWpsRanges(r.content),
  };
}

/**
 * The published revision of a shop's WPS by its reference (as a weld step names it), with the ranges
 * `checkPassAgainstWps` reads; null when the shop has no such WPS or none of its revisions is in use.
 */
export async function publishedWpsByReference(shopId: string, reference: string): Promise<WpsForPass | null> {
  const [row] = await detailQuery(
    and(eq(wpsRevision.shopId, shopId), eq(wps.reference, reference.trim().toUpperCase()), eq(wpsRevision.status, "published")),
  );
  return row ? forPass(splitDetail(row)) : null;
}

/**
 * A given revision (say, the one a pass was welded to) with its ranges; another shop's answers not_found.
 * Its `status` says whether it is still in use; a retired revision's ranges are still its own.
 */
export async function loadWpsRanges(shopId: string, revisionId: string): Promise<WpsForPass> {
  return forPass(await getRevisionById(shopId, revisionId));
}

/** Published revisions, for pickers (a weld step's WPS, the WPS followed on a qualification test). */
export async function listPublishedWps(shopId: string, process?: WpsProcess) {
  return db()
    .select({ wpsId: wps.id, revisionId: wpsRevision.id, reference: wps.reference, number: wpsRevision.number, title: wpsRevision.title, process: wpsRevision.process })
    .from(wpsRevision)
    .innerJoin(wps, eq(wps.id, wpsRevision.wpsId))
    .where(and(eq(wpsRevision.shopId, shopId), eq(wpsRevision.status, "published"), process ? eq(wpsRevision.process, process) : undefined))
    .orderBy(wps.reference)
    .limit(500);
}

// --- Writing ------------------------------------------------------------------------------------------

// The database rules are the last word; their refusals become 409s, never 500s.
function guarded<T>(run: () => Promise<T>): Promise<T> {
  return withDatabaseRefusals(run, ({ code, constraint }) => {
    if (code === "23000") return new AppError("conflict", "A published or retired WPS revision never changes; start a new revision instead.");
    if (code === "23505" && constraint === "wps_shop_reference_idx") {
      return new AppError("conflict", "The shop already has a WPS with that reference.", { reference: ["Already in the library: pick another reference."] });
    }
    if (code === "23505" && constraint === "wps_revision_one_draft_idx") return new AppError("conflict", "This WPS already has a draft revision: finish it first.");
    if (code === "23505" && (constraint === "wps_revision_number_idx" || constraint === "wps_revision_one_published_idx")) {
      return new AppError("conflict", "Someone changed this WPS at the same moment; reload and try again.");
    }
    return undefined;
  });
}

async function lockWps(tx: Tx, shopId: string, wpsId: string) {
  const [row] = await tx.select({ id: wps.id, reference: wps.reference }).from(wps).where(and(eq(wps.id, wpsId), eq(wps.shopId, shopId))).for("update");
  if (!row) throw new AppError("not_found", "WPS not found.");
  return row;
}

async function lockRevision(tx: Tx, shopId: string, wpsId: string, number: number) {
  const [row] = await tx
    .select({ id: wpsRevision.id, status: wpsRevision.status, ...contentColumns })
    .from(wpsRevision)
    .where(and(eq(wpsRevision.wpsId, wpsId), eq(wpsRevision.shopId, shopId), eq(wpsRevision.number, number)))
    .for("update");
  if (!row) throw new AppError("not_found", `Revision ${number} of this WPS not found.`);
  return { id: row.id, status: row.status, content: pickContent(row) };
}

function refuseUnlessDraft(status: WpsStatus, number: number, reference: string) {
  if (status !== "draft") {
    throw new AppError(
      "conflict",
      `${reference} revision ${number} is ${status}: it never changes. Start a new revision to make changes.`,
      undefined,
      { status },
    );
  }
}

function contentValues(c: WpsContent) {
  return { ...c, positions: [...c.positions] };
}

export async function createWps(args: { shopId: string; actorId: string; reference: string; title: string; process: WpsProcess }) {
  return guarded(() =>
    db().transaction(async (tx) => {
      const [w] = await tx.insert(wps).values({ shopId: args.shopId, reference: args.reference, createdBy: args.actorId }).returning({ id: wps.id });
      // A steel shop's usual number per family (MAG, not MIG; gas-shielded flux-cored); the editor can change it.
      const iso = { SMAW: 111, GMAW: 135, FCAW: 136, GTAW: 141, SAW: 121 }[args.process];
      await tx.insert(wpsRevision).values({
        shopId: args.shopId,
        wpsId: w!.id,
        number: 1,
        ...contentValues({ ...EMPTY_CONTENT, title: args.title, process: args.process, iso4063: iso }),
        authorId: args.actorId,
      });
      await tx.insert(shopActivity).values({ shopId: args.shopId, actorId: args.actorId, action: "wps.created", detail: { wpsId: w!.id, reference: args.reference } });
      return { id: w!.id, reference: args.reference, number: 1 };
    }),
  );
}

/** Saves a draft: the whole content (the editor) or a patch (the API). Published and retired revisions answer 409. */
export async function saveDraft(args: { shopId: string; wpsId: string; number: number; actorId: string } & ({ content: WpsContent } | { patch: WpsPatch })) {
  return guarded(() =>
    db().transaction(async (tx) => {
      const w = await lockWps(tx, args.shopId, args.wpsId);
      const rev = await lockRevision(tx, args.shopId, args.wpsId, args.number);
      refuseUnlessDraft(rev.status, args.number, w.reference);
      const next = "content" in args ? args.content : applyPatch(rev.content, args.patch);
      const issues = contentIssues(next);
      if (issues.length) throw new AppError("bad_request", "Some fields are not valid.", issuesToFields(issues));
      await tx
        .update(wpsRevision)
        .set({ ...contentValues(next), updatedAt: new Date() })
        .where(and(eq(wpsRevision.id, rev.id), eq(wpsRevision.shopId, args.shopId)));
    }),
  );
}

/** Starts the next revision as a draft copy of the newest one (whatever its state). */
export async function startRevision(args: { shopId: string; wpsId: string; actorId: string }) {
  return guarded(() =>
    db().transaction(async (tx) => {
      const w = await lockWps(tx, args.shopId, args.wpsId);
      const revisions = await tx
        .select({ id: wpsRevision.id, number: wpsRevision.number, status: wpsRevision.status })
        .from(wpsRevision)
        .where(and(eq(wpsRevision.wpsId, w.id), eq(wpsRevision.shopId, args.shopId)))
        .orderBy(desc(wpsRevision.number));
      const draft = revisions.find((r) => r.status === "draft");
      if (draft) {
        throw new AppError("conflict", `${w.reference} already has a draft, revision ${draft.number}: finish it first.`, undefined, { draftNumber: draft.number });
      }
      const latest = revisions[0]!;
      const source = await lockRevision(tx, args.shopId, w.id, latest.number);
      const number = latest.number + 1;
      await tx.insert(wpsRevision).values({ shopId: args.shopId, wpsId: w.id, number, ...contentValues(source.content), authorId: args.actorId });
      await tx.insert(shopActivity).values({ shopId: args.shopId, actorId: args.actorId, action: "wps.revision_started", detail: { wpsId: w.id, reference: w.reference, number } });
      return { number, from: latest.number };
    }),
  );
}

/** Publishes a draft; the revision that was in use before goes out of use (retired, "superseded"). */
export async function publishRevision(args: { shopId: string; wpsId: string; number: number; changeNote: string; actorId: string }) {
  return guarded(() =>
    db().transaction(async (tx) => {
      const w = await lockWps(tx, args.shopId, args.wpsId);
      const rev = await lockRevision(tx, args.shopId, args.wpsId, args.number);
      refuseUnlessDraft(rev.status, args.number, w.reference);
      const issues = publishIssues(rev.content);
      if (issues.length) {
        const fields = issuesToFields(issues);
        throw new AppError("unprocessable", `Revision ${args.number} is not ready to publish: ${Object.keys(fields).length} field(s) need attention.`, fields);
      }
      const now = new Date();
      const [previous] = await tx
        .select({ id: wpsRevision.id, number: wpsRevision.number })
        .from(wpsRevision)
        .where(and(eq(wpsRevision.wpsId, w.id), eq(wpsRevision.shopId, args.shopId), eq(wpsRevision.status, "published")))
        .for("update");
      if (previous) {
        await tx
          .update(wpsRevision)
          .set({ status: "retired", retiredAt: now, retiredBy: args.actorId, retireNote: `Superseded by revision ${args.number}.`, updatedAt: now })
          .where(and(eq(wpsRevision.id, previous.id), eq(wpsRevision.shopId, args.shopId)));
      }
      await tx
        .update(wpsRevision)
        .set({ status: "published", changeNote: args.changeNote, publisherId: args.actorId, publishedAt: now, updatedAt: now })
        .where(and(eq(wpsRevision.id, rev.id), eq(wpsRevision.shopId, args.shopId)));
      await tx.insert(shopActivity).values({
        shopId: args.shopId,
        actorId: args.actorId,
        action: "wps.published",
        detail: { wpsId: w.id, reference: w.reference, number: args.number, superseded: previous?.number ?? null },
      });
      return { number: args.number, superseded: previous?.number ?? null };
    }),
  );
}

/** Takes the published revision out of use; the WPS can come back later with a new revision. */
export async function retireRevision(args: { shopId: string; wpsId: string; number: number; reason: string; actorId: string }) {
  return guarded(() =>
    db().transaction(async (tx) => {
      const w = await lockWps(tx, args.shopId, args.wpsId);
      const rev = await lockRevision(tx, args.shopId, args.wpsId, args.number);
      if (rev.status !== "published") {
        throw new AppError(
          "conflict",
          rev.status === "draft"
            ? `${w.reference} revision ${args.number} is a draft: only the published revision can be retired.`
            : `${w.reference} revision ${args.number} is already retired.`,
          undefined,
          { status: rev.status },
        );
      }
      const now = new Date();
      await tx
        .update(wpsRevision)
        .set({ status: "retired", retiredAt: now, retiredBy: args.actorId, retireNote: args.reason, updatedAt: now })
        .where(and(eq(wpsRevision.id, rev.id), eq(wpsRevision.shopId, args.shopId)));
      await tx.insert(shopActivity).values({ shopId: args.shopId, actorId: args.actorId, action: "wps.retired", detail: { wpsId: w.id, reference: w.reference, number: args.number } });
      return { number: args.number };
    }),
  );
}

