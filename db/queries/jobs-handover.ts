import "server-only";
// The welder's tablet carried to an inspector: for one sign-off the inspector signs with their own account
// and PIN on it. The signer is resolved here and checked like any signer (role, separation of duties, PIN);
// the session's person is recorded as the one who held the tablet.
import { and, asc, eq, ne, sql } from "drizzle-orm";
import { membership, user } from "@/db/schema";
import { shopContextFor, type ShopContext } from "@/lib/auth/context";
import { db } from "@/lib/db";
import { AppError } from "@/lib/errors";
import type { HandOver } from "@/lib/jobs/schemas";

export type HandOverPerson = { membershipId: string; name: string };

/** The shop's active inspectors other than the person holding the tablet, with a signing PIN set. */
export async function handOverInspectors(ctx: ShopContext): Promise<HandOverPerson[]> {
  return db()
    .select({ membershipId: membership.id, name: membership.legalName })
    .from(membership)
    .where(and(eq(membership.shopId, ctx.shopId), eq(membership.active, true), ne(membership.userId, ctx.userId), sql`'inspector' = any(${membership.roles})`, sql`${membership.pinHash} is not null`))
    .orderBy(asc(membership.legalName));
}

/**
 * Who signs: the session's person, or the inspector the tablet is handed to. The inspector must be an active
 * member of this shop holding the inspector role; their PIN, the step's role and separation of duties are then
 * checked against them by the caller, exactly as if they had signed on their own tablet.
 */
export async function signerFor(ctx: ShopContext, handOver: HandOver | undefined): Promise<ShopContext> {
  if (!handOver) return ctx;
  const [row] = await db()
    .select({ userId: membership.userId, roles: membership.roles, legalName: membership.legalName, name: user.name, email: user.email })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(and(eq(membership.id, handOver.membershipId), eq(membership.shopId, ctx.shopId), eq(membership.active, true)))
    .limit(1);
  if (!row) throw new AppError("not_found", "That person is not an active member of this shop.", { handOver: ["Choose an inspector of this shop."] });
  if (row.userId === ctx.userId) throw new AppError("bad_request", "The tablet is already yours: sign without handing it over.", { handOver: ["Choose another person."] });
  if (!row.roles.includes("inspector")) throw new AppError("forbidden", `${row.legalName} is not an inspector in this shop; only an inspector signs here.`, { handOver: ["Choose an inspector."] });
  const signer = await shopContextFor({ id: row.userId, name: row.name, email: row.email }, ctx.shopId);
  if (!signer || signer.shopId !== ctx.shopId) throw new AppError("forbidden", `${row.legalName} is not an active member of this shop.`);
  return signer;
}

/** What the activity log keeps about a hand-over: who held the tablet the inspector signed on. */
export function tabletHolder(ctx: ShopContext, signer: ShopContext): Record<string, unknown> {
  return signer.userId === ctx.userId ? {} : { handOver: { tabletHeldBy: ctx.userId, tabletHeldByName: ctx.legalName } };
}
