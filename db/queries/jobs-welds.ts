import "server-only";
// The inspection side of weld joints: the inspector's queue, the visual inspection of a round (accept, or
// reject into a repair round), and the mails that go with them. Material traceability per job lives here
// too: what went into the axle, by heat or lot number.
import { and, eq, inArray, sql } from "drizzle-orm";
import { jobAssignment, jobMaterial, membership, user, weldInspection } from "@/db/schema";
import { shopLeads } from "@/db/queries/qualifications";
import type { ShopContext } from "@/lib/auth/context";
import { db } from "@/lib/db";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { inspectionContent } from "@/lib/jobs/content";
import { inspectionSeparation } from "@/lib/jobs/joint";
import type { JobRecord, StepView } from "@/lib/jobs/record";
import type { InspectionBody, MaterialInput } from "@/lib/jobs/schemas";
import { sendMail, mailHtml } from "@/lib/mail";
import { contentHash } from "@/lib/seal";
import { judgeVisual, visualCriteriaLabel, type VisualVerdict } from "@/lib/welding";
import { appendSignOff, assertJobOpen, guarded, loadRecord, logActivity, refreshJobState } from "./jobs-core";
import { signerFor, tabletHolder } from "./jobs-handover";
import { findStep, verifyPinLogged } from "./jobs-lookup";

function weldStepOf(record: JobRecord, stepId: string): StepView & { joint: NonNullable<StepView["joint"]> } {
  const step = findStep(record, stepId);
  if (!step.joint || step.spec.kind !== "weld") throw new AppError("bad_request", "Only weld joints are inspected this way; a hold point is signed from its step.");
  return step as StepView & { joint: NonNullable<StepView["joint"]> };
}

type Plan = { step: StepView & { joint: NonNullable<StepView["joint"]> }; verdict: VisualVerdict; photos: { id: string; sha256: string }[] };

function checkInspectable(record: JobRecord, ctx: ShopContext, stepId: string, body: InspectionBody): Plan {
  assertJobOpen(record);
  const step = weldStepOf(record, stepId);
  const { joint } = step;
  if (!ctx.roles.includes("inspector")) throw new AppError("forbidden", "Only an inspector inspects welds.");
  if (joint.state === "accepted") throw new AppError("conflict", `Joint ${joint.jointId} is already inspected and accepted.`);
  if (joint.state !== "awaiting_inspection") {
    throw new AppError("conflict", `${joint.round > 1 ? `Repair round ${joint.round}` : "Round 1"} of joint ${joint.jointId} is not signed by its welder yet; it is inspected once every pass is recorded and signed.`);
  }
  const separation = inspectionSeparation(joint, ctx.userId);
  if (separation) throw new AppError("forbidden", separation);
  const photos = [...new Set(body.photoIds)].map((id) => {
    const p = record.photos.find((x) => x.id === id);
    if (!p || p.removed) throw new AppError("unprocessable", "A photo of this inspection is not on this job.", { photoIds: ["Take the photos on this job, then inspect."] });
    return { id: p.id, sha256: p.sha256 };
  });
  const used = new Set(record.inspections.flatMap((i) => i.photoIds));
  if (photos.some((p) => used.has(p.id))) throw new AppError("unprocessable", "A photo is already part of an earlier inspection; take a new one of the joint as it is now.", { photoIds: ["Take a new photo."] });
  const verdict = judgeVisual(body.criteria, body.observations);
  if (body.decision === "accepted" && !verdict.accepted) {
    const failed = verdict.items.filter((i) => !i.ok);
    throw new AppError(
      "unprocessable",
      `The joint cannot be accepted under ${visualCriteriaLabel(body.criteria)}: ${failed.map((i) => `${i.item} (${i.measured}; limit: ${i.limit})`).join("; ")}. Reject it for repair.`,
      { decision: ["The observations fail the criteria: reject the joint."] },
      { verdict },
    );
  }
  if (body.decision === "rejected" && verdict.accepted && body.notes.length < 5) {
    throw new AppError("unprocessable", "Every entry meets the criteria: say what you saw that makes you reject the joint.", { notes: ["Say why the joint is rejected (at least 5 characters)."] });
  }
  return { step, verdict, photos };
}

