import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { membership } from "@/db/schema";
import { db } from "@/lib/db";

export async function myPinState(shopId: string, userId: string) {
  const [row] = await db()
    .select({ hasPin: sql<boolean>`${membership.pinHash} is not null`, locked: sql<boolean>`${membership.pinLockedAt} is not null`, failures: membership.pinFailures })
    .from(membership)
    .where(and(eq(membership.shopId, shopId), eq(membership.userId, userId)));
  return row ?? { hasPin: false, locked: false, failures: 0 };
}

export async function shopHeadcount(shopId: string) {
  const rows = await db().execute<{ role: string; n: number }>(
    sql`select r as role, count(*)::int as n from ${membership}, unnest(${membership.roles}) as r
        where ${membership.shopId} = ${shopId} and ${membership.active} group by r`,
  );
  const counts: Record<string, number> = {};
  for (const r of rows.rows) counts[r.role] = r.n;
  const [noPin] = await db()
    .select({ n: sql<number>`count(*)::int` })
    .from(membership)
    .where(and(eq(membership.shopId, shopId), eq(membership.active, true), sql`${membership.pinHash} is null`));
  return { counts, withoutPin: noPin?.n ?? 0 };
}
