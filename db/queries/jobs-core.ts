import "server-only";
// Shared by the job query modules: reading a job's rows (optionally locking the job for a write), the
// activity log, the derived state, and the mapping of database refusals to API errors.
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import type { NodePgQueryResultHKT } from "drizzle-orm/node-postgres";
import { alias, type PgDatabase } from "drizzle-orm/pg-core";
import type * as schemaNs from "@/db/schema";
import {
  job,
  jobActivity,
  jobAssignment,
  jobMaterial,
  jobStep,
  nonconformance,
  nonconformanceDisposition,
  photo,
  signOff,
  user,
  weldInspection,
  weldRepair,
  weldPass,
  weldPassOverride,
  wps,
  wpsRevision,
} from "@/db/schema";
import type { ShopContext } from "@/lib/auth/context";
import { appendToChain } from "@/db/queries/records";
import { db } from "@/lib/db";
import { AppError } from "@/lib/errors";
import { assembleRecord, type JobParts, type Viewer } from "@/lib/jobs/assemble";
import type { JobStateName } from "@/lib/jobs/labels";
import type { JobWeldMap } from "@/lib/weld-map";
import type { InspectionView, RepairView, WeldMapView, JobRecord, MaterialView, NonconformanceView, PassView, PhotoView, QualificationSummary, SignOffView, WpsSummary } from "@/lib/jobs/record";
import { toWpsRanges } from "@/lib/welding/wps-schema";
import { currentQualification, type DbOrTx } from "@/db/queries/qualifications";
import { deriveJobState } from "@/lib/jobs/state";

export type Exec = PgDatabase<NodePgQueryResultHKT, typeof schemaNs>;

const iso = (d: Date | null | undefined) => (d ? d.toISOString() : null);
const isoDate = (d: string | null) => d;

export function viewerOf(ctx: ShopContext): Viewer {
  return { userId: ctx.userId, name: ctx.user.name, roles: [...ctx.roles], unitSystem: ctx.unitSystem };
}

export function photoUrls(id: string) {
  return { url: `/api/photos/${id}`, thumbUrl: `/api/photos/${id}?size=thumb` };
}

