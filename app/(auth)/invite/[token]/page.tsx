import type { Metadata } from "next";
import Link from "next/link";
import { ROLE_LABELS } from "@/lib/authz";
import { findInvitation } from "@/db/queries/people";
import { AcceptForm } from "./_components/accept-form";

export const metadata: Metadata = { title: "Invitation" };

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const inv = token.length > 10 && token.length < 100 ? await findInvitation(token) : null;
  if (!inv || !inv.usable) {
    return (
      <>
        <h1 className="mb-2 text-2xl font-bold">This invitation cannot be used</h1>
        <p className="mb-4 text-graphite-700">It was used already, withdrawn or has expired. Ask your shop lead to send a new one.</p>
        <Link className="btn btn-quiet" href="/sign-in">Sign in instead</Link>
      </>
    );
  }
  return (
    <>
      <h1 className="mb-1 text-2xl font-bold">Join {inv.shopName}</h1>
      <p className="mb-6 text-graphite-700">
        For <strong>{inv.email}</strong> as {inv.roles.map((r) => ROLE_LABELS[r]).join(", ")}.
      </p>
      <AcceptForm token={token} />
    </>
  );
}