export async function inspectJoint(holder: ShopContext, jobId: string, stepId: string, body: InspectionBody) {
  // On a hand-over the inspector inspects on the holder's tablet: the checks and the PIN are the inspector's.
  const ctx = await signerFor(holder, body.handOver);
  checkInspectable(await loadRecord(db(), ctx, jobId), ctx, stepId, body);
  await verifyPinLogged(ctx, jobId, stepId, body.pin);
  const result = await guarded(
    () =>
      db().transaction(async (tx) => {
        const record = await loadRecord(tx, ctx, jobId, { lock: true });
        const { step, verdict, photos } = checkInspectable(record, ctx, stepId, body);
        const { joint } = step;
        const round = joint.rounds[joint.round - 1]!;
        const content = inspectionContent({
          job: { id: record.job.id, number: record.job.number },
          step: { id: step.id, key: step.key, jointId: joint.jointId, specHash: contentHash(step.spec) },
          round: joint.round,
          performed: round.performed?.id ?? null,
          passes: round.passes.filter((p) => !p.removed).map((p) => ({ passNumber: p.passNumber, welderId: p.welder.id, heatInputKJPerMm: p.heatInputKJPerMm })),
          criteria: body.criteria,
          observations: body.observations,
          items: verdict.items,
          judged: verdict.verdict,
          decision: body.decision,
          notes: body.notes,
          photos,
        });
        const hash = contentHash(content);
        const so = await appendSignOff(tx, {
          shopId: ctx.shopId,
          jobId,
          stepId,
          userId: ctx.userId,
          printedName: ctx.legalName,
          role: "inspector",
          meaning: "inspected",
          content,
          contentHash: hash,
          round: joint.round,
        });
        const [row] = await tx
          .insert(weldInspection)
          .values({
            shopId: ctx.shopId,
            jobId,
            stepId,
            round: joint.round,
            criteria: body.criteria,
            observations: body.observations,
            items: verdict.items,
            judged: verdict.verdict,
            decision: body.decision,
            notes: body.notes,
            photoIds: photos.map((p) => p.id),
            inspectorId: ctx.userId,
            signOffId: so.id,
            inspectedAt: so.signedAt,
          })
          .returning({ id: weldInspection.id });
        await logActivity(tx, {
          shopId: ctx.shopId,
          jobId,
          actorId: ctx.userId,
          action: body.decision === "accepted" ? "weld.accepted" : "weld.rejected",
          stepId,
          detail: { joint: joint.jointId, round: joint.round, criteria: body.criteria, signOffId: so.id, rejected: verdict.rejectedItems, notes: body.notes, ...tabletHolder(holder, ctx) },
        });
        await refreshJobState(tx, ctx.shopId, jobId, ctx.userId);
        return { record: await loadRecord(tx, holder, jobId), inspectionId: row!.id, verdict };
      }),
    "This joint was inspected a moment ago by someone else.",
  );
  if (body.decision === "rejected") await mailJointRejected(ctx, result.record, stepId, body.notes, result.verdict);
  return result;
}

// --- The inspector's queue -----------------------------------------------------------------------------

export type WaitingJoint = {
  jobId: string;
  jobNumber: string;
  axleTag: string;
  stepId: string;
  /** the runner's ?step= takes the key */
  stepKey: string;
  stepTitle: string;
  jointId: string;
  round: number;
  readyAt: string;
  welderName: string;
  mine: boolean;
  /** the asker made a pass of it, so someone else inspects it */
  ownWeld: boolean;
  outOfRangePasses: number;
};

