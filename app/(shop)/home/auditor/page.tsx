import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { requireShop } from "@/lib/auth/context";
import { RecordsSearch } from "../../records/_components/records-search";

export const metadata: Metadata = { title: "Record lookup" };

export default async function AuditorHome({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await requireShop("audit:search");
  return (
    <>
      <PageHeader title="Record lookup" lead={`Read-only access to ${ctx.shop.name}'s released records. Scan a traveller's QR code or search.`}>
        <Link className="btn btn-primary" href="/scan">Scan a traveller</Link>
      </PageHeader>
      <RecordsSearch shopId={ctx.shopId} params={await searchParams} action="/home/auditor" />
      <section className="card mt-4 max-w-2xl p-4" aria-labelledby="how-h">
        <h2 id="how-h" className="font-bold">How a record is checked</h2>
        <ol className="mt-2 list-decimal space-y-1 pl-5">
          <li>Every sign-off on a job adds an entry to the job&apos;s record chain.</li>
          <li>The chain&apos;s head, the seal, is printed on the traveller beside its QR code.</li>
          <li>Scanning the code recomputes the chain from the signed records; any changed entry is named.</li>
        </ol>
      </section>
    </>
  );
}
