import "server-only";
import { sql } from "drizzle-orm";
import { db } from "@/lib/db";
import { AppError } from "@/lib/errors";

// A fixed-window counter in PostgreSQL (the same table better-auth uses), so every app instance shares it.
export async function limitOrThrow(bucket: string, client: string, opts: { max: number; windowSeconds: number }) {
  const key = `gusset:${bucket}:${client}`;
  const now = Date.now();
  const windowStart = now - opts.windowSeconds * 1000;
  const result = await db().execute<{ count: number }>(sql`
    insert into rate_limit (id, key, count, last_request) values (gen_random_uuid()::text, ${key}, 1, ${now})
    on conflict (key) do update set
      count = case when rate_limit.last_request < ${windowStart} then 1 else rate_limit.count + 1 end,
      last_request = case when rate_limit.last_request < ${windowStart} then ${now} else rate_limit.last_request end
    returning count`);
  const count = Number(result.rows[0]?.count ?? 0);
  if (count > opts.max) {
    throw new AppError("rate_limited", `Too many look-ups from here. Wait ${opts.windowSeconds} seconds and try again.`);
  }
}

export function clientAddress(headers: Headers): string {
  return headers.get("x-forwarded-for")?.split(",")[0]?.trim() || "unknown";
}
