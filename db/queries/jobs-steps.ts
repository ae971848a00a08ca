import "server-only";
// Work on a checklist step: saving its value (optimistic concurrency), weld passes, signing with a PIN and
// amending a signed step. Every sign-off of the product is appended in this module or in jobs.ts
// (release) and jobs-nc.ts (disposition) — the places a record chain hooks in.
import { and, eq, sql } from "drizzle-orm";
import { jobStep, weldPass } from "@/db/schema";
import { verifySigningPin } from "@/db/queries/people";
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
import { holdSeparation, priorWorkFrom, unsignedBefore } from "@/lib/jobs/state";
import { parseValue } from "@/lib/jobs/values";
import type { Step } from "@/lib/procedures/schema";
import { heatInput } from "@/lib/welding";
import { appendSignOff, assertJobOpen, guarded, loadRecord, logActivity, refreshJobState, type Exec } from "./jobs-core";

export function findStep(record: JobRecord, stepId: string): StepView {
  const step = record.steps.find((s) => s.id === stepId);
  if (!step) throw new AppError("not_found", "Step not found on this job.");
  return step;
}

const when = (iso: string | null) => (iso ? `${iso.slice(0, 16).replace("T", " ")} UTC` : "");

function assertUnsigned(step: StepView) {
  if (!step.signed) return;
  const first = step.signOffs[0];
  throw new AppError("conflict", `"${step.title}" was signed${first ? ` by ${first.printedName} at ${when(first.signedAt)}` : ""} and is frozen. Correct it with an amendment.`);
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
      throw new AppError("conflict", `A hold point is signed once the work before it is done: ${waiting.length} ${waiting.length === 1 ? "step is" : "steps are"} not signed yet (first: "${waiting[0]!.title}").`);
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
      .filter((p) => p.stepId === step.id && !p.removed)
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
      })),
    acceptedUnder,
    amends,
  });
}

/** A wrong PIN is counted by verifySigningPin; the attempt is also written to the job's activity log. */
async function verifyPinLogged(ctx: ShopContext, jobId: string, stepId: string | null, pin: string) {
  try {
    await verifySigningPin({ shopId: ctx.shopId, userId: ctx.userId, pin });
  } catch (error) {
    if (error instanceof AppError && (error.code === "forbidden" || error.code === "locked") && error.fields?.pin) {
      await logActivity(db(), { shopId: ctx.shopId, jobId, actorId: ctx.userId, action: "sign.refused", stepId, detail: { reason: "wrong PIN", locked: error.code === "locked" } });
    } else if (error instanceof AppError && error.code === "locked") {
      await logActivity(db(), { shopId: ctx.shopId, jobId, actorId: ctx.userId, action: "sign.refused", stepId, detail: { reason: "signing locked" } });
    }
    throw error;
  }
}

export async function signStep(ctx: ShopContext, jobId: string, stepId: string, body: { pin: string; baseVersion: number }) {
  const pre = await loadRecord(db(), ctx, jobId);
  checkSignable(pre, findStep(pre, stepId), ctx, body.baseVersion);
  await verifyPinLogged(ctx, jobId, stepId, body.pin);
  return guarded(
    () =>
      db().transaction(async (tx) => {
        const record = await loadRecord(tx, ctx, jobId, { lock: true });
        const step = findStep(record, stepId);
        const plan = checkSignable(record, step, ctx, body.baseVersion);
        const { content, hash } = signedContent(record, step, plan.meaning, step.value, plan.acceptedUnder);
        const so = await appendSignOff(tx, { shopId: ctx.shopId, jobId, stepId, userId: ctx.userId, printedName: ctx.user.name, role: plan.role, meaning: plan.meaning, content, contentHash: hash });
        await tx
          .update(jobStep)
          .set({ signedAt: so.signedAt, version: sql`${jobStep.version} + 1` })
          .where(and(eq(jobStep.id, stepId), eq(jobStep.jobId, jobId)));
        await logActivity(tx, {
          shopId: ctx.shopId,
          jobId,
          actorId: ctx.userId,
          action: "step.signed",
          stepId,
          detail: { signOffId: so.id, meaning: plan.meaning, role: plan.role, contentHash: hash, acceptedUnder: plan.acceptedUnder },
        });
        await refreshJobState(tx, ctx.shopId, jobId, ctx.userId);
        const after = await loadRecord(tx, ctx, jobId);
        return { record: after, signOffId: so.id };
      }),
    "This step was signed a moment ago by someone else.",
  );
}

