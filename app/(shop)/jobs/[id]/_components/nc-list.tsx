"use client";
import { useRouter } from "next/navigation";
import { NcCard } from "@/components/runner/nc-panel";
import { QueryProvider } from "@/components/runner/query-provider";
import type { JobRecord } from "@/lib/jobs/record";

// The job page's nonconformances with their disposition forms; after a disposition the page reloads its data.
export function NcList({ record }: { record: JobRecord }) {
  const router = useRouter();
  if (!record.nonconformances.length) return <p className="card p-4">No nonconformances on this job.</p>;
  return (
    <QueryProvider>
      <div className="space-y-3">
        {record.nonconformances.map((nc) => (
          <NcCard key={nc.id} jobId={record.job.id} nc={nc} viewer={record.viewer} photos={record.photos} onChanged={() => router.refresh()} />
        ))}
      </div>
    </QueryProvider>
  );
}
