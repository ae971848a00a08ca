import { APIError } from "better-auth/api";

// The name printed on sign-offs is the membership's legal name, which a lead sets and the activity log records.
// An account may not rename itself through the auth API, so no one can take on another person's name.
// Called from the auth instance's before-hook.
export function refuseSelfRename(ctx: { path: string; body?: unknown }) {
  if (ctx.path !== "/update-user") return;
  const body = (ctx.body ?? {}) as Record<string, unknown>;
  if ("name" in body) {
    throw new APIError("FORBIDDEN", {
      message: "Your name on sign-offs is set by a lead of your shop on the People page; it cannot be changed from your account.",
    });
  }
}
