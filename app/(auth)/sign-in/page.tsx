import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { Suspense } from "react";
import { getSessionUser } from "@/lib/auth/context";
import { SignInForm } from "./_components/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage() {
  if (await getSessionUser()) redirect("/");
  return (
    <>
      <h1 className="mb-1 text-2xl font-bold">Sign in</h1>
      <p className="mb-6 text-graphite-600">Use the e-mail your shop lead invited.</p>
      <Suspense>
        <SignInForm />
      </Suspense>
    </>
  );
}
