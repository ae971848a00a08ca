// Kept apart from ./geometry (which carries the steering solver) so readiness checks load without it.

/** Which captures a geometry step needs before it can be signed. */
export function requiredCaptures(capture: "before" | "after" | "both"): ("before" | "after")[] {
  return capture === "both" ? ["before", "after"] : [capture];
}
