import "server-only";
// Work on a checklist step: saving its value (optimistic concurrency), weld passes, signing with a PIN and
// amending a signed step. Every sign-off of the product is appended in this module or in jobs.ts
// (release) and jobs-nc.ts (disposition) — the places a record chain hooks in.
import { and, eq, sql } from "drizzle-orm";
import { jobStep, weldPass, weldPassOverride, weldRepair } from "@/db/schema";
import { currentQualification, recordProcessUse } from "@/db/queries/qualifications";
import type { ShopContext } from "@/lib/auth/context";
import { db } from "@/lib/db";
import { AppError } from "@/lib/errors";
import { isGeometryError } from "@/lib/geometry";
import { geometryResults } from "@/lib/jobs/geometry";
import { stepContentHash } from "@/lib/jobs/hash";
import { contentHash } from "@/lib/seal";
import type { JobRecord, StepView } from "@/lib/jobs/record";
import { signingRole } from "@/lib/jobs/roles";
import { stepReadiness } from "@/lib/jobs/readiness";
import { holdWaitingReason } from "@/lib/jobs/assemble";
import { holdSeparation, priorWorkFrom, unsignedBefore } from "@/lib/jobs/state";
import { parseValue } from "@/lib/jobs/values";
import type { Step, WELD_PROCESSES } from "@/lib/procedures/schema";

type WeldProcess = (typeof WELD_PROCESSES)[number];
import type { HandOver, RepairBody, WeldPassBody } from "@/lib/jobs/schemas";
import { signerFor, tabletHolder } from "./jobs-handover";
import { checkPassAgainstWps, passHeatInput } from "@/lib/welding";
import { appendSignOff, assertJobOpen, guarded, loadRecord, logActivity, refreshJobState, type Exec } from "./jobs-core";
import { findStep, verifyPinLogged } from "./jobs-lookup";
import { mailJointReady } from "./jobs-welds";

const when = (iso: string | null) => (iso ? `${iso.slice(0, 16).replace("T", " ")} UTC` : "");

function assertUnsigned(step: StepView) {
  if (!step.signed) return;
  const first = step.signOffs[0];
  throw new AppError("conflict", `"${step.title}" was signed${first ? ` by ${first.printedName} at ${when(first.signedAt)}` : ""} and is frozen. Correct it with an amendment.`);
}

// A weld joint's note is signed with its first round and stays; repairs are told by their rounds.
function assertWeldNoteOpen(step: StepView) {
  if (step.joint && step.signOffs.length > 0) throw new AppError("conflict", `"${step.title}" has a signed round; its note is part of that record. Add what you need to say to the nonconformance or the next round.`);
}

function assertUnlocked(step: StepView) {
  if (step.lockedBy) throw new AppError("locked", `"${step.title}" is locked behind the hold point "${step.lockedBy.title}": an inspector signs that first.`);
}

function assertRole(step: StepView, ctx: ShopContext) {
  const role = signingRole(step.spec, ctx.roles);
  if ("refuse" in role) throw new AppError("forbidden", role.refuse);
  return role;
}

function conflictOnStep(step: StepView): AppError {
  const who = step.updatedBy?.name ?? "Someone";
  return new AppError(
    "conflict",
    `${who} changed "${step.title}" at ${when(step.updatedAt)} while you were working on it. Their value is shown now; check it, then save again.`,
    undefined,
    { current: { stepId: step.id, value: step.value, version: step.version, updatedBy: step.updatedBy, updatedAt: step.updatedAt } },
  );
}

