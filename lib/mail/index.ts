import "server-only";
import { and, asc, eq, isNull, lt } from "drizzle-orm";
import nodemailer from "nodemailer";
import { mailOutbox } from "@/db/schema";
import { db } from "@/lib/db";
import { env } from "@/lib/env";

type MailAttachment = { filename: string; contentType: string; content: Buffer };
type Mail = { to: string; subject: string; text: string; html: string; shopId?: string | null; attachments?: MailAttachment[] };

const MAX_ATTEMPTS = 8;

function transport() {
  const url = new URL(env().SMTP_URL);
  const secure = url.protocol === "smtps:";
  return nodemailer.createTransport({
    host: url.hostname,
    port: Number(url.port || (secure ? 465 : 587)),
    secure,
    auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
    connectionTimeout: 5000,
    greetingTimeout: 5000,
    socketTimeout: 10_000,
  });
}

// The outbox row is written first, so a mail server that is down never loses or blocks a record.
export async function sendMail(mail: Mail): Promise<{ id: string; sent: boolean }> {
  const [row] = await db()
    .insert(mailOutbox)
    .values({
      shopId: mail.shopId ?? null,
      toAddress: mail.to,
      subject: mail.subject,
      textBody: mail.text,
      htmlBody: mail.html,
      attachments: (mail.attachments ?? []).map((a) => ({ filename: a.filename, contentType: a.contentType, base64: a.content.toString("base64") })),
    })
    .returning({ id: mailOutbox.id });
  const sent = await deliver(row!.id, mail);
  return { id: row!.id, sent };
}

async function deliver(id: string, mail: Mail): Promise<boolean> {
  try {
    await transport().sendMail({
      from: env().MAIL_FROM,
      to: mail.to,
      subject: mail.subject,
      text: mail.text,
      html: mail.html,
      attachments: (mail.attachments ?? []).map((a) => ({ filename: a.filename, contentType: a.contentType, content: a.content })),
      // Lets the local catcher file the mail under its shop; real servers pass it through unread.
      ...(mail.shopId ? { headers: { "X-Gusset-Shop": mail.shopId } } : {}),
    });
    await db().update(mailOutbox).set({ sentAt: new Date(), lastError: null }).where(eq(mailOutbox.id, id));
    return true;
  } catch (error) {
    const message = (error as Error).message;
    console.error(`[mail] could not send "${mail.subject}" to ${mail.to}: ${message}`);
    const [current] = await db().select({ attempts: mailOutbox.attempts }).from(mailOutbox).where(eq(mailOutbox.id, id));
    await db().update(mailOutbox).set({ attempts: (current?.attempts ?? 0) + 1, lastError: message }).where(eq(mailOutbox.id, id));
    return false;
  }
}

// Retries what is still unsent; run by the start script every minute and by hand.
export async function flushOutbox(limit = 50): Promise<{ tried: number; sent: number }> {
  const pending = await db()
    .select()
    .from(mailOutbox)
    .where(and(isNull(mailOutbox.sentAt), lt(mailOutbox.attempts, MAX_ATTEMPTS)))
    .orderBy(asc(mailOutbox.createdAt))
    .limit(limit);
  let sent = 0;
  for (const m of pending) {
    const attachments = m.attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, content: Buffer.from(a.base64, "base64") }));
    if (await deliver(m.id, { to: m.toAddress, subject: m.subject, text: m.textBody, html: m.htmlBody, attachments, shopId: m.shopId })) sent++;
  }
  return { tried: pending.length, sent };
}

function escapeHtml(s: string) {
  return s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);
}

// A plain, branded HTML part; every mail also has a text part with the same words.
export function mailHtml(title: string, paragraphs: string[], action?: { label: string; url: string }) {
  const body = paragraphs.map((p) => `<p style="margin:0 0 12px">${escapeHtml(p)}</p>`).join("");
  const button = action
    ? `<p><a href="${escapeHtml(action.url)}" style="display:inline-block;background:#aec22b;color:#0e1110;padding:10px 16px;border-radius:6px;font-weight:600;text-decoration:none">${escapeHtml(action.label)}</a></p>`
    : "";
  return `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#171b1a;background:#f4f5f4;padding:24px"><div style="max-width:560px;margin:auto;background:#fff;border:1px solid #cdd1cf;border-radius:8px;padding:24px"><h1 style="font-size:20px;margin:0 0 16px">${escapeHtml(title)}</h1>${body}${button}<p style="color:#58605d;font-size:12px;margin-top:24px">Sent by Gusset.</p></div></body></html>`;
}
