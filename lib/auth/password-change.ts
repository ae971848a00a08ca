// A password is changed because someone else may know the old one: every other session of that person ends
// (better-auth signs the changing session in again with a fresh one), whatever the request asked for.
// Called from the auth instance's before-hook; answers the context change for better-auth, or nothing.
export function endOtherSessionsOnPasswordChange(ctx: { path: string; body?: unknown }) {
  if (ctx.path !== "/change-password") return undefined;
  return { context: { body: { ...(ctx.body as Record<string, unknown>), revokeOtherSessions: true } } };
}