/** Validates a value for the step's kind; geometry captures get their results computed here, never taken from the client. */
export function normaliseValue(spec: Step, raw: unknown): Record<string, unknown> {
  const parsed = parseValue(spec.kind, raw);
  // The route wrapper turns a ZodError into 400 with field errors.
  if (!parsed.success) throw parsed.error;
  const value = parsed.data as Record<string, unknown>;
  if (spec.kind === "geometry") {
    for (const which of ["before", "after"] as const) {
      const capture = value[which] as { input: Parameters<typeof geometryResults>[0]; capturedAt?: string } | undefined;
      if (!capture) continue;
      try {
        value[which] = { ...capture, capturedAt: capture.capturedAt ?? new Date().toISOString(), results: geometryResults(capture.input) };
      } catch (error) {
        if (isGeometryError(error)) throw new AppError("unprocessable", `The ${which} geometry cannot be computed: ${error.message}.`, { [`${which}.input`]: [error.message] });
        throw error;
      }
    }
  }
  return value;
}

export async function saveStepValue(ctx: ShopContext, jobId: string, stepId: string, body: { baseVersion: number; value: Record<string, unknown> }) {
  const pre = await loadRecord(db(), ctx, jobId);
  assertJobOpen(pre);
  const step = findStep(pre, stepId);
  assertUnsigned(step);
  assertWeldNoteOpen(step);
  assertUnlocked(step);
  assertRole(step, ctx);
  const value = normaliseValue(step.spec, body.value);
  return guarded(
    () =>
      db().transaction(async (tx) => {
        const record = await loadRecord(tx, ctx, jobId, { lock: true });
        assertJobOpen(record);
        const current = findStep(record, stepId);
        assertUnsigned(current);
        if (current.version !== body.baseVersion) throw conflictOnStep(current);
        const updated = await tx
          .update(jobStep)
          .set({ value, version: sql`${jobStep.version} + 1`, updatedBy: ctx.userId, updatedAt: new Date() })
          .where(and(eq(jobStep.id, stepId), eq(jobStep.jobId, jobId), eq(jobStep.version, body.baseVersion), sql`${jobStep.signedAt} is null`))
          .returning({ version: jobStep.version });
        if (!updated.length) throw conflictOnStep(current);
        await logActivity(tx, { shopId: ctx.shopId, jobId, actorId: ctx.userId, action: "step.value_saved", stepId, detail: { version: updated[0]!.version, value } });
        return loadRecord(tx, ctx, jobId);
      }),
    "This step changed a moment ago; reload it and try again.",
  );
}

function priorWork(record: JobRecord) {
  return priorWorkFrom(record.steps, record.steps.flatMap((s) => s.signOffs), record.passes);
}

type SignPlan = { role: "welder" | "inspector" | "lead"; meaning: "performed" | "inspected"; acceptedUnder: number[] };

// Everything that must hold for a sign-off, checked before the PIN (so a refused step costs no PIN try)
// and again under the job's lock.
function checkSignable(record: JobRecord, step: StepView, ctx: ShopContext, baseVersion: number | null): SignPlan {
  assertJobOpen(record);
  assertUnsigned(step);
  assertUnlocked(step);
  const role = assertRole(step, ctx);
  if (baseVersion !== null && step.version !== baseVersion) throw conflictOnStep(step);
  if (step.kind === "hold") {
    const waiting = unsignedBefore(record.steps, step);
    if (waiting.length) {
      const joints = new Map(record.steps.flatMap((s) => (s.joint ? [[s.id, s.joint] as const] : [])));
      throw new AppError("conflict", holdWaitingReason(waiting, joints, waiting.map((w) => w.id)));
    }
    const earlierOpen = record.nonconformances.find((n) => n.disposition === null && (record.steps.find((s) => s.id === n.stepId)?.position ?? 0) < step.position);
    if (earlierOpen) throw new AppError("conflict", `NC-${earlierOpen.number} on "${earlierOpen.stepTitle}" is still open; it is dispositioned before this hold point is signed.`);
    const refusal = holdSeparation({ signerId: ctx.userId, hold: step, prior: priorWork(record) });
    if (refusal) throw new AppError("forbidden", refusal);
  }
  if (!step.readiness.canSign) {
    throw new AppError("unprocessable", `"${step.title}" cannot be signed yet: ${step.readiness.reasons.join(" ")}`, undefined, { reasons: step.readiness.reasons, verdict: step.readiness.verdict });
  }
  return { role: role.role, meaning: role.meaning, acceptedUnder: step.readiness.acceptedUnder };
}

