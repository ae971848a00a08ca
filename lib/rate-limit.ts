import "server-only";
import { createHash } from "node:crypto";
import { inArray, sql } from "drizzle-orm";
import { rateLimit } from "@/db/schema/auth";
import { db } from "@/lib/db";
import { AppError } from "@/lib/errors";
import { CLIENT_ADDRESS_HEADER } from "@/lib/net/addresses";

// A fixed-window counter in PostgreSQL (the same table better-auth uses), so every app instance shares it.
// The row's last_request holds the window's start, so better-auth's pruning of old rows drops ended windows.
async function countUp(key: string, windowSeconds: number): Promise<number> {
  const now = Date.now();
  const windowStart = now - windowSeconds * 1000;
  const result = await db().execute<{ count: number }>(sql`
    insert into rate_limit (id, key, count, last_request) values (gen_random_uuid()::text, ${key}, 1, ${now})
    on conflict (key) do update set
      count = case when rate_limit.last_request < ${windowStart} then 1 else rate_limit.count + 1 end,
      last_request = case when rate_limit.last_request < ${windowStart} then ${now} else rate_limit.last_request end
    returning count`);
  return Number(result.rows[0]?.count ?? 0);
}

export async function limitOrThrow(bucket: string, client: string, opts: { max: number; windowSeconds: number }) {
  const count = await countUp(`gusset:${bucket}:${client}`, opts.windowSeconds);
  if (count > opts.max) {
    throw new AppError("rate_limited", `Too many look-ups from here. Wait ${opts.windowSeconds} seconds and try again.`);
  }
}

// The address the server in front of the app read from the socket (or from trusted proxies'
// X-Forwarded-For, TRUSTED_PROXY_HOPS); a client cannot choose it.
export function clientAddress(headers: Headers): string {
  return headers.get(CLIENT_ADDRESS_HEADER)?.trim() || "unknown";
}

export type SignInLimits = { perAccountAndAddress: number; perAccount: number; perAddress: number; windowSeconds: number };

// Failed sign-ins are counted three ways: one account from one address (someone guessing at a tablet),
// one account from anywhere (guessing spread over addresses), one address for any account (trying many
// accounts). Successful sign-ins are not counted, so people sharing a tablet do not lock each other out.
function failureCounters(email: string, address: string, limits: SignInLimits) {
  // The e-mail is kept hashed: the counters need not hold who tried.
  const account = createHash("sha256").update(email.trim().toLowerCase()).digest("hex").slice(0, 32);
  return [
    { key: `gusset:sign-in-failures:account-address:${account}:${address}`, max: limits.perAccountAndAddress },
    { key: `gusset:sign-in-failures:account:${account}`, max: limits.perAccount },
    { key: `gusset:sign-in-failures:address:${address}`, max: limits.perAddress },
  ];
}

// Seconds until sign-in is allowed again for this account from this address, or 0 when it is allowed now.
export async function signInWait(email: string, address: string, limits: SignInLimits): Promise<number> {
  const counters = failureCounters(email, address, limits);
  const rows = await db()
    .select({ key: rateLimit.key, count: rateLimit.count, windowStart: rateLimit.lastRequest })
    .from(rateLimit)
    .where(inArray(rateLimit.key, counters.map((c) => c.key)));
  const now = Date.now();
  let wait = 0;
  for (const row of rows) {
    const max = counters.find((c) => c.key === row.key)?.max ?? Infinity;
    const ends = Number(row.windowStart) + limits.windowSeconds * 1000;
    if ((row.count ?? 0) >= max && ends > now) wait = Math.max(wait, Math.ceil((ends - now) / 1000));
  }
  return wait;
}

export async function recordSignInFailure(email: string, address: string, limits: SignInLimits) {
  for (const c of failureCounters(email, address, limits)) await countUp(c.key, limits.windowSeconds);
}

// After a correct password the account's count from that address starts again; the wider counters keep
// running, since a success on one account says nothing about guesses on others.
export async function clearSignInFailures(email: string, address: string, limits: SignInLimits) {
  const [pair] = failureCounters(email, address, limits);
  await db().delete(rateLimit).where(inArray(rateLimit.key, [pair!.key]));
}
