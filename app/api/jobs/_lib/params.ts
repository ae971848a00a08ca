import "server-only";
import { z } from "zod";
import { can } from "@/lib/authz";
import type { ShopContext } from "@/lib/auth/context";
import { AppError } from "@/lib/errors";

const uuid = z.uuid();

/** A path id that is not a UUID names nothing of this shop: 404, like another shop's record. */
export function idParam(params: Record<string, string | string[] | undefined>, name: string, what: string): string {
  const parsed = uuid.safeParse(params[name]);
  if (!parsed.success) throw new AppError("not_found", `${what} not found.`);
  return parsed.data;
}

// Checklist work is open to the roles that sign steps (welder, lead) and hold points (inspector); the
// step's own rule (lib/jobs/roles) then decides who signs which step. Auditors read only.
export function authorizeChecklistWork(ctx: ShopContext) {
  if (!can(ctx.roles, "step:sign") && !can(ctx.roles, "inspection:sign")) {
    throw new AppError("forbidden", "Only a welder, inspector or lead works on a checklist.");
  }
}