/** All rows of one job of this shop, or null (another shop's job is simply not found). */
export async function loadJobParts(x: Exec, shopId: string, jobId: string, opts: { lock?: boolean } = {}): Promise<JobParts | null> {
  const creator = alias(user, "creator");
  const releaser = alias(user, "releaser");
  const base = x
    .select({
      id: job.id,
      number: job.number,
      status: job.status,
      customerName: job.customerName,
      customerPhone: job.customerPhone,
      customerEmail: job.customerEmail,
      vehicleYear: job.vehicleYear,
      vehicleMakeModel: job.vehicleMakeModel,
      vin: job.vin,
      vinWarning: job.vinWarning,
      axleDescription: job.axleDescription,
      axleTag: job.axleTag,
      procedureId: job.procedureId,
      procedureVersionId: job.procedureVersionId,
      procedureVersionNumber: job.procedureVersionNumber,
      procedureTitle: job.procedureTitle,
      dueDate: job.dueDate,
      notes: job.notes,
      version: job.version,
      createdById: job.createdBy,
      createdByName: creator.name,
      createdAt: job.createdAt,
      updatedAt: job.updatedAt,
      startedAt: job.startedAt,
      releasedAt: job.releasedAt,
      releasedById: job.releasedBy,
      releasedByName: releaser.name,
      voidedAt: job.voidedAt,
      voidReason: job.voidReason,
      weldMap: job.weldMap,
    })
    .from(job)
    .innerJoin(creator, eq(creator.id, job.createdBy))
    .leftJoin(releaser, eq(releaser.id, job.releasedBy))
    .where(and(eq(job.id, jobId), eq(job.shopId, shopId)));
  if (opts.lock) {
    // Writes to one job queue behind each other, so state and counters are computed on settled rows.
    const locked = await x.select({ id: job.id }).from(job).where(and(eq(job.id, jobId), eq(job.shopId, shopId))).for("update");
    if (!locked.length) return null;
  }
  const [h] = await base;
  if (!h) return null;

  const updater = alias(user, "updater");
  const [assignees, steps, signOffs, photos, passes, ncs] = await Promise.all([
    x
      .select({ userId: jobAssignment.userId, role: jobAssignment.role, name: user.name })
      .from(jobAssignment)
      .innerJoin(user, eq(user.id, jobAssignment.userId))
      .where(eq(jobAssignment.jobId, jobId))
      .orderBy(asc(user.name)),
    x
      .select({
        id: jobStep.id,
        position: jobStep.position,
        sectionKey: jobStep.sectionKey,
        sectionTitle: jobStep.sectionTitle,
        sectionPosition: jobStep.sectionPosition,
        stepKey: jobStep.stepKey,
        kind: jobStep.kind,
        title: jobStep.title,
        spec: jobStep.spec,
        value: jobStep.value,
        version: jobStep.version,
        updatedAt: jobStep.updatedAt,
        updatedById: jobStep.updatedBy,
        updatedByName: updater.name,
        signedAt: jobStep.signedAt,
      })
      .from(jobStep)
      .leftJoin(updater, eq(updater.id, jobStep.updatedBy))
      .where(eq(jobStep.jobId, jobId))
      .orderBy(asc(jobStep.position)),
    x
      .select({
        id: signOff.id,
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
        value: sql<Record<string, unknown> | null>`${signOff.content} -> 'value'`,
      })
      .from(signOff)
      .where(eq(signOff.jobId, jobId))
      .orderBy(asc(signOff.signedAt), asc(signOff.id)),
    x
      .select({
        id: photo.id,
        stepId: photo.stepId,
        nonconformanceId: photo.nonconformanceId,
        sha256: photo.sha256,
        width: photo.width,
        height: photo.height,
        size: photo.size,
        caption: photo.caption,
        uploadedAt: photo.uploadedAt,
        uploadedById: photo.uploadedBy,
        uploadedByName: user.name,
        removedAt: photo.removedAt,
      })
      .from(photo)
      .innerJoin(user, eq(user.id, photo.uploadedBy))
      .where(eq(photo.jobId, jobId))
      .orderBy(asc(photo.uploadedAt), asc(photo.id)),
    x
      .select({
        id: weldPass.id,
        stepId: weldPass.stepId,
        passNumber: weldPass.passNumber,
        welderId: weldPass.welderId,
        welderName: user.name,
        process: weldPass.process,
        volts: weldPass.volts,
        amps: weldPass.amps,
        travelSpeedMmPerMin: weldPass.travelSpeedMmPerMin,
        travelSpeedUnit: weldPass.travelSpeedUnit,
        preheatC: weldPass.preheatC,
        interpassC: weldPass.interpassC,
        fillerLot: weldPass.fillerLot,
        arcEnergyKJPerMm: weldPass.arcEnergyKJPerMm,
        heatInputKJPerMm: weldPass.heatInputKJPerMm,
        recordedAt: weldPass.recordedAt,
        removedAt: weldPass.removedAt,
        round: weldPass.round,
        position: weldPass.position,
        fillerClassification: weldPass.fillerClassification,
        wpsRevisionId: weldPass.wpsRevisionId,
        wpsReference: weldPass.wpsReference,
        wpsRevisionNumber: weldPass.wpsRevisionNumber,
        heatInputMethod: weldPass.heatInputMethod,
        beadLengthMm: weldPass.beadLengthMm,
        arcTimeS: weldPass.arcTimeS,
        machineEnergyKJ: weldPass.machineEnergyKJ,
        machinePowerW: weldPass.machinePowerW,
        jPerIn: weldPass.jPerIn,
        findings: weldPass.wpsFindings,
        outOfRange: weldPass.outOfRange,
        overrideReason: weldPassOverride.reason,
        overrideById: weldPassOverride.leadId,
        overrideByName: weldPassOverride.printedName,
        overrideAt: weldPassOverride.at,
      })
      .from(weldPass)
      .innerJoin(user, eq(user.id, weldPass.welderId))
      .leftJoin(weldPassOverride, eq(weldPassOverride.passId, weldPass.id))
      .where(eq(weldPass.jobId, jobId))
      .orderBy(asc(weldPass.stepId), asc(weldPass.passNumber)),
    loadNonconformances(x, jobId),
  ]);
  const [inspections, materials, wpsSummaries] = await Promise.all([loadInspections(x, jobId), loadMaterials(x, jobId), loadWpsSummaries(x, shopId, steps.map((s) => s.spec))]);

  const header: JobParts["header"] = {
    id: h.id,
    number: h.number,
    status: h.status,
    customerName: h.customerName,
    customerPhone: h.customerPhone,
    customerEmail: h.customerEmail,
    vehicleYear: h.vehicleYear,
    vehicleMakeModel: h.vehicleMakeModel,
    vin: h.vin,
    vinWarning: h.vinWarning,
    axleDescription: h.axleDescription,
    axleTag: h.axleTag,
    procedureId: h.procedureId,
    procedureVersionId: h.procedureVersionId,
    procedureVersionNumber: h.procedureVersionNumber,
    procedureTitle: h.procedureTitle,
    dueDate: isoDate(h.dueDate),
    notes: h.notes,
    version: h.version,
    welders: assignees.filter((a) => a.role === "welder").map((a) => ({ id: a.userId, name: a.name })),
    inspector: assignees.filter((a) => a.role === "inspector").map((a) => ({ id: a.userId, name: a.name }))[0] ?? null,
    createdBy: { id: h.createdById, name: h.createdByName },
    createdAt: h.createdAt.toISOString(),
    updatedAt: h.updatedAt.toISOString(),
    startedAt: iso(h.startedAt),
    releasedAt: iso(h.releasedAt),
    releasedBy: h.releasedById ? { id: h.releasedById, name: h.releasedByName ?? "" } : null,
    voidedAt: iso(h.voidedAt),
    voidReason: h.voidReason,
  };
  return {
    header,
    steps: steps.map((s) => ({
      id: s.id,
      position: s.position,
      sectionKey: s.sectionKey,
      sectionTitle: s.sectionTitle,
      sectionPosition: s.sectionPosition,
      stepKey: s.stepKey,
      kind: s.kind,
      title: s.title,
      spec: s.spec,
      value: s.value,
      version: s.version,
      updatedAt: iso(s.updatedAt),
      updatedBy: s.updatedById ? { id: s.updatedById, name: s.updatedByName ?? "" } : null,
      signedAt: iso(s.signedAt),
    })),
    signOffs: signOffs.map((o): SignOffView => ({ ...o, signedAt: o.signedAt.toISOString() })),
    photos: photos.map(
      (p): PhotoView => ({
        id: p.id,
        stepId: p.stepId,
        nonconformanceId: p.nonconformanceId,
        ...photoUrls(p.id),
        sha256: p.sha256,
        width: p.width,
        height: p.height,
        size: p.size,
        caption: p.caption,
        uploadedAt: p.uploadedAt.toISOString(),
        uploadedBy: { id: p.uploadedById, name: p.uploadedByName },
        removed: p.removedAt !== null,
      }),
    ),
    passes: passes.map(
      (p): PassView => ({
        id: p.id,
        stepId: p.stepId,
        passNumber: p.passNumber,
        welder: { id: p.welderId, name: p.welderName },
        process: p.process,
        volts: p.volts,
        amps: p.amps,
        travelSpeedMmPerMin: p.travelSpeedMmPerMin,
        travelSpeedUnit: p.travelSpeedUnit,
        preheatC: p.preheatC,
        interpassC: p.interpassC,
        fillerLot: p.fillerLot,
        arcEnergyKJPerMm: p.arcEnergyKJPerMm,
        heatInputKJPerMm: p.heatInputKJPerMm,
        recordedAt: p.recordedAt.toISOString(),
        removed: p.removedAt !== null,
        round: p.round,
        position: p.position,
        fillerClassification: p.fillerClassification,
        wps: { revisionId: p.wpsRevisionId, reference: p.wpsReference, number: p.wpsRevisionNumber },
        heatInputMethod: p.heatInputMethod,
        beadLengthMm: p.beadLengthMm,
        arcTimeS: p.arcTimeS,
        machineEnergyKJ: p.machineEnergyKJ,
        machinePowerW: p.machinePowerW,
        jPerIn: p.jPerIn,
        findings: p.findings,
        outOfRange: p.outOfRange,
        override:
          p.overrideReason && p.overrideById && p.overrideAt ? { reason: p.overrideReason, by: { id: p.overrideById, name: p.overrideByName ?? "" }, at: p.overrideAt.toISOString() } : null,
      }),
    ),
    nonconformances: ncs,
    inspections,
    materials,
    wps: wpsSummaries,
    qualifications: [],
    weldMap: weldMapView(h.weldMap),
  };
}

