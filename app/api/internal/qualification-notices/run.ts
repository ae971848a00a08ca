import "server-only";
// The daily lapsing-notice job: each lead of a shop hears about each qualification that lapses within 30
// days, at the 30, 14, 7 and 1 day stages, never twice in a day (qualification_notice holds the claims).
// Called by POST /api/internal/qualification-notices and by `npx tsx scripts/qualification-notices.ts`.
import { CODE_LABELS, CODE_RULES, noticeStage, todayIso } from "@/lib/welding/qualification-schema";
import { attachNoticeMail, claimNotice, lapsingForNotices, releaseNotice, shopLeads, type LapsingForNotice } from "@/db/queries/qualifications";
import { env } from "@/lib/env";
import { mailHtml, sendMail } from "@/lib/mail";

type NoticeRun = { today: string; lapsing: number; sent: number; queued: number; alreadyNoticed: number };

export function noticeMail(q: LapsingForNotice, lead: { name: string }, appUrl: string) {
  const days = `${q.daysLeft} day${q.daysLeft === 1 ? "" : "s"}`;
  const subject = `${q.welderName}'s ${q.process} qualification lapses on ${q.expiresOn} (in ${days})`;
  const url = `${appUrl.replace(/\/$/, "")}/qualifications?status=lapsing`;
  const paragraphs = [
    `Hello ${lead.name},`,
    `${q.welderName}'s ${q.process} qualification at ${q.shopName} (positions ${q.positions.join(", ")}) lapses on ${q.expiresOn}, in ${days}.`,
    `${q.process} was last used on ${q.lastUsedOn}. The shop follows ${CODE_LABELS[q.code]}: ${CODE_RULES[q.code]}`,
    `To keep it, ${q.welderName} welds with ${q.process} on a job before ${q.expiresOn} and the pass is logged in Gusset; otherwise plan a requalification test.`,
  ];
  const text = `${paragraphs.join("\n\n")}\n\nQualifications lapsing within 30 days: ${url}\n\nSent by Gusset.\n`;
  const html = mailHtml(`${q.process} qualification lapsing: ${q.welderName}`, paragraphs, { label: "Open the qualifications", url });
  return { subject, text, html };
}

export async function runQualificationNotices(opts: { today?: string } = {}): Promise<NoticeRun> {
  const today = opts.today ?? todayIso();
  const lapsing = await lapsingForNotices(today);
  const leadsByShop = new Map<string, Awaited<ReturnType<typeof shopLeads>>>();
  const result: NoticeRun = { today, lapsing: lapsing.length, sent: 0, queued: 0, alreadyNoticed: 0 };
  for (const q of lapsing) {
    const stage = noticeStage(q.daysLeft);
    if (stage === null) continue;
    if (!leadsByShop.has(q.shopId)) leadsByShop.set(q.shopId, await shopLeads(q.shopId));
    for (const lead of leadsByShop.get(q.shopId)!) {
      // The claim comes first, so two runs at once never both mail; a mail that fails to send stays in the
      // outbox and is retried from there.
      const noticeId = await claimNotice({ shopId: q.shopId, qualificationId: q.qualificationId, recipientUserId: lead.userId, noticeOn: today, expiresOn: q.expiresOn, stage });
      if (!noticeId) {
        result.alreadyNoticed++;
        continue;
      }
      const mail = noticeMail(q, lead, env().APP_URL);
      let queued: { id: string; sent: boolean };
      try {
        queued = await sendMail({ to: lead.email, shopId: q.shopId, ...mail });
      } catch (error) {
        // Not even in the outbox: give the claim back so the next run mails it.
        await releaseNotice(noticeId);
        throw error;
      }
      const { id: mailId, sent } = queued;
      await attachNoticeMail(noticeId, mailId);
      if (sent) result.sent++;
      else result.queued++;
    }
  }
  return result;
}
