// Whether an open job's due date needs a cue on the lists: past it, or today. Dates are ISO (YYYY-MM-DD), so
// they compare as strings. Released and void jobs are never late.
import type { JobStateName } from "./labels";

type DueCue = "overdue" | "today" | null;

export function dueCue(dueDate: string | null, today: string, status: JobStateName): DueCue {
  if (dueDate === null || status === "released" || status === "void") return null;
  if (dueDate < today) return "overdue";
  return dueDate === today ? "today" : null;
}

/** Word and shape, never colour alone. */
export const DUE_CUE_LABELS: Record<Exclude<DueCue, null>, string> = { overdue: "▲ overdue", today: "● due today" };

export function todayIso(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}