/** The job's map with a URL for each image (a photo of this job, or the procedure's image). */
export function weldMapView(map: JobWeldMap | null): WeldMapView | null {
  if (!map || !map.joints.length) return null;
  return {
    images: map.images.map((i) => ("photoId" in i ? { ...i, url: photoUrls(i.photoId).url } : { ...i, url: `/api/procedure-images/${i.procedureImageId}` })),
    joints: map.joints,
    rebasedAt: map.rebasedAt ?? null,
  };
}

async function loadInspections(x: Exec, jobId: string): Promise<InspectionView[]> {
  const rows = await x
    .select({
      id: weldInspection.id,
      stepId: weldInspection.stepId,
      round: weldInspection.round,
      criteria: weldInspection.criteria,
      observations: weldInspection.observations,
      items: weldInspection.items,
      judged: weldInspection.judged,
      decision: weldInspection.decision,
      notes: weldInspection.notes,
      photoIds: weldInspection.photoIds,
      inspectorId: weldInspection.inspectorId,
      inspectorName: user.name,
      signOffId: weldInspection.signOffId,
      inspectedAt: weldInspection.inspectedAt,
    })
    .from(weldInspection)
    .innerJoin(user, eq(user.id, weldInspection.inspectorId))
    .where(eq(weldInspection.jobId, jobId))
    .orderBy(asc(weldInspection.inspectedAt), asc(weldInspection.round));
  const repairs = await loadRepairs(x, jobId);
  // A rejected round's inspection carries the repair record of the round after it.
  return rows.map(({ inspectorId, inspectorName, inspectedAt, ...r }) => ({
    ...r,
    inspector: { id: inspectorId, name: inspectorName },
    inspectedAt: inspectedAt.toISOString(),
    repair: repairs.find((p) => p.stepId === r.stepId && p.round === r.round + 1)?.view ?? null,
  }));
}

