import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { APIError, createAuthMiddleware, isAPIError } from "better-auth/api";
import { nextCookies } from "better-auth/next-js";
import { account, rateLimit, session, user, verification } from "@/db/schema/auth";
import { db } from "@/lib/db";
import { env } from "@/lib/env";
import { CLIENT_ADDRESS_HEADER, usesSecureCookies } from "@/lib/net/addresses";
import { clearSignInFailures, clientAddress, recordSignInFailure, signInWait, type SignInLimits } from "@/lib/rate-limit";
import { endOtherSessionsOnPasswordChange } from "./password-change";
import { refuseSelfRename } from "./name-guard";

function signInLimits(): SignInLimits {
  const e = env();
  return {
    perAccountAndAddress: e.AUTH_SIGNIN_LIMIT,
    perAccount: e.AUTH_SIGNIN_ACCOUNT_LIMIT,
    perAddress: e.AUTH_SIGNIN_ADDRESS_LIMIT,
    windowSeconds: e.AUTH_SIGNIN_WINDOW_SECONDS,
  };
}

function minutes(seconds: number) {
  const m = Math.ceil(seconds / 60);
  return m === 1 ? "a minute" : `${m} minutes`;
}

function signInEmailOf(body: unknown): string | null {
  const email = (body as { email?: unknown } | undefined)?.email;
  return typeof email === "string" && email.length <= 320 ? email : null;
}

// Secure cookies (`__Secure-` names) whenever the request came over HTTPS; plain ones only for this
// computer over http, where Safari and others would drop a Secure cookie.
function createAuth(secureCookies: boolean) {
  const e = env();
  const extraOrigins = e.TRUSTED_ORIGINS.split(",").map((o) => o.trim()).filter(Boolean);
  return betterAuth({
    appName: "Gusset",
    baseURL: e.APP_URL,
    secret: e.BETTER_AUTH_SECRET,
    trustedOrigins: [e.APP_URL, ...extraOrigins],
    database: drizzleAdapter(db(), { provider: "pg", schema: { user, session, account, verification, rateLimit } }),
    // People join a shop through a lead's invitation, never by signing themselves up.
    emailAndPassword: { enabled: true, disableSignUp: true, minPasswordLength: 10, maxPasswordLength: 128 },
    session: { expiresIn: 60 * 60 * 12, updateAge: 60 * 60 },
    // Counters live in PostgreSQL so that several app instances share them. The sign-in rule is only a flood
    // guard per address (it counts every attempt); guessing is limited by the failure counters below. Its
    // window also tells better-auth how long to keep counter rows.
    rateLimit: {
      enabled: true,
      storage: "database",
      window: 60,
      max: 300,
      customRules: { "/sign-in/email": { window: e.AUTH_SIGNIN_WINDOW_SECONDS, max: Math.max(100, e.AUTH_SIGNIN_ADDRESS_LIMIT * 5) } },
    },
    hooks: {
      before: createAuthMiddleware(async (ctx) => {
        refuseSelfRename(ctx);
        const passwordChange = endOtherSessionsOnPasswordChange(ctx);
        if (passwordChange) return passwordChange;
        if (ctx.path !== "/sign-in/email") return;
        const email = signInEmailOf(ctx.body);
        if (!email) return;
        const wait = await signInWait(email, clientAddress(new Headers(ctx.headers)), signInLimits());
        if (wait > 0) {
          throw new APIError("TOO_MANY_REQUESTS", {
            message: `Too many failed sign-ins for this account from here. Wait ${minutes(wait)}, then try again.`,
          });
        }
      }),
      after: createAuthMiddleware(async (ctx) => {
        if (ctx.path !== "/sign-in/email") return;
        const email = signInEmailOf(ctx.body);
        if (!email) return;
        const address = clientAddress(new Headers(ctx.headers));
        const returned = ctx.context.returned;
        if (isAPIError(returned)) {
          if (returned.statusCode === 401) await recordSignInFailure(email, address, signInLimits());
        } else if (returned) {
          await clearSignInFailures(email, address, signInLimits());
        }
      }),
    },
    advanced: {
      useSecureCookies: secureCookies,
      defaultCookieAttributes: { httpOnly: true, sameSite: "lax" },
      // Written by the app's own server from the socket (or trusted proxies); never the client's word.
      ipAddress: { ipAddressHeaders: [CLIENT_ADDRESS_HEADER] },
    },
    plugins: [nextCookies()],
  });
}

type Auth = ReturnType<typeof createAuth>;

const globalForAuth = globalThis as unknown as { gussetAuth?: { secure?: Auth; plain?: Auth } };

export function secureCookiesFor(headers: Headers): boolean {
  return usesSecureCookies(headers, env().APP_URL);
}

// The better-auth instance for this request: secure cookies over HTTPS, plain ones on this computer's http.
export function getAuth(headers: Headers): Auth {
  const cache = (globalForAuth.gussetAuth ??= {});
  if (secureCookiesFor(headers)) return (cache.secure ??= createAuth(true));
  return (cache.plain ??= createAuth(false));
}
