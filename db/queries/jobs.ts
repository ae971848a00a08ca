import "server-only";
// Jobs: the list (paged, searched and sorted by the database), creation with its materialised checklist,
// header edits, release and void, the activity log and the desks' "waiting for you" lists.
import { and, asc, desc, eq, gte, inArray, lte, ne, notInArray, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { job, jobActivity, jobAssignment, jobCounter, jobStep, membership, procedure, procedureVersion, user } from "@/db/schema";
import { verifySigningPin } from "@/db/queries/people";
import type { ShopContext } from "@/lib/auth/context";
import { db } from "@/lib/db";
import { AppError } from "@/lib/errors";
import { releaseContent } from "@/lib/jobs/content";
import { materialsInUse } from "@/lib/jobs/materials";
import { contentHash } from "@/lib/jobs/hash";
import { formatJobNumber } from "@/lib/jobs/number";
import type { JobListRow, JobRecord } from "@/lib/jobs/record";
import type { CreateJobInput, ListJobsQuery, UpdateJobInput } from "@/lib/jobs/schemas";
import { vinForJob } from "@/lib/jobs/vin";
import { versionContentSchema } from "@/lib/procedures/schema";
import { jobMapFromProcedure, sealedWeldMap } from "@/lib/weld-map";
import { appendSignOff, assertJobOpen, guarded, loadRecord, logActivity, type Exec } from "./jobs-core";

const STATUS_ORDER = sql`case ${job.status} when 'on_hold' then 0 when 'in_progress' then 1 when 'planned' then 2 when 'ready_for_release' then 3 when 'released' then 4 else 5 end`;

function escapeLike(q: string) {
  return q.replace(/[%_\\]/g, (c) => `\\${c}`);
}

export async function listJobs(shopId: string, q: ListJobsQuery, viewerId: string): Promise<{ rows: JobListRow[]; total: number }> {
  const filters: SQL[] = [eq(job.shopId, shopId)];
  if (q.q) {
    // Job number, VIN, axle tag and customer (the stored search text), or the name of a person on the job.
    const like = `%${escapeLike(q.q.toLowerCase())}%`;
    filters.push(
      sql`(${job.searchText} like ${like} or exists (select 1 from ${jobAssignment} inner join ${user} on ${user.id} = ${jobAssignment.userId} where ${jobAssignment.jobId} = ${job.id} and lower(${user.name}) like ${like}))`,
    );
  }
  if (q.status === "open") filters.push(notInArray(job.status, ["released", "void"]));
  else if (q.status) filters.push(eq(job.status, q.status));
  if (q.assignee) {
    const who = q.assignee === "me" ? viewerId : q.assignee;
    filters.push(sql`exists (select 1 from ${jobAssignment} where ${jobAssignment.jobId} = ${job.id} and ${jobAssignment.userId} = ${who})`);
  }
  if (q.needs === "geometry") filters.push(sql`exists (select 1 from ${jobStep} where ${jobStep.jobId} = ${job.id} and ${jobStep.kind} = 'geometry' and ${jobStep.signedAt} is null)`);
  if (q.dueFrom) filters.push(gte(job.dueDate, q.dueFrom));
  if (q.dueTo) filters.push(lte(job.dueDate, q.dueTo));
  const where = and(...filters);
  const dir = q.dir === "asc" ? asc : desc;
  const order: SQL[] = (() => {
    switch (q.sort) {
      case "due":
        return [sql`${job.dueDate} ${sql.raw(q.dir === "asc" ? "asc" : "desc")} nulls last`, dir(job.year), dir(job.seq)];
      case "customer":
        return [dir(sql`lower(${job.customerName})`), desc(job.year), desc(job.seq)];
      case "status":
        return [dir(STATUS_ORDER), desc(job.year), desc(job.seq)];
      case "progress":
        return [dir(sql`${job.stepsSigned}::float / nullif(${job.stepsTotal}, 0)`), desc(job.year), desc(job.seq)];
      case "updated":
        return [dir(job.updatedAt)];
      default:
        return [dir(job.year), dir(job.seq)];
    }
  })();
  const [rows, [count]] = await Promise.all([
    db()
      .select({
        id: job.id,
        number: job.number,
        status: job.status,
        customerName: job.customerName,
        vehicleYear: job.vehicleYear,
        vehicleMakeModel: job.vehicleMakeModel,
        vin: job.vin,
        vinWarning: job.vinWarning,
        axleTag: job.axleTag,
        procedureTitle: job.procedureTitle,
        procedureVersionNumber: job.procedureVersionNumber,
        dueDate: job.dueDate,
        stepsTotal: job.stepsTotal,
        stepsSigned: job.stepsSigned,
        openNonconformances: job.openNonconformances,
        updatedAt: job.updatedAt,
      })
      .from(job)
      .where(where)
      .orderBy(...order)
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize),
    db().select({ n: sql<number>`count(*)::int` }).from(job).where(where),
  ]);
  const ids = rows.map((r) => r.id);
  const welders = ids.length
    ? await db()
        .select({ jobId: jobAssignment.jobId, name: user.name })
        .from(jobAssignment)
        .innerJoin(user, eq(user.id, jobAssignment.userId))
        .where(and(inArray(jobAssignment.jobId, ids), eq(jobAssignment.role, "welder")))
        .orderBy(asc(user.name))
    : [];
  return {
    total: count?.n ?? 0,
    rows: rows.map((r) => ({
      id: r.id,
      number: r.number,
      status: r.status,
      customerName: r.customerName,
      vehicle: [r.vehicleYear, r.vehicleMakeModel].filter(Boolean).join(" "),
      vin: r.vin,
      vinWarning: r.vinWarning !== null,
      axleTag: r.axleTag,
      procedure: `${r.procedureTitle} v${r.procedureVersionNumber}`,
      dueDate: r.dueDate,
      stepsTotal: r.stepsTotal,
      stepsSigned: r.stepsSigned,
      openNonconformances: r.openNonconformances,
      welders: welders.filter((w) => w.jobId === r.id).map((w) => w.name),
      updatedAt: r.updatedAt.toISOString(),
    })),
  };
}

