import "server-only";
// Small helpers every job write shares: finding a step on the loaded record and checking the signer's PIN.
// Kept apart from jobs-steps so that jobs-welds, jobs-nc and jobs-photos need not import the step module.
import { verifySigningPin } from "@/db/queries/people";
import type { ShopContext } from "@/lib/auth/context";
import { db } from "@/lib/db";
import { AppError } from "@/lib/errors";
import type { JobRecord, StepView } from "@/lib/jobs/record";
import { logActivity } from "./jobs-core";

export function findStep(record: JobRecord, stepId: string): StepView {
  const step = record.steps.find((s) => s.id === stepId);
  if (!step) throw new AppError("not_found", "Step not found on this job.");
  return step;
}

/** A wrong PIN is counted by verifySigningPin; the attempt is also written to the job's activity log. */
export async function verifyPinLogged(ctx: ShopContext, jobId: string, stepId: string | null, pin: string) {
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