function signedContent(record: JobRecord, step: StepView, meaning: string, value: Record<string, unknown> | null, acceptedUnder: number[], amends?: { signOffId: string; reason: string }) {
  const joint = step.joint;
  // A weld round signs its own passes; a repair round names the rejection it answers.
  const repairOf = joint && joint.round > 1 ? (joint.rounds[joint.round - 2]?.inspection?.signOffId ?? null) : null;
  return stepContentHash({
    jobId: record.job.id,
    jobNumber: record.job.number,
    stepId: step.id,
    stepKey: step.key,
    kind: step.kind,
    specHash: contentHash(step.spec),
    meaning,
    value,
    photos: record.photos.filter((p) => p.stepId === step.id && !p.removed).map((p) => ({ id: p.id, sha256: p.sha256 })),
    passes: record.passes
      .filter((p) => p.stepId === step.id && !p.removed && (!joint || p.round === joint.round))
      .map((p) => ({
        passNumber: p.passNumber,
        welderId: p.welder.id,
        process: p.process,
        volts: p.volts,
        amps: p.amps,
        travelSpeedMmPerMin: p.travelSpeedMmPerMin,
        preheatC: p.preheatC,
        interpassC: p.interpassC,
        fillerLot: p.fillerLot,
        heatInputKJPerMm: p.heatInputKJPerMm,
        ...(joint
          ? {
              round: p.round,
              position: p.position,
              wps: { reference: p.wps.reference, revision: p.wps.number },
              outOfRange: p.outOfRange,
              override: p.override ? { leadId: p.override.by.id, reason: p.override.reason } : null,
            }
          : {}),
      })),
    acceptedUnder,
    amends,
    round: joint ? { number: joint.round, repairOf } : undefined,
  });
}

export async function signStep(holder: ShopContext, jobId: string, stepId: string, body: { pin: string; baseVersion: number; handOver?: HandOver }) {
  // On a hand-over the inspector signs on the holder's tablet: every check and the PIN are the inspector's.
  const ctx = await signerFor(holder, body.handOver);
  const pre = await loadRecord(db(), ctx, jobId);
  checkSignable(pre, findStep(pre, stepId), ctx, body.baseVersion);
  await verifyPinLogged(ctx, jobId, stepId, body.pin);
  const result = await guarded(
    () =>
      db().transaction(async (tx) => {
        const record = await loadRecord(tx, ctx, jobId, { lock: true });
        const step = findStep(record, stepId);
        const plan = checkSignable(record, step, ctx, body.baseVersion);
        const { content, hash } = signedContent(record, step, plan.meaning, step.value, plan.acceptedUnder);
        const round = step.joint?.round ?? null;
        const so = await appendSignOff(tx, { shopId: ctx.shopId, jobId, stepId, userId: ctx.userId, printedName: ctx.legalName, role: plan.role, meaning: plan.meaning, content, contentHash: hash, round });
        await tx
          .update(jobStep)
          .set({ signedAt: sql`coalesce(${jobStep.signedAt}, ${so.signedAt.toISOString()}::timestamptz)`, version: sql`${jobStep.version} + 1` })
          .where(and(eq(jobStep.id, stepId), eq(jobStep.jobId, jobId)));
        await logActivity(tx, {
          shopId: ctx.shopId,
          jobId,
          actorId: ctx.userId,
          action: "step.signed",
          stepId,
          detail: { signOffId: so.id, meaning: plan.meaning, role: plan.role, contentHash: hash, acceptedUnder: plan.acceptedUnder, ...(round ? { round } : {}), ...tabletHolder(holder, ctx) },
        });
        await refreshJobState(tx, ctx.shopId, jobId, ctx.userId);
        // The answer goes back to the tablet, so it is the holder's view of the record.
        const after = await loadRecord(tx, holder, jobId);
        return { record: after, signOffId: so.id };
      }),
    "This step was signed a moment ago by someone else.",
  );
  // A signed weld round is ready for inspection: tell the inspector. The mail never holds up the record.
  if (findStep(result.record, stepId).joint) await mailJointReady(ctx, result.record, stepId);
  return result;
}