export type JobFormOptions = {
  versions: { id: string; title: string; number: number; publishedAt: string | null; steps: number }[];
  welders: { id: string; name: string }[];
  inspectors: { id: string; name: string }[];
};

export async function jobFormOptions(shopId: string): Promise<JobFormOptions> {
  const [versions, people] = await Promise.all([
    db()
      .select({
        id: procedureVersion.id,
        title: sql<string>`coalesce(nullif(${procedureVersion.title}, ''), ${procedure.title})`,
        number: procedureVersion.number,
        publishedAt: procedureVersion.publishedAt,
        steps: sql<number>`(select coalesce(sum(jsonb_array_length(s -> 'steps')), 0)::int from jsonb_array_elements(${procedureVersion.content} -> 'sections') s)`,
      })
      .from(procedureVersion)
      .innerJoin(procedure, eq(procedure.id, procedureVersion.procedureId))
      .where(and(eq(procedureVersion.shopId, shopId), eq(procedureVersion.status, "published")))
      .orderBy(asc(procedure.title), desc(procedureVersion.number))
      .limit(200),
    db()
      .select({ id: user.id, name: user.name, roles: membership.roles })
      .from(membership)
      .innerJoin(user, eq(user.id, membership.userId))
      .where(and(eq(membership.shopId, shopId), eq(membership.active, true)))
      .orderBy(asc(user.name)),
  ]);
  return {
    versions: versions.map((v) => ({ ...v, publishedAt: v.publishedAt?.toISOString() ?? null })),
    welders: people.filter((p) => p.roles.includes("welder")).map(({ id, name }) => ({ id, name })),
    inspectors: people.filter((p) => p.roles.includes("inspector")).map(({ id, name }) => ({ id, name })),
  };
}

async function assertAssignees(x: Exec, shopId: string, welderIds: string[], inspectorId: string | undefined) {
  const wanted = [...new Set([...welderIds, ...(inspectorId ? [inspectorId] : [])])];
  if (!wanted.length) return;
  const rows = await x
    .select({ userId: membership.userId, roles: membership.roles })
    .from(membership)
    .where(and(eq(membership.shopId, shopId), eq(membership.active, true), inArray(membership.userId, wanted)));
  const fields: Record<string, string[]> = {};
  for (const w of welderIds) if (!rows.some((r) => r.userId === w && r.roles.includes("welder"))) fields.welderIds = ["Choose active welders of this shop."];
  if (inspectorId && !rows.some((r) => r.userId === inspectorId && r.roles.includes("inspector"))) fields.inspectorId = ["Choose an active inspector of this shop."];
  if (Object.keys(fields).length) throw new AppError("bad_request", "Some assignees are not right.", fields);
}

