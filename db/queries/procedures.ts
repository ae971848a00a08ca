import "server-only";
import { and, asc, count, desc, eq, ilike, ne, or, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { procedure, procedureImage, procedureVersion, shopActivity, user } from "@/db/schema";
import { db } from "@/lib/db";
import { AppError, withDatabaseRefusals } from "@/lib/errors";
import { publishReadiness } from "@/lib/procedures/checks";
import type { ListQuery } from "@/lib/procedures/forms";
import { versionHash, type VersionBody } from "@/lib/procedures/hash";
import { versionContentSchema, weldJointIds, type VersionContent } from "@/lib/procedures/schema";
import { pruneWeldMap } from "@/lib/weld-map";

type VersionStatus = "draft" | "published" | "retired";
export type VersionSummary = { number: number; status: VersionStatus };

type ProcedureListRow = {
  id: string;
  title: string;
  code: string;
  ownerName: string | null;
  changedAt: Date;
  versions: VersionSummary[];
};

type VersionMeta = {
  id: string;
  number: number;
  status: VersionStatus;
  title: string;
  changeNote: string | null;
  contentHash: string | null;
  authorName: string | null;
  publisherName: string | null;
  createdAt: Date;
  updatedAt: Date;
  publishedAt: Date | null;
  retiredAt: Date | null;
  stepCount: number;
};

type VersionDetail = Omit<VersionMeta, "stepCount"> & { procedureId: string; scope: string; code: string; content: VersionContent };

const publisher = alias(user, "publisher");

// --- Reading ------------------------------------------------------------------------------------------

const hasStatus = (status: VersionStatus) =>
  sql`exists (select 1 from ${procedureVersion} v where v.procedure_id = ${procedure.id} and v.status = ${status})`;

const changedAt = sql<Date>`(select max(greatest(v.updated_at, coalesce(v.published_at, v.updated_at), coalesce(v.retired_at, v.updated_at))) from ${procedureVersion} v where v.procedure_id = ${procedure.id})`;

export async function listProcedures(shopId: string, q: ListQuery): Promise<{ rows: ProcedureListRow[]; total: number }> {
  const filters: SQL[] = [eq(procedure.shopId, shopId)];
  if (q.q) {
    const like = `%${q.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    filters.push(or(ilike(procedure.title, like), ilike(procedure.code, like), ilike(procedure.scope, like))!);
  }
  if (q.state === "published") filters.push(hasStatus("published"));
  if (q.state === "draft") filters.push(hasStatus("draft"));
  if (q.state === "retired") filters.push(sql`(${hasStatus("retired")} and not ${hasStatus("published")})`);
  const where = and(...filters);
  const direction = q.dir === "desc" ? desc : asc;
  const order = q.sort === "updated" ? [direction(changedAt), asc(procedure.id)] : [direction(sql`lower(${procedure.title})`), asc(procedure.id)];
  const [rows, [total]] = await Promise.all([
    db()
      .select({
        id: procedure.id,
        title: procedure.title,
        code: procedure.code,
        ownerName: user.name,
        changedAt: sql<string>`${changedAt}`,
        versions: sql<VersionSummary[]>`(select coalesce(json_agg(json_build_object('number', v.number, 'status', v.status) order by v.number), '[]'::json) from ${procedureVersion} v where v.procedure_id = ${procedure.id})`,
      })
      .from(procedure)
      .leftJoin(user, eq(user.id, procedure.ownerId))
      .where(where)
      .orderBy(...order)
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize),
    db().select({ n: count() }).from(procedure).where(where),
  ]);
  return { rows: rows.map((r) => ({ ...r, changedAt: new Date(r.changedAt) })), total: total?.n ?? 0 };
}

export async function getProcedure(shopId: string, procedureId: string, paging: { page: number; pageSize: number } = { page: 1, pageSize: 50 }) {
  const [row] = await db()
    .select({
      id: procedure.id,
      title: procedure.title,
      scope: procedure.scope,
      code: procedure.code,
      ownerId: procedure.ownerId,
      ownerName: user.name,
      createdAt: procedure.createdAt,
    })
    .from(procedure)
    .leftJoin(user, eq(user.id, procedure.ownerId))
    .where(and(eq(procedure.id, procedureId), eq(procedure.shopId, shopId)));
  if (!row) throw new AppError("not_found", "Procedure not found.");
  const versions = await db()
    .select({
      id: procedureVersion.id,
      number: procedureVersion.number,
      status: procedureVersion.status,
      title: procedureVersion.title,
      changeNote: procedureVersion.changeNote,
      contentHash: procedureVersion.contentHash,
      authorName: user.name,
      publisherName: publisher.name,
      createdAt: procedureVersion.createdAt,
      updatedAt: procedureVersion.updatedAt,
      publishedAt: procedureVersion.publishedAt,
      retiredAt: procedureVersion.retiredAt,
      stepCount: sql<number>`(select count(*)::int from jsonb_array_elements(${procedureVersion.content}->'sections') as s(section), jsonb_array_elements(s.section->'steps'))`,
    })
    .from(procedureVersion)
    .leftJoin(user, eq(user.id, procedureVersion.authorId))
    .leftJoin(publisher, eq(publisher.id, procedureVersion.publisherId))
    .where(and(eq(procedureVersion.procedureId, procedureId), eq(procedureVersion.shopId, shopId)))
    .orderBy(desc(procedureVersion.number))
    .limit(paging.pageSize)
    .offset((paging.page - 1) * paging.pageSize);
  // Every version's number and state, newest first: small, and what the compare and status controls need.
  const all = await db()
    .select({ number: procedureVersion.number, status: procedureVersion.status })
    .from(procedureVersion)
    .where(and(eq(procedureVersion.procedureId, procedureId), eq(procedureVersion.shopId, shopId)))
    .orderBy(desc(procedureVersion.number));
  return { ...row, versions: versions as VersionMeta[], versionTotal: all.length, allVersions: all as VersionSummary[] };
}

const versionColumns = {
  id: procedureVersion.id,
  procedureId: procedureVersion.procedureId,
  number: procedureVersion.number,
  status: procedureVersion.status,
  title: procedureVersion.title,
  scope: procedureVersion.scope,
  code: procedureVersion.code,
  content: procedureVersion.content,
  changeNote: procedureVersion.changeNote,
  contentHash: procedureVersion.contentHash,
  authorName: user.name,
  publisherName: publisher.name,
  createdAt: procedureVersion.createdAt,
  updatedAt: procedureVersion.updatedAt,
  publishedAt: procedureVersion.publishedAt,
  retiredAt: procedureVersion.retiredAt,
};

export async function getVersion(shopId: string, procedureId: string, number: number): Promise<VersionDetail> {
  const [row] = await db()
    .select(versionColumns)
    .from(procedureVersion)
    .leftJoin(user, eq(user.id, procedureVersion.authorId))
    .leftJoin(publisher, eq(publisher.id, procedureVersion.publisherId))
    .where(and(eq(procedureVersion.procedureId, procedureId), eq(procedureVersion.shopId, shopId), eq(procedureVersion.number, number)));
  if (!row) throw new AppError("not_found", `Version ${number} of this procedure not found.`);
  return row as VersionDetail;
}

// --- Writing ------------------------------------------------------------------------------------------

type Tx = Parameters<Parameters<ReturnType<typeof db>["transaction"]>[0]>[0];

// The database rules are the last word; their refusals become 409s, never 500s.
function guarded<T>(run: () => Promise<T>): Promise<T> {
  return withDatabaseRefusals(run, ({ code, constraint }) => {
    if (code === "23001") return new AppError("conflict", "Published and retired versions never change; start a new version instead.");
    if (code === "23505" && constraint === "procedure_version_one_draft_idx") return new AppError("conflict", "This procedure already has a draft: finish or discard it first.");
    if (code === "23505" && constraint === "procedure_version_number_idx") return new AppError("conflict", "Someone created a version at the same moment; reload and try again.");
    return undefined;
  });
}

async function lockProcedure(tx: Tx, shopId: string, procedureId: string) {
  const [row] = await tx
    .select({ id: procedure.id, title: procedure.title })
    .from(procedure)
    .where(and(eq(procedure.id, procedureId), eq(procedure.shopId, shopId)))
    .for("update");
  if (!row) throw new AppError("not_found", "Procedure not found.");
  return row;
}

async function lockVersion(tx: Tx, shopId: string, procedureId: string, number: number) {
  const [row] = await tx
    .select({
      id: procedureVersion.id,
      status: procedureVersion.status,
      title: procedureVersion.title,
      scope: procedureVersion.scope,
      code: procedureVersion.code,
      content: procedureVersion.content,
    })
    .from(procedureVersion)
    .where(and(eq(procedureVersion.procedureId, procedureId), eq(procedureVersion.shopId, shopId), eq(procedureVersion.number, number)))
    .for("update");
  if (!row) throw new AppError("not_found", `Version ${number} of this procedure not found.`);
  return row;
}

function refuseUnlessDraft(status: VersionStatus, number: number) {
  if (status !== "draft") {
    throw new AppError("conflict", `Version ${number} is ${status}: it never changes. Start a new version to make changes.`, undefined, { status });
  }
}

async function everPublished(tx: Tx, procedureId: string) {
  const [row] = await tx
    .select({ n: count() })
    .from(procedureVersion)
    .where(and(eq(procedureVersion.procedureId, procedureId), ne(procedureVersion.status, "draft")));
  return (row?.n ?? 0) > 0;
}

function contentFields(issues: readonly { path: PropertyKey[]; message: string }[]): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of issues) (fields[["content", ...issue.path].map(String).join(".")] ??= []).push(issue.message);
  return fields;
}

// A step removed or its joint renamed takes its marker with it, so an edit never strands the weld map.
function withoutStrayMarkers(content: VersionContent): VersionContent {
  if (!content.weldMap) return content;
  return { ...content, weldMap: pruneWeldMap(content.weldMap, weldJointIds(content)) };
}

function validContent(content: unknown): VersionContent {
  const parsed = versionContentSchema.safeParse(content);
  if (!parsed.success) throw new AppError("bad_request", parsed.error.issues[0]?.message ?? "The steps are not valid.", contentFields(parsed.error.issues));
  return parsed.data;
}

async function logActivity(tx: Tx, shopId: string, actorId: string, action: string, detail: Record<string, unknown>) {
  await tx.insert(shopActivity).values({ shopId, actorId, action, detail });
}

export async function createProcedure(args: {
  shopId: string;
  actorId: string;
  title: string;
  scope: string;
  code: string;
  content?: VersionContent;
  via?: "form" | "import" | "template";
}) {
  const content = validContent(args.content ?? { sections: [{ key: "preparation", title: "Preparation", steps: [] }] });
  return guarded(() =>
    db().transaction(async (tx) => {
      const [p] = await tx
        .insert(procedure)
        .values({ shopId: args.shopId, title: args.title, scope: args.scope, code: args.code, ownerId: args.actorId })
        .returning({ id: procedure.id });
      await tx.insert(procedureVersion).values({
        shopId: args.shopId,
        procedureId: p!.id,
        number: 1,
        status: "draft",
        title: args.title,
        scope: args.scope,
        code: args.code,
        content,
        authorId: args.actorId,
      });
      await logActivity(tx, args.shopId, args.actorId, args.via === "import" ? "procedure.imported" : "procedure.created", { procedureId: p!.id, title: args.title });
      return { id: p!.id, number: 1 };
    }),
  );
}

type DraftChange = { title?: string; scope?: string; code?: string; content?: VersionContent };

// Changes a draft under a row lock, so edits from two screens apply one after the other and none is lost.
export async function changeDraft(
  args: { shopId: string; procedureId: string; number: number },
  change: (current: VersionBody) => DraftChange,
): Promise<VersionBody> {
  return guarded(() =>
    db().transaction(async (tx) => {
      const v = await lockVersion(tx, args.shopId, args.procedureId, args.number);
      refuseUnlessDraft(v.status, args.number);
      const current: VersionBody = { title: v.title, scope: v.scope, code: v.code, content: v.content };
      const patch = change(current);
      const next: VersionBody = {
        title: patch.title ?? current.title,
        scope: patch.scope ?? current.scope,
        code: patch.code ?? current.code,
        content: patch.content ? validContent(withoutStrayMarkers(patch.content)) : current.content,
      };
      await tx
        .update(procedureVersion)
        .set({ ...next, updatedAt: new Date() })
        .where(and(eq(procedureVersion.id, v.id), eq(procedureVersion.status, "draft")));
      // Until it is first published, the procedure is known by its draft's name.
      if ((patch.title !== undefined || patch.scope !== undefined || patch.code !== undefined) && !(await everPublished(tx, args.procedureId))) {
        await tx
          .update(procedure)
          .set({ title: next.title, scope: next.scope, code: next.code })
          .where(and(eq(procedure.id, args.procedureId), eq(procedure.shopId, args.shopId)));
      }
      return next;
    }),
  );
}

export async function publishVersion(args: { shopId: string; procedureId: string; number: number; actorId: string; changeNote: string; retirePrevious: boolean }) {
  return guarded(() =>
    db().transaction(async (tx) => {
      await lockProcedure(tx, args.shopId, args.procedureId);
      const v = await lockVersion(tx, args.shopId, args.procedureId, args.number);
      if (v.status !== "draft") throw new AppError("conflict", `Version ${args.number} is already ${v.status}.`, undefined, { status: v.status });
      const body: VersionBody = { title: v.title, scope: v.scope, code: v.code, content: validContent(v.content) };
      const { blockers } = publishReadiness(body);
      if (blockers.length) {
        throw new AppError("unprocessable", `Not ready to publish: ${blockers[0]!.message}`, { _: blockers.map((b) => b.message) }, { blockers });
      }
      const hash = versionHash(body);
      const now = new Date();
      await tx
        .update(procedureVersion)
        .set({ status: "published", contentHash: hash, changeNote: args.changeNote, publisherId: args.actorId, publishedAt: now, updatedAt: now })
        .where(and(eq(procedureVersion.id, v.id), eq(procedureVersion.status, "draft")));
      let retired: number[] = [];
      if (args.retirePrevious) {
        const rows = await tx
          .update(procedureVersion)
          .set({ status: "retired", retiredAt: now })
          .where(and(eq(procedureVersion.procedureId, args.procedureId), eq(procedureVersion.shopId, args.shopId), eq(procedureVersion.status, "published"), ne(procedureVersion.id, v.id)))
          .returning({ number: procedureVersion.number });
        retired = rows.map((r) => r.number).sort((a, b) => a - b);
      }
      await tx
        .update(procedure)
        .set({ title: body.title, scope: body.scope, code: body.code })
        .where(and(eq(procedure.id, args.procedureId), eq(procedure.shopId, args.shopId)));
      await logActivity(tx, args.shopId, args.actorId, "procedure.published", { procedureId: args.procedureId, title: body.title, number: args.number, contentHash: hash, retired });
      return { number: args.number, contentHash: hash, publishedAt: now, retired };
    }),
  );
}

export async function retireVersion(args: { shopId: string; procedureId: string; number: number; actorId: string }) {
  return guarded(() =>
    db().transaction(async (tx) => {
      const v = await lockVersion(tx, args.shopId, args.procedureId, args.number);
      if (v.status === "draft") throw new AppError("conflict", "A draft is discarded, not retired.", undefined, { status: v.status });
      if (v.status === "retired") throw new AppError("conflict", `Version ${args.number} is already retired.`, undefined, { status: v.status });
      const now = new Date();
      await tx
        .update(procedureVersion)
        .set({ status: "retired", retiredAt: now })
        .where(and(eq(procedureVersion.id, v.id), eq(procedureVersion.status, "published")));
      await logActivity(tx, args.shopId, args.actorId, "procedure.retired", { procedureId: args.procedureId, title: v.title, number: args.number });
      return { number: args.number, retiredAt: now };
    }),
  );
}

// A new version starts as a draft copy of the latest one, whatever its state.
export async function startNewVersion(args: { shopId: string; procedureId: string; actorId: string }) {
  return guarded(() =>
    db().transaction(async (tx) => {
      await lockProcedure(tx, args.shopId, args.procedureId);
      const [latest] = await tx
        .select({ number: procedureVersion.number, status: procedureVersion.status, title: procedureVersion.title, scope: procedureVersion.scope, code: procedureVersion.code, content: procedureVersion.content })
        .from(procedureVersion)
        .where(and(eq(procedureVersion.procedureId, args.procedureId), eq(procedureVersion.shopId, args.shopId)))
        .orderBy(desc(procedureVersion.number))
        .limit(1);
      if (!latest) throw new AppError("not_found", "Procedure not found.");
      if (latest.status === "draft") throw new AppError("conflict", `Version ${latest.number} is still a draft: finish or discard it first.`, undefined, { draft: latest.number });
      const number = latest.number + 1;
      await tx.insert(procedureVersion).values({
        shopId: args.shopId,
        procedureId: args.procedureId,
        number,
        status: "draft",
        title: latest.title,
        scope: latest.scope,
        code: latest.code,
        content: latest.content,
        authorId: args.actorId,
      });
      await logActivity(tx, args.shopId, args.actorId, "procedure.version_started", { procedureId: args.procedureId, title: latest.title, number, from: latest.number });
      return { number, from: latest.number };
    }),
  );
}

export async function discardDraft(args: { shopId: string; procedureId: string; number: number; actorId: string }) {
  return guarded(() =>
    db().transaction(async (tx) => {
      await lockProcedure(tx, args.shopId, args.procedureId);
      const v = await lockVersion(tx, args.shopId, args.procedureId, args.number);
      refuseUnlessDraft(v.status, args.number);
      await tx.delete(procedureVersion).where(and(eq(procedureVersion.id, v.id), eq(procedureVersion.status, "draft")));
      const [left] = await tx.select({ n: count() }).from(procedureVersion).where(eq(procedureVersion.procedureId, args.procedureId));
      const procedureDeleted = (left?.n ?? 0) === 0;
      // Images of a procedure that never had a sealed version go with it.
      if (procedureDeleted) await tx.delete(procedureImage).where(and(eq(procedureImage.procedureId, args.procedureId), eq(procedureImage.shopId, args.shopId)));
      if (procedureDeleted) await tx.delete(procedure).where(and(eq(procedure.id, args.procedureId), eq(procedure.shopId, args.shopId)));
      await logActivity(tx, args.shopId, args.actorId, "procedure.draft_discarded", { procedureId: args.procedureId, title: v.title, number: args.number, procedureDeleted });
      return { procedureDeleted };
    }),
  );
}