export async function amendStep(ctx: ShopContext, jobId: string, stepId: string, body: { pin: string; amendsSignOffId: string; reason: string; value: Record<string, unknown> }) {
  const check = async (x: Exec, lock: boolean) => {
    const record = await loadRecord(x, ctx, jobId, { lock });
    assertJobOpen(record);
    const step = findStep(record, stepId);
    if (step.joint) throw new AppError("conflict", `A weld joint is not amended: a rejected joint is repaired in a new round and inspected again.`);
    if (!step.signed) throw new AppError("conflict", `"${step.title}" is not signed yet; change its value directly.`);
    const role = assertRole(step, ctx);
    const latest = step.signOffs.filter((o) => !step.signOffs.some((x2) => x2.amendsSignOffId === o.id)).at(-1);
    if (!step.signOffs.some((o) => o.id === body.amendsSignOffId)) throw new AppError("not_found", "That sign-off is not on this step.");
    if (latest && latest.id !== body.amendsSignOffId) {
      throw new AppError("conflict", `${latest.printedName} amended "${step.title}" at ${when(latest.signedAt)}; review their amendment and amend that one.`, undefined, {
        current: { signOffId: latest.id, value: latest.value },
      });
    }
    if (step.kind === "hold") {
      // An amended inspection is still an inspection: the same separation of duties holds.
      const refusal = holdSeparation({ signerId: ctx.userId, hold: step, prior: priorWork(record) });
      if (refusal) throw new AppError("forbidden", refusal);
    }
    const value = normaliseValue(step.spec, body.value);
    const ncs = record.nonconformances.filter((n) => n.stepId === step.id).map((n) => ({ number: n.number, disposition: n.disposition?.disposition ?? null, observed: n.observed }));
    const photoCount = record.photos.filter((p) => p.stepId === step.id && !p.removed).length;
    const passes = record.passes.filter((p) => p.stepId === step.id && !p.removed);
    const readiness = stepReadiness({ spec: step.spec, value, photoCount, passes, ncs });
    if (!readiness.canSign) throw new AppError("unprocessable", `The corrected value cannot be signed: ${readiness.reasons.join(" ")}`, undefined, { reasons: readiness.reasons });
    return { record, step, role, value, readiness };
  };
  await check(db(), false);
  await verifyPinLogged(ctx, jobId, stepId, body.pin);
  return guarded(
    () =>
      db().transaction(async (tx) => {
        const { record, step, role, value, readiness } = await check(tx, true);
        const { content, hash } = signedContent(record, step, role.meaning, value, readiness.acceptedUnder, { signOffId: body.amendsSignOffId, reason: body.reason });
        const so = await appendSignOff(tx, {
          shopId: ctx.shopId,
          jobId,
          stepId,
          userId: ctx.userId,
          printedName: ctx.legalName,
          role: role.role,
          meaning: role.meaning,
          content,
          contentHash: hash,
          amendsSignOffId: body.amendsSignOffId,
          reason: body.reason,
        });
        await logActivity(tx, { shopId: ctx.shopId, jobId, actorId: ctx.userId, action: "step.amended", stepId, detail: { signOffId: so.id, amends: body.amendsSignOffId, reason: body.reason, contentHash: hash } });
        await refreshJobState(tx, ctx.shopId, jobId, ctx.userId);
        return { record: await loadRecord(tx, ctx, jobId), signOffId: so.id };
      }),
    "This step was amended a moment ago by someone else; review the latest amendment.",
  );
}

export type PassInput = WeldPassBody;

/** The joint of a weld step, or a refusal when the step is not one. */
function jointOf(step: StepView) {
  if (step.spec.kind !== "weld" || !step.joint) throw new AppError("bad_request", "Weld passes are recorded on weld steps only.");
  return { spec: step.spec, joint: step.joint };
}

