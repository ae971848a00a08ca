import type { Metadata } from "next";
import Link from "next/link";
import { z } from "zod";
import { PageHeader } from "@/components/page-header";
import { jointsAwaitingInspection } from "@/db/queries/jobs-welds";
import { requireShop } from "@/lib/auth/context";
import { WaitingJoints } from "./_components/waiting-joints";

export const metadata: Metadata = { title: "Welds waiting for inspection" };

const PAGE_SIZE = 25;
const pageSchema = z.coerce.number().int().min(1).max(10_000).catch(1);

export default async function InspectionsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await requireShop("inspection:sign");
  const raw = (await searchParams).page;
  const page = pageSchema.parse(Array.isArray(raw) ? raw[0] : raw);
  const { rows, total } = await jointsAwaitingInspection(ctx.shopId, ctx.userId, { limit: PAGE_SIZE, offset: (page - 1) * PAGE_SIZE });
  const pages = Math.max(1, Math.ceil(total / PAGE_SIZE));
  return (
    <>
      <PageHeader title="Welds waiting for inspection" lead={`Weld joints at ${ctx.shop.name} whose round is signed by its welder, oldest first. Inspect each once it has cooled to ambient.`}>
        <Link className="btn btn-quiet min-h-12" href="/home/inspector">Inspection desk</Link>
      </PageHeader>
      <section className="card p-4" aria-labelledby="waiting-h">
        <h2 id="waiting-h" className="font-bold">
          <span className="figures" data-testid="welds-waiting-count">{total === 0 ? "None" : `${(page - 1) * PAGE_SIZE + 1}–${Math.min(total, page * PAGE_SIZE)} of ${total}`}</span> waiting
        </h2>
        <WaitingJoints joints={rows} empty={page > 1 ? "No more on this page." : "No weld is waiting for inspection."} />
        {pages > 1 ? (
          <nav aria-label="Pages" className="mt-3 flex flex-wrap items-center gap-2">
            {page > 1 ? <Link className="btn btn-quiet min-h-12" href={`/inspections?page=${page - 1}`}>← Previous</Link> : null}
            <span className="figures">Page {page} of {pages}</span>
            {page < pages ? <Link className="btn btn-quiet min-h-12" href={`/inspections?page=${page + 1}`}>Next →</Link> : null}
          </nav>
        ) : null}
      </section>
    </>
  );
}
