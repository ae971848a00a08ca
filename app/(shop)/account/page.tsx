import type { Metadata } from "next";
import { PageHeader } from "@/components/page-header";
import { PinStatus } from "@/components/pin-status";
import { ROLE_LABELS } from "@/lib/authz";
import { requireShop } from "@/lib/auth/context";
import { myPinState } from "@/db/queries/me";
import { PinForm } from "./_components/pin-form";
import { UnitsForm } from "./_components/units-form";

export const metadata: Metadata = { title: "Account" };

export default async function AccountPage() {
  const ctx = await requireShop("shop:read");
  const pin = await myPinState(ctx.shopId, ctx.userId);
  return (
    <>
      <PageHeader title="Account" lead={`${ctx.user.name} · ${ctx.user.email} · ${ctx.roles.map((r) => ROLE_LABELS[r]).join(", ")} at ${ctx.shop.name}`} />
      <div className="grid gap-4 lg:grid-cols-3">
        <PinStatus hasPin={pin.hasPin} locked={pin.locked} showLink={false} />
        <PinForm />
        <UnitsForm current={ctx.unitSystem} />
      </div>
    </>
  );
}