async function loadRepairs(x: Exec, jobId: string): Promise<{ stepId: string; round: number; view: RepairView }[]> {
  const rows = await x
    .select({
      id: weldRepair.id,
      stepId: weldRepair.stepId,
      round: weldRepair.round,
      method: weldRepair.method,
      methodNote: weldRepair.methodNote,
      depthMm: weldRepair.depthMm,
      lengthMm: weldRepair.lengthMm,
      photoId: weldRepair.photoId,
      byId: weldRepair.recordedBy,
      byName: user.name,
      recordedAt: weldRepair.recordedAt,
    })
    .from(weldRepair)
    .innerJoin(user, eq(user.id, weldRepair.recordedBy))
    .where(eq(weldRepair.jobId, jobId));
  return rows.map(({ stepId, byId, byName, recordedAt, ...r }) => ({ stepId, round: r.round, view: { ...r, recordedBy: { id: byId, name: byName }, recordedAt: recordedAt.toISOString() } }));
}

async function loadMaterials(x: Exec, jobId: string): Promise<MaterialView[]> {
  const rows = await x
    .select({
      id: jobMaterial.id,
      kind: jobMaterial.kind,
      description: jobMaterial.description,
      specification: jobMaterial.specification,
      heatNumber: jobMaterial.heatNumber,
      certificate: jobMaterial.certificate,
      correctsId: jobMaterial.correctsId,
      withdrawn: jobMaterial.withdrawn,
      reason: jobMaterial.reason,
      recordedById: jobMaterial.recordedBy,
      recordedByName: user.name,
      recordedAt: jobMaterial.recordedAt,
    })
    .from(jobMaterial)
    .innerJoin(user, eq(user.id, jobMaterial.recordedBy))
    .where(eq(jobMaterial.jobId, jobId))
    .orderBy(asc(jobMaterial.recordedAt), asc(jobMaterial.id));
  const replaced = new Set(rows.map((r) => r.correctsId).filter(Boolean));
  return rows.map(({ recordedById, recordedByName, recordedAt, ...r }) => ({
    ...r,
    recordedBy: { id: recordedById, name: recordedByName },
    recordedAt: recordedAt.toISOString(),
    superseded: replaced.has(r.id),
  }));
}