async function setAssignees(x: Exec, shopId: string, jobId: string, welderIds: string[], inspectorId: string | undefined) {
  await x.delete(jobAssignment).where(and(eq(jobAssignment.jobId, jobId), eq(jobAssignment.shopId, shopId)));
  const rows = [
    ...[...new Set(welderIds)].map((userId) => ({ jobId, shopId, userId, role: "welder" as const })),
    ...(inspectorId ? [{ jobId, shopId, userId: inspectorId, role: "inspector" as const }] : []),
  ];
  if (rows.length) await x.insert(jobAssignment).values(rows);
}

/** A new job: next number of the shop's year, the pinned version's checklist copied into job_step rows. */
export async function createJob(ctx: ShopContext, input: CreateJobInput) {
  const [version] = await db()
    .select({
      id: procedureVersion.id,
      procedureId: procedureVersion.procedureId,
      number: procedureVersion.number,
      status: procedureVersion.status,
      content: procedureVersion.content,
      title: sql<string>`coalesce(nullif(${procedureVersion.title}, ''), ${procedure.title})`,
    })
    .from(procedureVersion)
    .innerJoin(procedure, eq(procedure.id, procedureVersion.procedureId))
    .where(and(eq(procedureVersion.id, input.procedureVersionId), eq(procedureVersion.shopId, ctx.shopId)));
  if (!version) throw new AppError("bad_request", "Choose a published procedure version of this shop.", { procedureVersionId: ["Not found."] });
  if (version.status !== "published") {
    throw new AppError("unprocessable", `Version ${version.number} of "${version.title}" is ${version.status}; jobs pin published versions only.`, {
      procedureVersionId: ["Choose a published version."],
    });
  }
  const content = versionContentSchema.safeParse(version.content);
  if (!content.success) throw new AppError("unprocessable", "That procedure version's content cannot be read as a checklist.");
  const steps = content.data.sections.flatMap((section, si) => section.steps.map((step) => ({ section, si, step })));
  if (steps.length === 0) throw new AppError("unprocessable", "That procedure version has no steps.", { procedureVersionId: ["It has no steps."] });
  const vin = vinForJob(input.vin);
  const year = new Date().getUTCFullYear();

  const created = await db().transaction(async (tx) => {
    await assertAssignees(tx, ctx.shopId, input.welderIds, input.inspectorId);
    const [counter] = await tx
      .insert(jobCounter)
      .values({ shopId: ctx.shopId, year, last: 1 })
      .onConflictDoUpdate({ target: [jobCounter.shopId, jobCounter.year], set: { last: sql`${jobCounter.last} + 1` } })
      .returning({ last: jobCounter.last });
    const seq = counter!.last;
    const number = formatJobNumber(year, seq);
    const [row] = await tx
      .insert(job)
      .values({
        shopId: ctx.shopId,
        number,
        year,
        seq,
        customerName: input.customerName,
        customerPhone: input.customerPhone,
        customerEmail: input.customerEmail,
        vehicleYear: input.vehicleYear ?? null,
        vehicleMakeModel: input.vehicleMakeModel,
        vin: vin.vin,
        vinWarning: vin.warning,
        axleDescription: input.axleDescription,
        axleTag: input.axleTag,
        procedureId: version.procedureId,
        procedureVersionId: version.id,
        procedureVersionNumber: version.number,
        procedureTitle: version.title,
        dueDate: input.dueDate ?? null,
        notes: input.notes,
        weldMap: jobMapFromProcedure(content.data.weldMap),
        stepsTotal: steps.length,
        createdBy: ctx.userId,
      })
      .returning({ id: job.id });
    const jobId = row!.id;
    await tx.insert(jobStep).values(
      steps.map(({ section, si, step }, i) => ({
        shopId: ctx.shopId,
        jobId,
        position: i + 1,
        sectionKey: section.key,
        sectionTitle: section.title,
        sectionPosition: si + 1,
        stepKey: step.key,
        kind: step.kind,
        title: step.title,
        spec: step,
      })),
    );
    await setAssignees(tx, ctx.shopId, jobId, input.welderIds, input.inspectorId);
    await logActivity(tx, {
      shopId: ctx.shopId,
      jobId,
      actorId: ctx.userId,
      action: "job.created",
      detail: { number, procedure: version.title, version: version.number, steps: steps.length, vinWarning: vin.warning },
    });
    return { id: jobId, number };
  });
  return { ...created, vinWarning: vin.warning, checkDigitOk: vin.checkDigitOk };
}

