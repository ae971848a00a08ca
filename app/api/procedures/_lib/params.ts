import "server-only";
import { z } from "zod";
import { assertJsonContentType, readBodyText as readLimitedText } from "@/lib/api/body";
import { AppError } from "@/lib/errors";

const idSchema = z.string().uuid();
const numberSchema = z.coerce.number().int().min(1).max(100_000);

// A malformed id or number is simply a procedure that does not exist here.
export function procedureIdFrom(params: Record<string, unknown>): string {
  const parsed = idSchema.safeParse(params.id);
  if (!parsed.success) throw new AppError("not_found", "Procedure not found.");
  return parsed.data;
}

export function versionNumberFrom(params: Record<string, unknown>, name = "n"): number {
  const parsed = numberSchema.safeParse(params[name]);
  if (!parsed.success) throw new AppError("not_found", "Procedure version not found.");
  return parsed.data;
}

// Reads at most `limit` bytes of a request body (counted as it streams), so an oversized upload is refused
// without being held whole. The body is a JSON file, so only JSON is taken.
export async function readBodyText(req: Request, limit: number): Promise<string> {
  assertJsonContentType(req);
  return readLimitedText(req, limit, `The file is larger than ${Math.round(limit / 1024)} KB; nothing was saved.`);
}