/** A pass is recorded while its joint's round is open: before its welder signs it, or after a rejection. */
function assertRoundOpen(step: StepView) {
  const { spec, joint } = jointOf(step);
  if (joint.state === "accepted") throw new AppError("conflict", `Joint ${spec.jointId} is inspected and accepted; nothing more is welded on it.`);
  if (joint.state === "awaiting_inspection") {
    throw new AppError("conflict", `${joint.round > 1 ? `Repair round ${joint.round}` : "Round 1"} of joint ${spec.jointId} is signed and waits for the inspector; passes are recorded again only if it is rejected.`);
  }
  return { spec, joint };
}

/** A repair round is welded only once the removal of the rejected weld is on the record. */
function assertRepairRecorded(step: StepView) {
  const { spec, joint } = jointOf(step);
  if (joint.round < 2) return;
  if (joint.rounds[joint.round - 2]?.inspection?.repair) return;
  throw new AppError(
    "unprocessable",
    `Record how the rejected weld of joint ${spec.jointId} was removed (method, depth and length removed, a photo) before welding repair round ${joint.round}.`,
    { repair: ["Record the repair first."] },
  );
}

/** How the rejected weld was removed, once per repair round, before any of its passes. */
export async function recordRepair(ctx: ShopContext, jobId: string, stepId: string, input: RepairBody) {
  return guarded(
    () =>
      db().transaction(async (tx) => {
        const record = await loadRecord(tx, ctx, jobId, { lock: true });
        assertJobOpen(record);
        const step = findStep(record, stepId);
        assertUnlocked(step);
        const { spec, joint } = assertRoundOpen(step);
        if (!ctx.roles.includes("welder") && !ctx.roles.includes("lead")) throw new AppError("forbidden", "A welder or lead records how a weld was removed.");
        if (joint.round < 2) throw new AppError("conflict", `Joint ${spec.jointId} was not rejected; there is no repair to record.`);
        const rejected = joint.rounds[joint.round - 2]?.inspection;
        if (rejected?.repair) throw new AppError("conflict", `The repair of joint ${spec.jointId} for round ${joint.round} is already recorded by ${rejected.repair.recordedBy.name}.`);
        if (record.passes.some((p) => p.stepId === stepId && p.round === joint.round && !p.removed)) throw new AppError("conflict", `Repair round ${joint.round} already has passes.`);
        const shot = record.photos.find((p) => p.id === input.photoId && !p.removed);
        if (!shot) throw new AppError("unprocessable", "The photo of the prepared groove is not on this job.", { photoId: ["Take the photo on this job first."] });
        await tx.insert(weldRepair).values({
          shopId: ctx.shopId,
          jobId,
          stepId,
          round: joint.round,
          method: input.method,
          methodNote: input.methodNote,
          depthMm: input.depthMm,
          lengthMm: input.lengthMm,
          photoId: shot.id,
          recordedBy: ctx.userId,
        });
        await logActivity(tx, { shopId: ctx.shopId, jobId, actorId: ctx.userId, action: "weld.repair", stepId, detail: { joint: spec.jointId, round: joint.round, method: input.method, depthMm: input.depthMm, lengthMm: input.lengthMm, photoId: shot.id } });
        return { record: await loadRecord(tx, ctx, jobId) };
      }),
    "The repair of this round was recorded a moment ago.",
  );
}

type PassFigures = {
  travelSpeedMmPerMin: number;
  arcEnergyKJPerMm: number;
  heatInputKJPerMm: number;
  jPerIn: number;
  method: "voltage-current" | "energy" | "power";
  beadLengthMm: number | null;
};

