// Path parameters of the WPS routes. A malformed id reads as a missing record, as another shop's does.
import { z } from "zod";
import { AppError } from "@/lib/errors";

const idSchema = z.string().uuid();
const numberSchema = z.coerce.number().int().min(1).max(100_000);

export function wpsIdParam(params: Record<string, unknown>): string {
  const parsed = idSchema.safeParse(params.id);
  if (!parsed.success) throw new AppError("not_found", "WPS not found.");
  return parsed.data;
}

export function revisionParam(params: Record<string, unknown>): number {
  const parsed = numberSchema.safeParse(params.n);
  if (!parsed.success) throw new AppError("not_found", "That revision of this WPS was not found.");
  return parsed.data;
}
