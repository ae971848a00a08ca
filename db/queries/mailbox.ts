import "server-only";
import { count, desc, eq, isNull, or } from "drizzle-orm";
import { caughtMail } from "@/db/schema";
import { db } from "@/lib/db";

/** Mails caught for this shop, and those sent for no shop in particular. */
export async function listCaughtMail(shopId: string, page: number, pageSize: number) {
  const mine = or(eq(caughtMail.shopId, shopId), isNull(caughtMail.shopId));
  const [rows, [total]] = await Promise.all([
    db()
      .select({
        id: caughtMail.id,
        fromAddress: caughtMail.fromAddress,
        toAddress: caughtMail.toAddress,
        subject: caughtMail.subject,
        textBody: caughtMail.textBody,
        attachments: caughtMail.attachments,
        receivedAt: caughtMail.receivedAt,
      })
      .from(caughtMail)
      .where(mine)
      .orderBy(desc(caughtMail.receivedAt))
      .limit(pageSize)
      .offset((page - 1) * pageSize),
    db().select({ n: count() }).from(caughtMail).where(mine),
  ]);
  return { rows, total: total?.n ?? 0 };
}
