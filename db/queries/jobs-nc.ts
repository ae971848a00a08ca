import "server-only";
// Nonconformances: raised on a step (by a welder, inspector or lead), dispositioned with a signed decision
// by a lead or inspector who did not raise it. Open ones put the job on hold.
import { and, eq, inArray, isNull, sql } from "drizzle-orm";
import { nonconformance, nonconformanceDisposition, photo } from "@/db/schema";
import type { ShopContext } from "@/lib/auth/context";
import { assertDifferentPeople } from "@/lib/authz";
import { db } from "@/lib/db";
import { AppError } from "@/lib/errors";
import { recordContent } from "@/lib/jobs/content";
import { contentHash } from "@/lib/jobs/hash";
import { DISPOSITION_LABELS, type DispositionName } from "@/lib/jobs/labels";
import { verifySigningPin } from "@/db/queries/people";
import { shopLeads } from "@/db/queries/qualifications";
import { env } from "@/lib/env";
import { mailHtml, sendMail } from "@/lib/mail";
import { appendSignOff, assertJobOpen, guarded, loadRecord, logActivity, refreshJobState } from "./jobs-core";
import { findStep } from "./jobs-lookup";

export async function raiseNonconformance(
  ctx: ShopContext,
  jobId: string,
  input: { stepId: string; description: string; proposedDisposition: DispositionName; photoIds: string[] },
) {
  const result = await guarded(
    () =>
      db().transaction(async (tx) => {
        const record = await loadRecord(tx, ctx, jobId, { lock: true });
        assertJobOpen(record);
        const step = findStep(record, input.stepId);
        const open = record.nonconformances.find((n) => n.stepId === step.id && n.disposition === null);
        if (open) throw new AppError("conflict", `NC-${open.number} is already open on "${step.title}"; add to it or wait for its disposition.`);
        const number = record.nonconformances.reduce((m, n) => Math.max(m, n.number), 0) + 1;
        const [row] = await tx
          .insert(nonconformance)
          .values({
            shopId: ctx.shopId,
            jobId,
            stepId: step.id,
            number,
            description: input.description,
            proposedDisposition: input.proposedDisposition,
            // A weld joint's nonconformance keeps what was out: the round's passes outside their WPS.
            observed: step.joint
              ? {
                  ...(step.effectiveValue ?? {}),
                  round: step.joint.round,
                  outOfRange: record.passes
                    .filter((p) => p.stepId === step.id && !p.removed && p.round === step.joint!.round && p.outOfRange)
                    .map((p) => ({ passNumber: p.passNumber, findings: p.findings.filter((f) => !f.ok).map((f) => f.message) })),
                }
              : (step.effectiveValue ?? {}),
            raisedBy: ctx.userId,
          })
          .returning({ id: nonconformance.id });
        if (input.photoIds.length) {
          const attached = await tx
            .update(photo)
            .set({ nonconformanceId: row!.id })
            .where(and(eq(photo.jobId, jobId), eq(photo.shopId, ctx.shopId), inArray(photo.id, input.photoIds), isNull(photo.nonconformanceId), isNull(photo.removedAt)))
            .returning({ id: photo.id });
          if (attached.length !== new Set(input.photoIds).size) {
            throw new AppError("bad_request", "Some photos are not on this job or belong to another nonconformance.", { photoIds: ["Take the photos on this job first."] });
          }
        }
        await logActivity(tx, {
          shopId: ctx.shopId,
          jobId,
          actorId: ctx.userId,
          action: "nc.raised",
          stepId: step.id,
          detail: { number, proposed: input.proposedDisposition, description: input.description, photos: input.photoIds.length },
        });
        await refreshJobState(tx, ctx.shopId, jobId, ctx.userId);
        return { record: await loadRecord(tx, ctx, jobId), nonconformanceId: row!.id, number };
      }),
    "A nonconformance was raised on this step a moment ago.",
  );
  // The shop's leads hear of it at once; a mail that fails never undoes the record (sent after commit).
  await mailNcRaised(ctx, result.record, result.number, input);
  return result;
}