/** Heat input by ASME IX QW-409.1 (a) or (c) and ISO/TR 17671-1; a machine reading wins over V·A/v. */
export function passFigures(process: WeldProcess, input: PassInput): PassFigures {
  const beadLength = input.beadLength ? { value: input.beadLength.value, unit: input.beadLength.unit } : undefined;
  const beadLengthMm = beadLength ? (beadLength.unit === "in" ? beadLength.value * 25.4 : beadLength.value) : null;
  try {
    const a = input.travelSpeed
      ? passHeatInput({ method: "voltage-current", process, volts: input.volts, amps: input.amps, travelSpeed: input.travelSpeed })
      : input.beadLength && input.arcTimeS !== undefined
        ? passHeatInput({ method: "voltage-current", process, volts: input.volts, amps: input.amps, beadLength: beadLength!, arcTimeS: input.arcTimeS })
        : null;
    const c =
      input.machineEnergyKJ !== undefined
        ? passHeatInput({ method: "energy", process, energyJ: input.machineEnergyKJ * 1000, beadLength: beadLength!, ...(input.arcTimeS !== undefined ? { arcTimeS: input.arcTimeS } : {}) })
        : input.machinePowerW !== undefined
          ? passHeatInput({ method: "power", process, powerW: input.machinePowerW, arcTimeS: input.arcTimeS!, beadLength: beadLength! })
          : null;
    const used = c ?? a;
    const speed = a?.travelSpeedMmPerMin ?? c?.travelSpeedMmPerMin ?? null;
    if (!used || speed === null) {
      throw new AppError("unprocessable", "The travel speed cannot be worked out: give it, or the bead length and the arc time.", { travelSpeed: ["Enter the travel speed, or the bead length and the arc time."] });
    }
    return {
      travelSpeedMmPerMin: speed,
      arcEnergyKJPerMm: used.arcEnergyKJPerMm,
      heatInputKJPerMm: used.heatInputKJPerMm ?? used.arcEnergyKJPerMm,
      jPerIn: used.jPerIn,
      method: used.method,
      beadLengthMm,
    };
  } catch (error) {
    if (error instanceof RangeError) throw new AppError("unprocessable", `The heat input cannot be worked out: ${error.message}.`);
    throw error;
  }
}