export async function updateJob(ctx: ShopContext, jobId: string, patch: UpdateJobInput) {
  return db().transaction(async (tx) => {
    const record = await loadRecord(tx, ctx, jobId, { lock: true });
    assertJobOpen(record);
    if (record.job.version !== patch.baseVersion) {
      throw new AppError("conflict", `Someone changed ${record.job.number} while you were editing. Their version is shown; check it and save again.`, undefined, {
        current: record.job,
      });
    }
    const vin = patch.vin !== undefined ? vinForJob(patch.vin) : null;
    if (patch.welderIds !== undefined || patch.inspectorId !== undefined) {
      const welders = patch.welderIds ?? record.job.welders.map((w) => w.id);
      const inspector = patch.inspectorId === null ? undefined : (patch.inspectorId ?? record.job.inspector?.id);
      await assertAssignees(tx, ctx.shopId, welders, inspector);
      await setAssignees(tx, ctx.shopId, jobId, welders, inspector);
    }
    const set = {
      ...(patch.customerName !== undefined ? { customerName: patch.customerName } : {}),
      ...(patch.customerPhone !== undefined ? { customerPhone: patch.customerPhone } : {}),
      ...(patch.customerEmail !== undefined ? { customerEmail: patch.customerEmail } : {}),
      ...(patch.vehicleYear !== undefined ? { vehicleYear: patch.vehicleYear } : {}),
      ...(patch.vehicleMakeModel !== undefined ? { vehicleMakeModel: patch.vehicleMakeModel } : {}),
      ...(vin ? { vin: vin.vin, vinWarning: vin.warning } : {}),
      ...(patch.axleDescription !== undefined ? { axleDescription: patch.axleDescription } : {}),
      ...(patch.axleTag !== undefined ? { axleTag: patch.axleTag } : {}),
      ...(patch.dueDate !== undefined ? { dueDate: patch.dueDate } : {}),
      ...(patch.notes !== undefined ? { notes: patch.notes } : {}),
    };
    await tx
      .update(job)
      .set({ ...set, version: sql`${job.version} + 1`, updatedAt: new Date() })
      .where(and(eq(job.id, jobId), eq(job.shopId, ctx.shopId)));
    const { baseVersion: _b, ...changed } = patch;
    await logActivity(tx, { shopId: ctx.shopId, jobId, actorId: ctx.userId, action: "job.updated", detail: { fields: Object.keys(changed) } });
    return loadRecord(tx, ctx, jobId);
  });
}