/** The published revision of each WPS the job's weld steps name (a missing reference is simply absent). */
async function loadWpsSummaries(x: Exec, shopId: string, specs: readonly { kind: string; wpsRef?: string }[]): Promise<WpsSummary[]> {
  const refs = [...new Set(specs.filter((s) => s.kind === "weld" && s.wpsRef).map((s) => s.wpsRef!.trim().toUpperCase()))];
  if (!refs.length) return [];
  const rows = await x
    .select({ reference: wps.reference, revision: wpsRevision })
    .from(wpsRevision)
    .innerJoin(wps, eq(wps.id, wpsRevision.wpsId))
    .where(and(eq(wpsRevision.shopId, shopId), eq(wpsRevision.status, "published"), inArray(wps.reference, refs)));
  return rows.map(({ reference, revision: r }) => ({
    reference,
    revisionId: r.id,
    number: r.number,
    title: r.title,
    process: r.process,
    positions: [...r.positions],
    ranges: toWpsRanges(r as unknown as Parameters<typeof toWpsRanges>[0]),
  }));
}

async function loadNonconformances(x: Exec, jobId: string): Promise<NonconformanceView[]> {
  const raiser = alias(user, "raiser");
  const decider = alias(user, "decider");
  const rows = await x
    .select({
      id: nonconformance.id,
      number: nonconformance.number,
      stepId: nonconformance.stepId,
      stepKey: jobStep.stepKey,
      stepTitle: jobStep.title,
      description: nonconformance.description,
      proposedDisposition: nonconformance.proposedDisposition,
      observed: nonconformance.observed,
      raisedById: nonconformance.raisedBy,
      raisedByName: raiser.name,
      raisedAt: nonconformance.raisedAt,
      disposition: nonconformanceDisposition.disposition,
      notes: nonconformanceDisposition.notes,
      decidedById: nonconformanceDisposition.decidedBy,
      decidedByName: decider.name,
      decidedAt: nonconformanceDisposition.decidedAt,
      signOffId: nonconformanceDisposition.signOffId,
      dispositionHash: signOff.contentHash,
    })
    .from(nonconformance)
    .innerJoin(jobStep, eq(jobStep.id, nonconformance.stepId))
    .innerJoin(raiser, eq(raiser.id, nonconformance.raisedBy))
    .leftJoin(nonconformanceDisposition, eq(nonconformanceDisposition.nonconformanceId, nonconformance.id))
    .leftJoin(decider, eq(decider.id, nonconformanceDisposition.decidedBy))
    .leftJoin(signOff, eq(signOff.id, nonconformanceDisposition.signOffId))
    .where(eq(nonconformance.jobId, jobId))
    .orderBy(asc(nonconformance.number));
  const ids = rows.map((r) => r.id);
  const photoRows = ids.length
    ? await x.select({ id: photo.id, nc: photo.nonconformanceId }).from(photo).where(and(inArray(photo.nonconformanceId, ids), sql`${photo.removedAt} is null`))
    : [];
  return rows.map((r) => ({
    id: r.id,
    number: r.number,
    stepId: r.stepId,
    stepKey: r.stepKey,
    stepTitle: r.stepTitle,
    description: r.description,
    proposedDisposition: r.proposedDisposition,
    observed: r.observed,
    raisedBy: { id: r.raisedById, name: r.raisedByName },
    raisedAt: r.raisedAt.toISOString(),
    photoIds: photoRows.filter((p) => p.nc === r.id).map((p) => p.id),
    disposition:
      r.disposition && r.decidedById && r.decidedAt && r.signOffId
        ? { disposition: r.disposition, notes: r.notes ?? "", decidedBy: { id: r.decidedById, name: r.decidedByName ?? "" }, decidedAt: r.decidedAt.toISOString(), signOffId: r.signOffId, contentHash: r.dispositionHash ?? "" }
        : null,
  }));
}

