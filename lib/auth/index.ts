import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { nextCookies } from "better-auth/next-js";
import { account, rateLimit, session, user, verification } from "@/db/schema/auth";
import { db } from "@/lib/db";
import { env } from "@/lib/env";
import { refuseSelfRename } from "./name-guard";

function createAuth() {
  const e = env();
  return betterAuth({
    appName: "Gusset",
    baseURL: e.APP_URL,
    secret: e.BETTER_AUTH_SECRET,
    database: drizzleAdapter(db(), { provider: "pg", schema: { user, session, account, verification, rateLimit } }),
    // People join a shop through a lead's invitation, never by signing themselves up.
    emailAndPassword: { enabled: true, disableSignUp: true, minPasswordLength: 10, maxPasswordLength: 128 },
    session: { expiresIn: 60 * 60 * 12, updateAge: 60 * 60 },
    // Counters live in PostgreSQL so that several app instances share them.
    rateLimit: {
      enabled: true,
      storage: "database",
      window: 60,
      max: 300,
      customRules: { "/sign-in/email": { window: e.AUTH_SIGNIN_WINDOW_SECONDS, max: e.AUTH_SIGNIN_LIMIT } },
    },
    advanced: {
      useSecureCookies: e.SECURE_COOKIES === "on",
      defaultCookieAttributes: { httpOnly: true, sameSite: "lax" },
      ipAddress: { ipAddressHeaders: ["x-forwarded-for"] },
    },
    hooks: { before: refuseSelfRename },
    plugins: [nextCookies()],
  });
}

export type Auth = ReturnType<typeof createAuth>;

const globalForAuth = globalThis as unknown as { gussetAuth?: Auth };

export function getAuth(): Auth {
  globalForAuth.gussetAuth ??= createAuth();
  return globalForAuth.gussetAuth;
}
