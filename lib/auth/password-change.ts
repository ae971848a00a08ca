import { createAuthMiddleware } from "better-auth/api";

// A password is changed because someone else may know the old one: every other session of that person ends
// (better-auth signs the changing session in again with a fresh one), whatever the request asked for.
export const endOtherSessionsOnPasswordChange = createAuthMiddleware(async (ctx) => {
  if (ctx.path !== "/change-password") return;
  return { context: { body: { ...(ctx.body as Record<string, unknown>), revokeOtherSessions: true } } };
});
