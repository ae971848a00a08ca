import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { requireShop } from "@/lib/auth/context";
import { RecordsSearch } from "./_components/records-search";

export const metadata: Metadata = { title: "Released records" };

export default async function RecordsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await requireShop("audit:search");
  return (
    <>
      <PageHeader title="Released records" lead={`Every released job of ${ctx.shop.name}, read-only, with its record as CSV.`}>
        <Link className="btn btn-quiet" href="/scan">Scan a traveller</Link>
      </PageHeader>
      <RecordsSearch shopId={ctx.shopId} params={await searchParams} action="/records" />
    </>
  );
}
