import Link from "next/link";
import { Wordmark } from "@/components/logo";

// The scanner (camera and QR decoding) is heavy and most visitors arrive by scanning already: it loads only
// when asked for, never prefetched from a verify page.
export default function PublicLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="min-h-screen bg-graphite-50">
      <header className="no-print bg-graphite-900 px-4 py-3 text-white">
        <div className="mx-auto flex max-w-3xl items-center justify-between">
          <Link href="/scan" prefetch={false} className="text-white"><Wordmark /></Link>
          <Link href="/scan" prefetch={false} className="btn btn-quiet">Scan a traveller</Link>
        </div>
      </header>
      <main className="mx-auto max-w-3xl px-4 py-6">{children}</main>
    </div>
  );
}