export async function amendStep(ctx: ShopContext, jobId: string, stepId: string, body: { pin: string; amendsSignOffId: string; reason: string; value: Record<string, unknown> }) {
  const check = async (x: Exec, lock: boolean) => {
    const record = await loadRecord(x, ctx, jobId, { lock });
    assertJobOpen(record);
    const step = findStep(record, stepId);
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
          printedName: ctx.user.name,
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

export type PassInput = {
  clientKey: string;
  volts: number;
  amps: number;
  travelSpeed: { value: number; unit: "mm/min" | "in/min" };
  preheatC: number;
  interpassC?: number | undefined;
  fillerLot: string;
};

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
  if (step.spec.kind !== "weld") throw new AppError("bad_request", "Weld passes are recorded on weld steps only.");
  assertUnsigned(step);
  assertUnlocked(step);
  if (!ctx.roles.includes("welder")) throw new AppError("forbidden", "Only a welder records weld passes.");
  const spec = step.spec;
  if (input.preheatC < spec.minPreheatC) {
    throw new AppError(
      "unprocessable",
      `Measured preheat ${input.preheatC.toFixed(0)} °C is below the ${spec.minPreheatC} °C minimum for joint ${spec.jointId}. Heat the joint to at least ${spec.minPreheatC} °C, measure again, then record the pass.`,
      { preheatC: [`At least ${spec.minPreheatC} °C.`] },
    );
  }
  const hi = heatInput({ process: spec.process, volts: input.volts, amps: input.amps, travelSpeed: input.travelSpeed });
  const mmPerMin = input.travelSpeed.unit === "in/min" ? input.travelSpeed.value * 25.4 : input.travelSpeed.value;
  return guarded(
    () =>
      db().transaction(async (tx) => {
        const record = await loadRecord(tx, ctx, jobId, { lock: true });
        assertJobOpen(record);
        assertUnsigned(findStep(record, stepId));
        const [max] = await tx.select({ n: sql<number>`coalesce(max(${weldPass.passNumber}), 0)::int` }).from(weldPass).where(eq(weldPass.stepId, stepId));
        const passNumber = (max?.n ?? 0) + 1;
        const [row] = await tx
          .insert(weldPass)
          .values({
            shopId: ctx.shopId,
            jobId,
            stepId,
            passNumber,
            welderId: ctx.userId,
            process: spec.process,
            volts: input.volts,
            amps: input.amps,
            travelSpeedMmPerMin: mmPerMin,
            travelSpeedUnit: input.travelSpeed.unit,
            preheatC: input.preheatC,
            interpassC: input.interpassC ?? null,
            fillerLot: input.fillerLot,
            arcEnergyKJPerMm: hi.arcEnergyKJPerMm,
            heatInputKJPerMm: hi.heatInputKJPerMm,
            clientKey: input.clientKey,
          })
          .returning({ id: weldPass.id });
        await logActivity(tx, {
          shopId: ctx.shopId,
          jobId,
          actorId: ctx.userId,
          action: "weld_pass.recorded",
          stepId,
          detail: { passNumber, joint: spec.jointId, heatInputKJPerMm: hi.heatInputKJPerMm, preheatC: input.preheatC },
        });
        return { record: await loadRecord(tx, ctx, jobId), passId: row!.id, created: true };
      }),
    "That pass was recorded a moment ago.",
  );
}

export async function strikeWeldPass(ctx: ShopContext, jobId: string, stepId: string, passId: string) {
  return guarded(
    () =>
      db().transaction(async (tx) => {
        const record = await loadRecord(tx, ctx, jobId, { lock: true });
        assertJobOpen(record);
        const step = findStep(record, stepId);
        assertUnsigned(step);
        const pass = record.passes.find((p) => p.id === passId && p.stepId === stepId);
        if (!pass) throw new AppError("not_found", "Weld pass not found on this step.");
        if (pass.removed) return record;
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
