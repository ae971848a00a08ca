import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { z } from "zod";
import { QueryProvider } from "@/components/runner/query-provider";
import { Runner } from "@/components/runner/runner";
import { getJobRecord } from "@/db/queries/jobs-core";
import { requireShop } from "@/lib/auth/context";
import { AppError } from "@/lib/errors";

export const metadata: Metadata = { title: "Checklist" };
export const dynamic = "force-dynamic";

export default async function RunPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await requireShop("job:read");
  const id = z.uuid().safeParse((await params).id);
  if (!id.success) notFound();
  const step = (await searchParams).step;
  let record;
  try {
    record = await getJobRecord(ctx, id.data);
  } catch (error) {
    if (error instanceof AppError && error.code === "not_found") notFound();
    throw error;
  }
  return (
    <QueryProvider>
      <Runner jobId={id.data} initial={record} initialStepKey={typeof step === "string" ? step : undefined} />
    </QueryProvider>
  );
}