/** Weld joints whose current round is signed by its welder and not yet inspected, oldest first. */
export async function jointsAwaitingInspection(shopId: string, inspectorId: string, opts: { limit?: number; offset?: number } = {}): Promise<{ rows: WaitingJoint[]; total: number }> {
  const limit = opts.limit ?? 25;
  const offset = opts.offset ?? 0;
  const waiting = sql`
    from sign_off so
    join job_step s on s.id = so.step_id
    join job j on j.id = so.job_id
    where so.shop_id = ${shopId} and so.meaning = 'performed' and s.kind = 'weld' and so.amends_sign_off_id is null
      and j.status not in ('released', 'void')
      and not exists (select 1 from weld_inspection i where i.step_id = s.id and i.round = coalesce(so.round, 1))
      and coalesce(so.round, 1) = 1 + (select count(*) from weld_inspection i where i.step_id = s.id and i.decision = 'rejected')`;
  const [rows, count] = await Promise.all([
    db().execute<{
      job_id: string; job_number: string; axle_tag: string; step_id: string; step_key: string; step_title: string; joint_id: string; round: number; ready_at: Date; welder_name: string; mine: boolean; own_weld: boolean; out_of_range: number;
    }>(sql`
      select j.id as job_id, j.number as job_number, j.axle_tag, s.id as step_id, s.step_key, s.title as step_title, s.spec->>'jointId' as joint_id,
        coalesce(so.round, 1) as round, so.signed_at as ready_at, so.printed_name as welder_name,
        exists (select 1 from ${jobAssignment} a where a.job_id = j.id and a.user_id = ${inspectorId} and a.role = 'inspector') as mine,
        exists (select 1 from weld_pass p where p.step_id = s.id and p.welder_id = ${inspectorId}) as own_weld,
        (select count(*)::int from weld_pass p where p.step_id = s.id and p.round = coalesce(so.round, 1) and p.removed_at is null and p.out_of_range) as out_of_range
      ${waiting}
      order by so.signed_at, s.position
      limit ${limit} offset ${offset}`),
    db().execute<{ n: number }>(sql`select count(*)::int as n ${waiting}`),
  ]);
  return {
    total: count.rows[0]?.n ?? 0,
    rows: rows.rows.map((r) => ({
      jobId: r.job_id,
      jobNumber: r.job_number,
      axleTag: r.axle_tag,
      stepId: r.step_id,
      stepKey: r.step_key,
      stepTitle: r.step_title,
      jointId: r.joint_id,
      round: Number(r.round),
      readyAt: new Date(r.ready_at).toISOString(),
      welderName: r.welder_name,
      mine: r.mine,
      ownWeld: r.own_weld,
      outOfRangePasses: Number(r.out_of_range),
    })),
  };
}

// --- Mails -----------------------------------------------------------------------------------------------

const runUrl = (jobId: string, stepKey: string) => `${env().APP_URL.replace(/\/$/, "")}/run/${jobId}?step=${encodeURIComponent(stepKey)}`;

async function activeMembers(shopId: string, ids: readonly string[]) {
  if (!ids.length) return [];
  return db()
    .select({ id: user.id, name: user.name, email: user.email })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(and(eq(membership.shopId, shopId), eq(membership.active, true), inArray(user.id, [...ids])));
}

async function shopInspectors(shopId: string) {
  return db()
    .select({ id: user.id, name: user.name, email: user.email })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(and(eq(membership.shopId, shopId), eq(membership.active, true), sql`'inspector' = any(${membership.roles})`));
}

/** Mails are written to the outbox and retried; a failure is logged and never undoes the record. */
async function safely(what: string, run: () => Promise<void>) {
  try {
    await run();
  } catch (error) {
    console.error(`[mail] ${what}:`, (error as Error).message);
  }
}

/** Joint ready → the job's inspector (or, with none assigned, every inspector who did not weld it). */
export async function mailJointReady(ctx: ShopContext, record: JobRecord, stepId: string) {
  await safely("joint ready for inspection", async () => {
    const step = weldStepOf(record, stepId);
    const { joint } = step;
    if (joint.state !== "awaiting_inspection") return;
    const assigned = record.job.inspector ? await activeMembers(ctx.shopId, [record.job.inspector.id]) : [];
    const candidates = assigned.length ? assigned : await shopInspectors(ctx.shopId);
    const to = candidates.filter((p) => !joint.welderIds.includes(p.id));
    const round = joint.rounds[joint.round - 1]!;
    const passes = round.passes.filter((p) => !p.removed);
    const flagged = passes.filter((p) => p.outOfRange);
    for (const person of to) {
      const lines = [
        `Hello ${person.name},`,
        `${joint.round > 1 ? `Repair round ${joint.round} of weld joint` : "Weld joint"} ${joint.jointId} ("${step.title}") on job ${record.job.number}, axle ${record.job.axleTag}, is ready for visual inspection.`,
        `${passes.length} ${passes.length === 1 ? "pass was" : "passes were"} signed by ${round.performed?.printedName ?? "its welder"}${flagged.length ? `; ${flagged.length} outside the WPS, each covered by an override or a nonconformance` : ""}.`,
        "Inspect once the weld has cooled to ambient temperature.",
      ];
      await sendMail({
        shopId: ctx.shopId,
        to: person.email,
        subject: `Weld ${joint.jointId} on ${record.job.number} is ready for inspection`,
        text: `${lines.join("\n\n")}\n\nOpen it: ${runUrl(record.job.id, step.key)}\n`,
        html: mailHtml(`Weld ${joint.jointId} ready for inspection`, lines, { label: "Inspect the joint", url: runUrl(record.job.id, step.key) }),
      });
    }
  });
}

