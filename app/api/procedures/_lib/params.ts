import "server-only";
import { z } from "zod";
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

// Reads at most `limit` bytes of a request body, so an oversized upload is refused without being held whole.
export async function readBodyText(req: Request, limit: number): Promise<string> {
  const declared = Number(req.headers.get("content-length") ?? "0");
  const tooLarge = () => new AppError("payload_too_large", `The file is larger than ${Math.round(limit / 1024)} KB; nothing was saved.`);
  if (declared > limit) throw tooLarge();
  if (!req.body) return "";
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel();
      throw tooLarge();
    }
    chunks.push(value);
  }
  return new TextDecoder("utf-8").decode(Buffer.concat(chunks));
}
