import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { requireShop } from "@/lib/auth/context";
import { listShopWelders } from "@/db/queries/qualifications";
import { listPublishedWps } from "@/db/queries/wps";
import { QualificationForm } from "../_components/qualification-form";

export const metadata: Metadata = { title: "Add a qualification" };

export default async function NewQualificationPage() {
  const ctx = await requireShop("qualification:write");
  const [welders, wpsOptions] = await Promise.all([listShopWelders(ctx.shopId), listPublishedWps(ctx.shopId)]);
  return (
    <>
      <PageHeader title="Add a qualification" lead="A welder's performance qualification for one process. Continuity starts from the test date.">
        <Link href="/qualifications" className="btn btn-quiet">← Qualifications</Link>
      </PageHeader>
      {welders.length === 0 ? (
        <p className="card p-4">Nobody in the shop holds the welder role yet. Give someone the role on the People page first.</p>
      ) : (
        <div className="max-w-3xl">
          <QualificationForm defaults={{ positions: [] }} welders={welders} wpsOptions={wpsOptions} />
        </div>
      )}
    </>
  );
}
