import type { Metadata } from "next";
import { SignOutButton } from "@/app/(shop)/_components/sign-out-button";

export const metadata: Metadata = { title: "No active shop" };

export default function NoShopPage() {
  return (
    <>
      <h1 className="mb-2 text-2xl font-bold">No active shop</h1>
      <p className="mb-4 text-graphite-700">
        You are signed in, but no shop lists you as an active member. Ask a shop lead to invite or reactivate you.
      </p>
      <SignOutButton />
    </>
  );
}
