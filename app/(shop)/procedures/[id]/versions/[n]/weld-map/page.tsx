import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { getVersion } from "@/db/queries/procedures";
import { requireShop } from "@/lib/auth/context";
import { weldJointIds } from "@/lib/procedures/schema";
import { idOrNotFound, numberOrNotFound, orNotFound } from "../../../../_components/not-found";
import { ProcedureMapEditor } from "./_components/procedure-map-editor";

export const metadata: Metadata = { title: "Weld map" };

export default async function WeldMapPage({ params }: { params: Promise<{ id: string; n: string }> }) {
  const ctx = await requireShop("procedure:write");
  const raw = await params;
  const id = idOrNotFound(raw.id);
  const number = numberOrNotFound(raw.n);
  const v = await orNotFound(getVersion(ctx.shopId, id, number));
  const jointIds = weldJointIds(v.content);
  const images = (v.content.weldMap?.images ?? []).map((i) => ({ id: i.id, url: `/api/procedure-images/${i.id}`, width: i.width, height: i.height, label: i.label }));
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 flex gap-2 text-sm">
        <Link href={`/procedures/${id}/versions/${number}`} className="underline">Version {number}</Link>
      </nav>
      <PageHeader title={`Weld map of “${v.title}” v${number}`} />
      {v.status !== "draft" ? (
        <p>Version {number} is {v.status}: its weld map is sealed with it. Start a new version to change it.</p>
      ) : jointIds.length === 0 ? (
        <p>This version has no weld steps, so there is nothing to place.</p>
      ) : (
        <ProcedureMapEditor base={`/api/procedures/${id}/versions/${number}`} images={images} jointIds={jointIds} joints={v.content.weldMap?.joints ?? []} />
      )}
    </>
  );
}
