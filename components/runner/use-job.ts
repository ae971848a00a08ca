"use client";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { JobRecord } from "@/lib/jobs/record";
import { apiJson, type ApiError } from "./api";

export const jobKey = (jobId: string) => ["job", jobId] as const;

export function useJob(jobId: string, initial?: JobRecord) {
  return useQuery<JobRecord, ApiError>({
    queryKey: jobKey(jobId),
    queryFn: () => apiJson<JobRecord>(`/api/jobs/${jobId}`),
    initialData: initial,
    // A second tablet's sign-offs appear within half a minute even when nobody touches this one.
    refetchInterval: 30_000,
  });
}

/** A write that answers with the job's record (or { record }); the cache takes the new record at once. */
export function useJobWrite<V, R = { record: JobRecord } | JobRecord>(jobId: string, send: (vars: V) => Promise<R>) {
  const qc = useQueryClient();
  return useMutation<R, ApiError, V>({
    mutationFn: send,
    onSuccess: (result) => {
      const record = (result as { record?: JobRecord }).record ?? (result as JobRecord);
      if (record && "steps" in record) qc.setQueryData(jobKey(jobId), record);
    },
  });
}

export function useSetRecord(jobId: string) {
  const qc = useQueryClient();
  return (record: JobRecord) => qc.setQueryData(jobKey(jobId), record);
}