async function mailNcRaised(ctx: ShopContext, record: Awaited<ReturnType<typeof loadRecord>>, number: number, input: { stepId: string; description: string; proposedDisposition: DispositionName }) {
  try {
    const step = record.steps.find((s) => s.id === input.stepId);
    const url = `${env().APP_URL.replace(/\/$/, "")}/run/${record.job.id}?step=${encodeURIComponent(step?.key ?? "")}`;
    for (const lead of await shopLeads(ctx.shopId)) {
      if (lead.userId === ctx.userId) continue;
      const lines = [
        `Hello ${lead.name},`,
        `${ctx.legalName} raised NC-${number} on job ${record.job.number}, axle ${record.job.axleTag}, at "${step?.title ?? "a step"}".`,
        `What is wrong: ${input.description}`,
        `Proposed disposition: ${DISPOSITION_LABELS[input.proposedDisposition].label}. The job is on hold until a lead or inspector who did not raise it signs the disposition.`,
      ];
      await sendMail({
        shopId: ctx.shopId,
        to: lead.email,
        subject: `NC-${number} raised on ${record.job.number}`,
        text: `${lines.join("\n\n")}\n\nOpen it: ${url}\n`,
        html: mailHtml(`NC-${number} raised on ${record.job.number}`, lines, { label: "Open the step", url }),
      });
    }
  } catch (error) {
    console.error("[mail] nonconformance raised:", (error as Error).message);
  }
}

export async function dispositionNonconformance(ctx: ShopContext, jobId: string, ncId: string, input: { disposition: DispositionName; notes: string; pin: string }) {
  const check = (record: Awaited<ReturnType<typeof loadRecord>>) => {
    assertJobOpen(record);
    const nc = record.nonconformances.find((n) => n.id === ncId);
    if (!nc) throw new AppError("not_found", "Nonconformance not found on this job.");
    if (nc.disposition) {
      throw new AppError("conflict", `NC-${nc.number} was dispositioned "${DISPOSITION_LABELS[nc.disposition.disposition].label}" by ${nc.disposition.decidedBy.name}.`, undefined, {
        current: nc.disposition,
      });
    }
    assertDifferentPeople(ctx.userId, [nc.raisedBy.id], `You raised NC-${nc.number}, so another lead or inspector dispositions it.`);
    return nc;
  };
  check(await loadRecord(db(), ctx, jobId));
  await verifySigningPin({ shopId: ctx.shopId, userId: ctx.userId, pin: input.pin });
  return guarded(
    () =>
      db().transaction(async (tx) => {
        const record = await loadRecord(tx, ctx, jobId, { lock: true });
        const nc = check(record);
        const role = ctx.roles.includes("lead") ? "lead" : "inspector";
        const content = recordContent("disposition", {
          job: { id: record.job.id, number: record.job.number },
          nonconformance: { id: nc.id, number: nc.number, step: nc.stepKey, description: nc.description, observed: nc.observed },
          disposition: input.disposition,
          notes: input.notes,
        });
        const so = await appendSignOff(tx, {
          shopId: ctx.shopId,
          jobId,
          nonconformanceId: nc.id,
          userId: ctx.userId,
          printedName: ctx.legalName,
          role,
          meaning: "dispositioned",
          content,
          contentHash: contentHash(content),
        });
        await tx.insert(nonconformanceDisposition).values({
          shopId: ctx.shopId,
          jobId,
          nonconformanceId: nc.id,
          disposition: input.disposition,
          notes: input.notes,
          decidedBy: ctx.userId,
          signOffId: so.id,
        });
        await logActivity(tx, {
          shopId: ctx.shopId,
          jobId,
          actorId: ctx.userId,
          action: "nc.dispositioned",
          stepId: nc.stepId,
          detail: { number: nc.number, disposition: input.disposition, notes: input.notes, signOffId: so.id },
        });
        await refreshJobState(tx, ctx.shopId, jobId, ctx.userId);
        return { record: await loadRecord(tx, ctx, jobId) };
      }),
    `This nonconformance was dispositioned a moment ago.`,
  );
}

export async function countOpenNonconformances(shopId: string) {
  const [row] = await db()
    .select({ n: sql<number>`count(*)::int` })
    .from(nonconformance)
    .leftJoin(nonconformanceDisposition, eq(nonconformanceDisposition.nonconformanceId, nonconformance.id))
    .where(and(eq(nonconformance.shopId, shopId), isNull(nonconformanceDisposition.id)));
  return row?.n ?? 0;
}
