// Path parameter of the qualification routes. A malformed id reads as a missing record, as another shop's does.
import { z } from "zod";
import { AppError } from "@/lib/errors";

const idSchema = z.string().uuid();

export function qualificationIdParam(params: Record<string, unknown>): string {
  const parsed = idSchema.safeParse(params.id);
  if (!parsed.success) throw new AppError("not_found", "Qualification not found.");
  return parsed.data;
}
