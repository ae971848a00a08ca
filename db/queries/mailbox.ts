import "server-only";
import { count, desc } from "drizzle-orm";
import { caughtMail } from "@/db/schema";
import { db } from "@/lib/db";

export async function listCaughtMail(page: number, pageSize: number) {
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
      .orderBy(desc(caughtMail.receivedAt))
      .limit(pageSize)
      .offset((page - 1) * pageSize),
    db().select({ n: count() }).from(caughtMail),
  ]);
  return { rows, total: total?.n ?? 0 };
}