export async function releaseJob(ctx: ShopContext, jobId: string, pin: string): Promise<JobRecord> {
  const before = await loadRecord(db(), ctx, jobId);
  assertJobOpen(before);
  if (before.releaseBlockers.length) throw new AppError("conflict", `${before.job.number} cannot be released yet: ${before.releaseBlockers.join(" ")}`, undefined, { blockers: before.releaseBlockers });
  await verifySigningPin({ shopId: ctx.shopId, userId: ctx.userId, pin });
  return guarded(
    () =>
      db().transaction(async (tx) => {
        const record = await loadRecord(tx, ctx, jobId, { lock: true });
        assertJobOpen(record);
        if (record.releaseBlockers.length) throw new AppError("conflict", `${record.job.number} cannot be released yet: ${record.releaseBlockers.join(" ")}`);
        const content = releaseContent({
          job: { id: record.job.id, number: record.job.number },
          procedure: { versionId: record.job.procedureVersionId, number: record.job.procedureVersionNumber },
          steps: record.steps.map((s) => ({ key: s.key, signOff: s.signOffs.at(-1)?.contentHash ?? null })),
          nonconformances: record.nonconformances.map((n) => ({ number: n.number, disposition: n.disposition?.disposition ?? null })),
          materials: materialsInUse(record.materials),
          weldMap: sealedWeldMap(record.weldMap),
        });
        const so = await appendSignOff(tx, {
          shopId: ctx.shopId,
          jobId,
          userId: ctx.userId,
          printedName: ctx.legalName,
          role: "lead",
          meaning: "released",
          content,
          contentHash: contentHash(content),
        });
        await tx
          .update(job)
          .set({ status: "released", releasedAt: so.signedAt, releasedBy: ctx.userId, updatedAt: new Date() })
          .where(and(eq(job.id, jobId), eq(job.shopId, ctx.shopId)));
        await logActivity(tx, { shopId: ctx.shopId, jobId, actorId: ctx.userId, action: "job.released", detail: { signOffId: so.id, from: record.job.status } });
        return loadRecord(tx, ctx, jobId);
      }),
    "Someone released this job a moment ago.",
  );
}

export async function voidJob(ctx: ShopContext, jobId: string, reason: string): Promise<JobRecord> {
  return db().transaction(async (tx) => {
    const record = await loadRecord(tx, ctx, jobId, { lock: true });
    assertJobOpen(record);
    await tx
      .update(job)
      .set({ status: "void", voidReason: reason, voidedAt: new Date(), voidedBy: ctx.userId, updatedAt: new Date() })
      .where(and(eq(job.id, jobId), eq(job.shopId, ctx.shopId)));
    await logActivity(tx, { shopId: ctx.shopId, jobId, actorId: ctx.userId, action: "job.voided", detail: { reason, from: record.job.status } });
    return loadRecord(tx, ctx, jobId);
  });
}

export type ActivityRow = { id: string; action: string; detail: Record<string, unknown>; at: string; actorName: string | null; stepTitle: string | null };

export async function jobActivityPage(shopId: string, jobId: string, page: number, pageSize = 50): Promise<{ rows: ActivityRow[]; total: number }> {
  const owner = await db().select({ id: job.id }).from(job).where(and(eq(job.id, jobId), eq(job.shopId, shopId)));
  if (!owner.length) throw new AppError("not_found", "Job not found.");
  const [rows, [count]] = await Promise.all([
    db()
      .select({ id: jobActivity.id, action: jobActivity.action, detail: jobActivity.detail, at: jobActivity.at, actorName: user.name, stepTitle: jobStep.title })
      .from(jobActivity)
      .leftJoin(user, eq(user.id, jobActivity.actorId))
      .leftJoin(jobStep, eq(jobStep.id, jobActivity.stepId))
      .where(and(eq(jobActivity.jobId, jobId), eq(jobActivity.shopId, shopId)))
      .orderBy(desc(jobActivity.at), desc(jobActivity.id))
      .limit(pageSize)
      .offset((page - 1) * pageSize),
    db().select({ n: sql<number>`count(*)::int` }).from(jobActivity).where(and(eq(jobActivity.jobId, jobId), eq(jobActivity.shopId, shopId))),
  ]);
  return { rows: rows.map((r) => ({ ...r, at: r.at.toISOString() })), total: count?.n ?? 0 };
}

export type DeskJob = { id: string; number: string; status: JobRecord["job"]["status"]; customerName: string; vehicle: string; axleTag: string; dueDate: string | null; stepsTotal: number; stepsSigned: number; openNonconformances: number };

const deskColumns = {
  id: job.id,
  number: job.number,
  status: job.status,
  customerName: job.customerName,
  vehicleYear: job.vehicleYear,
  vehicleMakeModel: job.vehicleMakeModel,
  axleTag: job.axleTag,
  dueDate: job.dueDate,
  stepsTotal: job.stepsTotal,
  stepsSigned: job.stepsSigned,
  openNonconformances: job.openNonconformances,
};

function toDesk(r: { vehicleYear: number | null; vehicleMakeModel: string } & Omit<DeskJob, "vehicle">): DeskJob {
  const { vehicleYear, vehicleMakeModel, ...rest } = r;
  return { ...rest, vehicle: [vehicleYear, vehicleMakeModel].filter(Boolean).join(" ") };
}

