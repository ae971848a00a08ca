"use client";
import { Logo } from "@/components/logo";

export default function ErrorPage({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main className="flex min-h-screen flex-col items-center justify-center gap-4 bg-graphite-50 px-4 text-center">
      <Logo className="h-14 w-14" />
      <h1 className="text-3xl font-bold">A joint gave way on our side</h1>
      <p className="max-w-md text-graphite-700">Something failed while loading this page. Nothing you had already signed is affected.</p>
      <button type="button" className="btn btn-primary" onClick={reset}>Try again</button>
    </main>
  );
}
