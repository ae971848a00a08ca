import type { Metadata } from "next";
import { PageHeader } from "@/components/page-header";
import { PinStatus } from "@/components/pin-status";
import { requireShop } from "@/lib/auth/context";
import { myPinState } from "@/db/queries/me";

export const metadata: Metadata = { title: "Inspection desk" };

export default async function InspectorHome() {
  const ctx = await requireShop("inspection:sign");
  const pin = await myPinState(ctx.shopId, ctx.userId);
  return (
    <>
      <PageHeader title="Inspection desk" lead={`Hold points and welds waiting for you at ${ctx.shop.name}.`} />
      <div className="grid gap-4 md:grid-cols-2">
        <PinStatus hasPin={pin.hasPin} locked={pin.locked} />
        <section className="card p-4" aria-labelledby="rules-h">
          <h2 id="rules-h" className="font-bold">Your sign-offs</h2>
          <ul className="mt-2 list-disc space-y-1 pl-5">
            <li>You never inspect a weld you made a pass of, whatever roles you hold.</li>
            <li>Inspect welds once they have cooled to ambient temperature.</li>
            <li>Each acceptance or rejection is signed with your PIN and kept for good.</li>
          </ul>
        </section>
      </div>
    </>
  );
}
