import Link from "next/link";
import { Logo } from "@/components/logo";

export default function NotFound() {
  return (
    <main className="flex min-h-screen flex-col items-center justify-center gap-4 bg-graphite-50 px-4 text-center">
      <Logo className="h-14 w-14" />
      <h1 className="text-3xl font-bold">Nothing welded here</h1>
      <p className="max-w-md text-graphite-700">That page or record does not exist, or it belongs to a shop you are not a member of.</p>
      <Link href="/" className="btn btn-primary">Back to your desk</Link>
    </main>
  );
}
