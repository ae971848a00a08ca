import "server-only";
import { and, asc, eq, sql } from "drizzle-orm";
import { membership, shop, shopActivity, user } from "@/db/schema";
import { db } from "@/lib/db";
import { AppError } from "@/lib/errors";

type ArchiveAddress = {
  /** the address a lead set, or null */
  email: string | null;
  /** where release seals go now: the set address, else the shop's active leads */
  recipients: string[];
};

// Each release's seal is mailed outside the database; with no address set, the shop's active leads keep it.
export async function archiveAddress(shopId: string): Promise<ArchiveAddress> {
  const [row] = await db().select({ email: shop.archiveEmail }).from(shop).where(eq(shop.id, shopId));
  if (!row) throw new AppError("not_found", "Shop not found.");
  if (row.email) return { email: row.email, recipients: [row.email] };
  const leads = await db()
    .select({ email: user.email })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(and(eq(membership.shopId, shopId), eq(membership.active, true), sql`'lead' = any(${membership.roles})`))
    .orderBy(asc(user.email));
  return { email: null, recipients: leads.map((l) => l.email) };
}

export async function setArchiveAddress(args: { shopId: string; email: string | null; actorId: string }) {
  await db().transaction(async (tx) => {
    const [before] = await tx.select({ email: shop.archiveEmail }).from(shop).where(eq(shop.id, args.shopId)).for("update");
    if (!before) throw new AppError("not_found", "Shop not found.");
    if (before.email === args.email) return;
    await tx.update(shop).set({ archiveEmail: args.email }).where(eq(shop.id, args.shopId));
    await tx.insert(shopActivity).values({ shopId: args.shopId, actorId: args.actorId, action: "shop.archive_email_set", detail: { from: before.email, to: args.email } });
  });
}
