import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { z } from "zod";
import { PageHeader } from "@/components/page-header";
import { requireShop } from "@/lib/auth/context";
import { env } from "@/lib/env";
import { listCaughtMail } from "@/db/queries/mailbox";
import { splitMailLinks } from "@/lib/mail/links";
import Link from "next/link";

export const metadata: Metadata = { title: "Local mailbox" };

const PAGE_SIZE = 15;

export default async function MailboxPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const ctx = await requireShop("mailbox:read");
  if (env().LOCAL_MAILBOX !== "on") notFound();
  const page = z.coerce.number().int().min(1).max(10_000).catch(1).parse((await searchParams).page);
  const { rows, total } = await listCaughtMail(ctx.shopId, page, PAGE_SIZE);
  const pages = Math.max(1, Math.ceil(total / PAGE_SIZE));
  return (
    <>
      <PageHeader title="Local mailbox" lead="Mails the app sent while the local mail catcher stands in for a real mail server. Nothing here left this machine." />
      {rows.length === 0 ? (
        <p className="card p-4 text-graphite-600">No mail caught yet.</p>
      ) : (
        <ol className="space-y-3" data-testid="mailbox">
          {rows.map((m) => (
            <li key={m.id} className="card p-4">
              <details>
                <summary className="cursor-pointer list-none">
                  <div className="flex flex-wrap justify-between gap-2">
                    <span className="font-semibold">{m.subject}</span>
                    <time className="figures text-sm text-graphite-600">{m.receivedAt.toISOString().slice(0, 19).replace("T", " ")} UTC</time>
                  </div>
                  <div className="text-sm text-graphite-600">To {m.toAddress} · from {m.fromAddress}{m.attachments.length ? ` · ${m.attachments.length} attachment(s)` : ""}</div>
                </summary>
                <pre className="mt-3 whitespace-pre-wrap rounded bg-graphite-50 p-3 text-sm">
                  {splitMailLinks(m.textBody).map((part, i) =>
                    part.href ? <a key={i} href={part.href} className="break-all font-semibold underline" data-testid="mail-link">{part.text}</a> : part.text,
                  )}
                </pre>
              </details>
            </li>
          ))}
        </ol>
      )}
      <nav className="mt-4 flex items-center gap-2" aria-label="Pages">
        {page > 1 ? <Link className="btn btn-quiet" href={`/mailbox?page=${page - 1}`}>← Newer</Link> : null}
        <span className="figures">Page {page} of {pages}</span>
        {page < pages ? <Link className="btn btn-quiet" href={`/mailbox?page=${page + 1}`}>Older →</Link> : null}
      </nav>
    </>
  );
}