export async function recordWeldPass(ctx: ShopContext, jobId: string, stepId: string, input: PassInput) {
  const [existing] = await db()
    .select({ id: weldPass.id, jobId: weldPass.jobId, stepId: weldPass.stepId })
    .from(weldPass)
    .where(and(eq(weldPass.shopId, ctx.shopId), eq(weldPass.clientKey, input.clientKey)));
  if (existing) {
    if (existing.jobId !== jobId || existing.stepId !== stepId) throw new AppError("conflict", "That pass key was used for another step.");
    return { record: await loadRecord(db(), ctx, jobId), passId: existing.id, created: false };
  }
  const pre = await loadRecord(db(), ctx, jobId);
  assertJobOpen(pre);
  const step = findStep(pre, stepId);
  jointOf(step);
  assertUnlocked(step);
  const { spec } = assertRoundOpen(step);
  if (!ctx.roles.includes("welder")) throw new AppError("forbidden", "Only a welder records weld passes.");
  assertRepairRecorded(step);
  if (input.preheatC < spec.minPreheatC) {
    throw new AppError(
      "unprocessable",
      `Measured preheat ${input.preheatC.toFixed(0)} °C is below the ${spec.minPreheatC} °C minimum for joint ${spec.jointId}. Heat the joint to at least ${spec.minPreheatC} °C, measure again, then record the pass.`,
      { preheatC: [`At least ${spec.minPreheatC} °C.`] },
    );
  }
  const wpsRev = pre.wps.find((w) => w.reference === spec.wpsRef.trim().toUpperCase());
  if (!wpsRev) {
    throw new AppError("unprocessable", `Joint ${spec.jointId} is welded to ${spec.wpsRef}, which has no published revision in this shop's WPS library. A lead publishes it before the joint is welded.`);
  }
  if (wpsRev.process && wpsRev.process !== spec.process) {
    throw new AppError("unprocessable", `${wpsRev.reference} is a ${wpsRev.process} procedure, but joint ${spec.jointId} is welded ${spec.process}. A lead corrects the procedure or the WPS first.`);
  }
  const today = new Date().toISOString().slice(0, 10);
  const qualification = await currentQualification({ shopId: ctx.shopId, welderUserId: ctx.userId, process: spec.process, onDate: today });
  if (!qualification.ok) {
    throw new AppError("forbidden", qualification.reason, undefined, { qualification: { process: spec.process, lapsedOn: qualification.lapsedOn ?? null } });
  }
  const figures = passFigures(spec.process, input);
  const position = input.position ?? spec.position;
  const basis = wpsRev.ranges.heatInputBasis ?? "arc-energy";
  const check = checkPassAgainstWps(
    { ...wpsRev.ranges, positions: wpsRev.positions },
    {
      process: spec.process,
      volts: input.volts,
      amps: input.amps,
      travelSpeedMmPerMin: figures.travelSpeedMmPerMin,
      // A machine reading (QW-409.1(c)) is the measured figure on the WPS's basis.
      ...(figures.method !== "voltage-current" ? { heatInputKJPerMm: basis === "iso-q" ? figures.heatInputKJPerMm : figures.arcEnergyKJPerMm } : {}),
      preheatC: input.preheatC,
      ...(input.interpassC !== undefined ? { interpassC: input.interpassC } : {}),
      position,
    },
  );
  if (check.blocked) throw new AppError("unprocessable", `${check.blockedReason} (${wpsRev.reference} revision ${wpsRev.number})`, { preheatC: [check.blockedReason ?? ""] });
  return guarded(
    () =>
      db().transaction(async (tx) => {
        const record = await loadRecord(tx, ctx, jobId, { lock: true });
        assertJobOpen(record);
        const { joint } = assertRoundOpen(findStep(record, stepId));
        const [max] = await tx.select({ n: sql<number>`coalesce(max(${weldPass.passNumber}), 0)::int` }).from(weldPass).where(eq(weldPass.stepId, stepId));
        const passNumber = (max?.n ?? 0) + 1;
        const [row] = await tx
          .insert(weldPass)
          .values({
            shopId: ctx.shopId,
            jobId,
            stepId,
            passNumber,
            round: joint.round,
            welderId: ctx.userId,
            process: spec.process,
            position,
            fillerClassification: spec.filler,
            wpsRevisionId: wpsRev.revisionId,
            wpsReference: wpsRev.reference,
            wpsRevisionNumber: wpsRev.number,
            volts: input.volts,
            amps: input.amps,
            travelSpeedMmPerMin: figures.travelSpeedMmPerMin,
            travelSpeedUnit: input.travelSpeed?.unit ?? (input.beadLength?.unit === "in" ? "in/min" : "mm/min"),
            beadLengthMm: figures.beadLengthMm,
            arcTimeS: input.arcTimeS ?? null,
            machineEnergyKJ: input.machineEnergyKJ ?? null,
            machinePowerW: input.machinePowerW ?? null,
            heatInputMethod: figures.method,
            jPerIn: figures.jPerIn,
            preheatC: input.preheatC,
            interpassC: input.interpassC ?? null,
            fillerLot: input.fillerLot,
            arcEnergyKJPerMm: figures.arcEnergyKJPerMm,
            heatInputKJPerMm: figures.heatInputKJPerMm,
            wpsFindings: check.findings,
            outOfRange: check.outOfRange || check.incomplete,
            clientKey: input.clientKey,
          })
          .returning({ id: weldPass.id });
        // Continuity: every pass is a use of the process by its welder (ASME IX QW-322.1, AWS D1.1).
        await recordProcessUse(tx, { shopId: ctx.shopId, welderUserId: ctx.userId, process: spec.process, date: new Date() });
        await refreshJobState(tx, ctx.shopId, jobId, ctx.userId);
        await logActivity(tx, {
          shopId: ctx.shopId,
          jobId,
          actorId: ctx.userId,
          action: "weld_pass.recorded",
          stepId,
          detail: {
            passNumber,
            round: joint.round,
            joint: spec.jointId,
            wps: `${wpsRev.reference} rev ${wpsRev.number}`,
            heatInputKJPerMm: figures.heatInputKJPerMm,
            preheatC: input.preheatC,
            outOfRange: check.outOfRange || check.incomplete,
            findings: check.findings.filter((f) => !f.ok).map((f) => f.message),
          },
        });
        return { record: await loadRecord(tx, ctx, jobId), passId: row!.id, created: true };
      }),
    "That pass was recorded a moment ago.",
  );
}

