import { Wordmark } from "@/components/logo";

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <main className="flex min-h-screen flex-col items-center justify-center bg-graphite-900 px-4 py-12">
      <div className="w-full max-w-md rounded-lg border border-graphite-700 bg-white p-8 shadow-xl">
        <div className="mb-6"><Wordmark /></div>
        {children}
      </div>
      <p className="mt-6 max-w-md text-center text-sm text-graphite-200">
        Weld records, hold points and sealed travellers for axle and frame bracket work.
      </p>
    </main>
  );
}
