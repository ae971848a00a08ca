import type { Metadata } from "next";
import { PageHeader } from "@/components/page-header";
import { requireShop } from "@/lib/auth/context";

export const metadata: Metadata = { title: "Record lookup" };

export default async function AuditorHome() {
  const ctx = await requireShop("audit:search");
  return (
    <>
      <PageHeader title="Record lookup" lead={`Read-only access to ${ctx.shop.name}'s records.`} />
      <section className="card max-w-2xl p-4" aria-labelledby="how-h">
        <h2 id="how-h" className="font-bold">How a record is checked</h2>
        <ol className="mt-2 list-decimal space-y-1 pl-5">
          <li>Every sign-off on a job adds an entry to the job&apos;s record chain.</li>
          <li>The chain&apos;s head, the seal, is printed on the traveller beside its QR code.</li>
          <li>Scanning the code recomputes the chain; any changed entry is named.</li>
        </ol>
        <p className="mt-3 text-graphite-600">You can read every record of this shop; you cannot change any.</p>
      </section>
    </>
  );
}
