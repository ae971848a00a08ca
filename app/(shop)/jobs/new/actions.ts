"use server";
import { redirect } from "next/navigation";
import { createJob } from "@/db/queries/jobs";
import { runFormAction, type FormState } from "@/lib/api/action";
import { createJobSchema } from "@/lib/jobs/schemas";

export async function createJobAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  let created: string | null = null;
  const state = await runFormAction(formData, { schema: createJobSchema, action: "job:write" }, async (value, ctx) => {
    const job = await createJob(ctx, value);
    created = job.id;
    return `${job.number} created.`;
  });
  // Outside runFormAction: a redirect is thrown, and must not be caught as a failure.
  if (created) redirect(`/jobs/${created}`);
  return state;
}
