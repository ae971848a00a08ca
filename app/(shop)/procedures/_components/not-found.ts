import "server-only";
import { notFound } from "next/navigation";
import { AppError } from "@/lib/errors";

// Another shop's procedure, or one that does not exist, is the same "not found" page.
export async function orNotFound<T>(promise: Promise<T>): Promise<T> {
  try {
    return await promise;
  } catch (error) {
    if (error instanceof AppError && error.code === "not_found") notFound();
    throw error;
  }
}

export function idOrNotFound(value: string): string {
  if (!/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(value)) notFound();
  return value;
}

export function numberOrNotFound(value: string): number {
  const n = Number(value);
  if (!Number.isInteger(n) || n < 1 || n > 100_000) notFound();
  return n;
}