export async function loadRecord(x: Exec, ctx: ShopContext, jobId: string, opts: { lock?: boolean } = {}): Promise<JobRecord> {
  const parts = await loadJobParts(x, ctx.shopId, jobId, opts);
  if (!parts) throw new AppError("not_found", "Job not found.");
  if (ctx.roles.includes("welder")) parts.qualifications = await viewerQualifications(x, ctx, parts);
  return assembleRecord(parts, viewerOf(ctx));
}

/** The viewer's continuity today for each process the job welds with, so the runner says so before a pass. */
async function viewerQualifications(x: Exec, ctx: ShopContext, parts: JobParts): Promise<QualificationSummary[]> {
  const processes = [...new Set(parts.steps.flatMap((s) => (s.spec.kind === "weld" ? [s.spec.process] : [])))];
  const today = new Date().toISOString().slice(0, 10);
  const out: QualificationSummary[] = [];
  for (const process of processes) {
    const q = await currentQualification({ shopId: ctx.shopId, welderUserId: ctx.userId, process, onDate: today }, x as DbOrTx);
    out.push({ process, ok: q.ok, reason: q.reason, lapsedOn: q.lapsedOn ?? null, expiresOn: q.expiresOn ?? null });
  }
  return out;
}

export async function getJobRecord(ctx: ShopContext, jobId: string): Promise<JobRecord> {
  return loadRecord(db(), ctx, jobId);
}

export function assertJobOpen(record: JobRecord) {
  const { status, number } = record.job;
  if (status === "released") throw new AppError("conflict", `${number} is released; its record is closed. Nothing can be changed.`);
  if (status === "void") throw new AppError("conflict", `${number} is void; nothing more is recorded on it.`);
}

type SignOffRow = typeof signOff.$inferInsert;

/**
 * The one place a sign-off is written (step sign-offs, amendments, dispositions, releases), inside the
 * transaction of its write. It is appended to the job's record chain in the same transaction, so a
 * sign-off never exists without its chain entry.
 */
export async function appendSignOff(x: Exec, values: Omit<SignOffRow, "id">): Promise<{ id: string; signedAt: Date }> {
  const [row] = await x.insert(signOff).values(values).returning({ id: signOff.id, signedAt: signOff.signedAt });
  await appendToChain(x as Parameters<typeof appendToChain>[0], row!.id);
  return row!;
}