/** Joint rejected → everyone who welded it, and the shop's leads. */
async function mailJointRejected(ctx: ShopContext, record: JobRecord, stepId: string, notes: string, verdict: VisualVerdict) {
  await safely("joint rejected", async () => {
    const step = weldStepOf(record, stepId);
    const { joint } = step;
    const rejectedRound = joint.round - 1;
    const welders = await activeMembers(ctx.shopId, joint.welderIds);
    const leads = await shopLeads(ctx.shopId);
    const seen = new Set<string>();
    const failed = verdict.items.filter((i) => !i.ok);
    for (const person of [...welders, ...leads.map((l) => ({ id: l.userId, name: l.name, email: l.email }))]) {
      if (seen.has(person.email)) continue;
      seen.add(person.email);
      const lines = [
        `Hello ${person.name},`,
        `${ctx.user.name} rejected round ${rejectedRound} of weld joint ${joint.jointId} ("${step.title}") on job ${record.job.number}, axle ${record.job.axleTag}.`,
        ...(failed.length ? [`Found: ${failed.map((i) => `${i.item}: ${i.measured} (limit: ${i.limit})`).join("; ")}.`] : []),
        ...(notes ? [`Inspector's note: ${notes}`] : []),
        `The joint is open for repair round ${joint.round}: record the repair passes, sign the round, and it is inspected again.`,
        "Hot work: grind out under extraction, keep a fire watch, and bring the joint back to preheat before welding.",
      ];
      await sendMail({
        shopId: ctx.shopId,
        to: person.email,
        subject: `Weld ${joint.jointId} on ${record.job.number} rejected: repair needed`,
        text: `${lines.join("\n\n")}\n\nOpen it: ${runUrl(record.job.id, step.key)}\n`,
        html: mailHtml(`Weld ${joint.jointId} rejected`, lines, { label: "Open the joint", url: runUrl(record.job.id, step.key) }),
      });
    }
  });
}

// --- Materials ---------------------------------------------------------------------------------------

export async function recordMaterial(ctx: ShopContext, jobId: string, input: MaterialInput) {
  return guarded(
    () =>
      db().transaction(async (tx) => {
        const record = await loadRecord(tx, ctx, jobId, { lock: true });
        assertJobOpen(record);
        const old = input.correctsId ? record.materials.find((m) => m.id === input.correctsId) : undefined;
        if (input.correctsId) {
          if (!old) throw new AppError("not_found", "That material entry is not on this job.");
          if (old.superseded) throw new AppError("conflict", "That entry was corrected already; correct the latest one.");
          if (old.withdrawn) throw new AppError("conflict", "That entry was withdrawn; record the material anew.");
        }
        // A withdrawal says the entry is no longer used; it repeats that entry as it was, whatever was sent.
        if (input.withdrawn && old) input = { ...input, kind: old.kind, description: old.description, specification: old.specification, heatNumber: old.heatNumber, certificate: old.certificate };
        const [row] = await tx
          .insert(jobMaterial)
          .values({
            shopId: ctx.shopId,
            jobId,
            kind: input.kind,
            description: input.description,
            specification: input.specification,
            heatNumber: input.heatNumber,
            certificate: input.certificate,
            correctsId: input.correctsId ?? null,
            withdrawn: input.withdrawn,
            reason: input.correctsId ? input.reason : null,
            recordedBy: ctx.userId,
          })
          .returning({ id: jobMaterial.id });
        await logActivity(tx, {
          shopId: ctx.shopId,
          jobId,
          actorId: ctx.userId,
          action: input.withdrawn ? "material.withdrawn" : input.correctsId ? "material.corrected" : "material.recorded",
          detail: { materialId: row!.id, kind: input.kind, description: input.description, heatNumber: input.heatNumber, ...(input.correctsId ? { corrects: input.correctsId, reason: input.reason } : {}) },
        });
        return { record: await loadRecord(tx, ctx, jobId), materialId: row!.id };
      }),
    "The materials of this job changed a moment ago; reload and try again.",
  );
}
