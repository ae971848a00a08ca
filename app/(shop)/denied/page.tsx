import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { ACTIONS, homePathFor, ROLE_LABELS, rolesAllowed, type Action } from "@/lib/authz";
import { getShopContext } from "@/lib/auth/context";

export const metadata: Metadata = { title: "Not for your role" };

export default async function DeniedPage({ searchParams }: { searchParams: Promise<{ for?: string }> }) {
  const ctx = await getShopContext();
  const wanted = (await searchParams).for;
  const action = ACTIONS.find((a) => a === wanted) as Action | undefined;
  const who = action ? rolesAllowed(action).map((r) => ROLE_LABELS[r].toLowerCase()).join(" or ") : null;
  return (
    <>
      <PageHeader title="Not for your role" />
      <p className="card max-w-xl p-4" data-testid="denied">
        {who ? `Only a ${who} may open that screen.` : "Your roles do not include that screen."} Ask a lead of your shop if you need it.
      </p>
      <Link className="btn btn-quiet mt-4" href={ctx ? homePathFor(ctx.roles) : "/"}>Back to your desk</Link>
    </>
  );
}