/** A welder's open jobs, soonest due first. */
export async function jobsAssignedTo(shopId: string, userId: string, limit = 20): Promise<DeskJob[]> {
  const rows = await db()
    .select(deskColumns)
    .from(job)
    .innerJoin(jobAssignment, and(eq(jobAssignment.jobId, job.id), eq(jobAssignment.userId, userId), eq(jobAssignment.role, "welder")))
    .where(and(eq(job.shopId, shopId), notInArray(job.status, ["released", "void"])))
    .orderBy(sql`${job.dueDate} asc nulls last`, asc(job.seq))
    .limit(limit);
  return rows.map(toDesk);
}

export type WaitingHold = DeskJob & { holdStepId: string; holdTitle: string; mine: boolean };

/** Jobs on hold whose first unsigned step is a hold point: an inspector's queue. */
export async function holdPointsWaiting(shopId: string, inspectorId: string, limit = 30): Promise<WaitingHold[]> {
  const first = alias(jobStep, "first_open");
  const rows = await db()
    .select({
      ...deskColumns,
      holdStepId: first.id,
      holdTitle: first.title,
      mine: sql<boolean>`exists (select 1 from ${jobAssignment} where ${jobAssignment.jobId} = ${job.id} and ${jobAssignment.userId} = ${inspectorId} and ${jobAssignment.role} = 'inspector')`,
    })
    .from(job)
    .innerJoin(
      first,
      sql`${first.id} = (select s.id from ${jobStep} s where s.job_id = ${job.id} and s.signed_at is null order by s.position limit 1)`,
    )
    .where(and(eq(job.shopId, shopId), eq(job.status, "on_hold"), eq(first.kind, "hold")))
    .orderBy(sql`${job.dueDate} asc nulls last`, asc(job.seq))
    .limit(limit);
  return rows.map((r) => {
    const { holdStepId, holdTitle, mine, ...rest } = r;
    return { ...toDesk(rest), holdStepId, holdTitle, mine };
  });
}

/** Nonconformances waiting for a disposition (not the asker's own). */
export async function nonconformancesWaiting(shopId: string, userId: string, limit = 30) {
  const rows = await db().execute<{ id: string; number: number; description: string; job_id: string; job_number: string; step_title: string; raised_at: Date; raised_by_name: string }>(sql`
    select nc.id, nc.number, nc.description, j.id as job_id, j.number as job_number, s.title as step_title, nc.raised_at, u.name as raised_by_name
    from nonconformance nc
    join job j on j.id = nc.job_id
    join job_step s on s.id = nc.step_id
    join "user" u on u.id = nc.raised_by
    where nc.shop_id = ${shopId} and nc.raised_by <> ${userId} and j.status not in ('released', 'void')
      and not exists (select 1 from nonconformance_disposition d where d.nonconformance_id = nc.id)
    order by nc.raised_at
    limit ${limit}`);
  return rows.rows.map((r) => ({ ...r, raised_at: new Date(r.raised_at).toISOString() }));
}

export async function jobCountsByState(shopId: string) {
  const rows = await db()
    .select({ status: job.status, n: sql<number>`count(*)::int` })
    .from(job)
    .where(eq(job.shopId, shopId))
    .groupBy(job.status);
  const counts: Record<string, number> = {};
  for (const r of rows) counts[r.status] = r.n;
  return counts;
}

/** Open jobs due soonest, for the lead's desk. */
export async function jobsDueSoon(shopId: string, limit = 8): Promise<DeskJob[]> {
  const rows = await db()
    .select(deskColumns)
    .from(job)
    .where(and(eq(job.shopId, shopId), notInArray(job.status, ["released", "void"]), ne(job.status, "ready_for_release")))
    .orderBy(sql`${job.dueDate} asc nulls last`, asc(job.seq))
    .limit(limit);
  return rows.map(toDesk);
}

export async function jobsReadyForRelease(shopId: string, limit = 8): Promise<DeskJob[]> {
  const rows = await db().select(deskColumns).from(job).where(and(eq(job.shopId, shopId), eq(job.status, "ready_for_release"))).orderBy(asc(job.updatedAt)).limit(limit);
  return rows.map(toDesk);
}