export async function logActivity(x: Exec, row: { shopId: string; jobId: string; actorId: string | null; action: string; stepId?: string | null; detail?: Record<string, unknown> }) {
  await x.insert(jobActivity).values({ shopId: row.shopId, jobId: row.jobId, actorId: row.actorId, action: row.action, stepId: row.stepId ?? null, detail: row.detail ?? {} });
}

/** Recompute the job's state and progress from its rows; logs a state change. Call inside the write's transaction. */
export async function refreshJobState(x: Exec, shopId: string, jobId: string, actorId: string | null): Promise<JobStateName> {
  const [current] = await x.select({ status: job.status, startedAt: job.startedAt }).from(job).where(and(eq(job.id, jobId), eq(job.shopId, shopId)));
  if (!current) throw new AppError("not_found", "Job not found.");
  const steps = await x
    .select({ id: jobStep.id, key: jobStep.stepKey, title: jobStep.title, kind: jobStep.kind, position: jobStep.position, sectionKey: jobStep.sectionKey, signedAt: jobStep.signedAt })
    .from(jobStep)
    .where(eq(jobStep.jobId, jobId));
  const [open] = await x
    .select({ n: sql<number>`count(*)::int` })
    .from(nonconformance)
    .leftJoin(nonconformanceDisposition, eq(nonconformanceDisposition.nonconformanceId, nonconformance.id))
    .where(and(eq(nonconformance.jobId, jobId), sql`${nonconformanceDisposition.id} is null`));
  const openNonconformances = open?.n ?? 0;
  // A weld step is done when the latest inspection of its joint accepted it.
  const accepted = await x.execute<{ step_id: string }>(sql`
    select distinct on (step_id) step_id, decision from ${weldInspection}
    where job_id = ${jobId} order by step_id, round desc`);
  const acceptedIds = new Set(accepted.rows.filter((r) => (r as { decision?: string }).decision === "accepted").map((r) => r.step_id));
  const checklist = steps.map((s) => ({ ...s, signed: s.kind === "weld" ? acceptedIds.has(s.id) : s.signedAt !== null }));
  const [work] = await x.execute<{ any: boolean }>(
    sql`select exists (select 1 from ${signOff} where job_id = ${jobId} and round is not null) or exists (select 1 from ${weldPass} where job_id = ${jobId} and removed_at is null) as any`,
  ).then((r) => r.rows);
  const workRecorded = work?.any === true;
  const next = deriveJobState({ status: current.status, steps: checklist, openNonconformances, workRecorded });
  if (current.status === "released" || current.status === "void") return current.status;
  const signed = checklist.filter((s) => s.signed).length;
  await x
    .update(job)
    .set({
      status: next,
      stepsTotal: steps.length,
      stepsSigned: signed,
      openNonconformances,
      updatedAt: new Date(),
      ...((signed > 0 || workRecorded) && !current.startedAt ? { startedAt: new Date() } : {}),
    })
    .where(and(eq(job.id, jobId), eq(job.shopId, shopId)));
  if (next !== current.status) {
    await logActivity(x, { shopId, jobId, actorId, action: "job.state", detail: { from: current.status, to: next } });
  }
  return next;
}

function pgCode(error: unknown): string | undefined {
  const e = error as { code?: unknown; cause?: { code?: unknown } };
  const code = typeof e?.code === "string" ? e.code : typeof e?.cause?.code === "string" ? e.cause.code : undefined;
  return code;
}

/**
 * Runs a write; a refusal from the database rules (SQLSTATE GS409) or a unique index racing another tablet
 * becomes a 409 instead of a 500. The app checks first, so this only answers races.
 */
export async function guarded<T>(fn: () => Promise<T>, conflictMessage: string): Promise<T> {
  try {
    return await fn();
  } catch (error) {
    const code = pgCode(error);
    if (code === "GS409" || code === "23505" || code === "40001") throw new AppError("conflict", conflictMessage);
    throw error;
  }
}

export { iso };
