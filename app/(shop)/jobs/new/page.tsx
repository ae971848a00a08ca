import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { jobFormOptions } from "@/db/queries/jobs";
import { requireShop } from "@/lib/auth/context";
import { NewJobForm } from "./_components/new-job-form";

export const metadata: Metadata = { title: "New job" };

export default async function NewJobPage() {
  const ctx = await requireShop("job:write");
  const options = await jobFormOptions(ctx.shopId);
  return (
    <>
      <PageHeader title="New job" lead="The checklist is copied from the chosen procedure version when the job is created; later versions never change it.">
        <Link href="/jobs" className="btn btn-quiet">Back to jobs</Link>
      </PageHeader>
      {options.versions.length === 0 ? (
        <p className="card p-4">No published procedure yet. A lead publishes one under Procedures first.</p>
      ) : (
        <NewJobForm options={options} />
      )}
    </>
  );
}