/** A lead accepts an out-of-range pass as welded, with a reason and their PIN; the round's sign-off carries it. */
export async function overrideWeldPass(ctx: ShopContext, jobId: string, stepId: string, passId: string, body: { reason: string; pin: string }) {
  const check = (record: JobRecord) => {
    assertJobOpen(record);
    const step = findStep(record, stepId);
    const { spec, joint } = assertRoundOpen(step);
    const pass = record.passes.find((p) => p.id === passId && p.stepId === stepId);
    if (!pass || pass.removed) throw new AppError("not_found", "Weld pass not found on this joint.");
    if (pass.round !== joint.round) throw new AppError("conflict", `Pass ${pass.passNumber} belongs to round ${pass.round}, which is closed.`);
    if (!pass.outOfRange) throw new AppError("conflict", `Pass ${pass.passNumber} of joint ${spec.jointId} is within its WPS; there is nothing to override.`);
    if (pass.override) throw new AppError("conflict", `${pass.override.by.name} already accepted pass ${pass.passNumber}: "${pass.override.reason}".`);
    if (pass.welder.id === ctx.userId) throw new AppError("forbidden", `You welded pass ${pass.passNumber}, so another lead decides on it: nobody passes their own work.`);
    return { spec, pass };
  };
  check(await loadRecord(db(), ctx, jobId));
  await verifyPinLogged(ctx, jobId, stepId, body.pin);
  return guarded(
    () =>
      db().transaction(async (tx) => {
        const { spec, pass } = check(await loadRecord(tx, ctx, jobId, { lock: true }));
        await tx.insert(weldPassOverride).values({ shopId: ctx.shopId, jobId, stepId, passId, reason: body.reason, leadId: ctx.userId, printedName: ctx.legalName });
        await logActivity(tx, {
          shopId: ctx.shopId,
          jobId,
          actorId: ctx.userId,
          action: "weld_pass.overridden",
          stepId,
          detail: { passNumber: pass.passNumber, joint: spec.jointId, reason: body.reason, findings: pass.findings.filter((f) => !f.ok).map((f) => f.message) },
        });
        return loadRecord(tx, ctx, jobId);
      }),
    "That pass was decided on a moment ago.",
  );
}

export async function strikeWeldPass(ctx: ShopContext, jobId: string, stepId: string, passId: string) {
  return guarded(
    () =>
      db().transaction(async (tx) => {
        const record = await loadRecord(tx, ctx, jobId, { lock: true });
        assertJobOpen(record);
        const step = findStep(record, stepId);
        const { joint } = assertRoundOpen(step);
        const pass = record.passes.find((p) => p.id === passId && p.stepId === stepId);
        if (!pass) throw new AppError("not_found", "Weld pass not found on this step.");
        if (pass.removed) return record;
        if (pass.round !== joint.round) throw new AppError("conflict", `Pass ${pass.passNumber} belongs to round ${pass.round}, which is signed; it stays on the record.`);
        if (pass.welder.id !== ctx.userId) throw new AppError("forbidden", `Only ${pass.welder.name}, who recorded pass ${pass.passNumber}, can strike it out.`);
        await tx
          .update(weldPass)
          .set({ removedAt: new Date(), removedBy: ctx.userId })
          .where(and(eq(weldPass.id, passId), eq(weldPass.shopId, ctx.shopId)));
        await logActivity(tx, { shopId: ctx.shopId, jobId, actorId: ctx.userId, action: "weld_pass.struck", stepId, detail: { passNumber: pass.passNumber } });
        return loadRecord(tx, ctx, jobId);
      }),
    "That pass changed a moment ago.",
  );
}
