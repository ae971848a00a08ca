import "server-only";
import type { z } from "zod";
import { publicRoute } from "@/lib/api/route";
import { AppError } from "@/lib/errors";
import { isGeometryError } from "@/lib/geometry";

/**
 * A calculator endpoint: parse the body with the calculator's own zod schema (400 with field paths), run the
 * pure computation, answer its result. Open to anyone: the numbers are the caller's and nothing of a shop is
 * read or written. Input that is well-formed but cannot be computed answers 422, never a 500:
 * GeometryError carries its reason; a RangeError from a library means the schema let through something the
 * function refuses, which is still the caller's input, not our fault.
 */
export function calcRoute<S extends z.ZodType>(
  schema: S,
  compute: (body: z.output<S>) => unknown,
  /** Optional gate before computing (a tighter work limit for callers without a session, say). */
  admit?: (body: z.output<S>, principal: () => Promise<unknown>) => Promise<void>,
) {
  return publicRoute({ body: schema }, async ({ body, ctx }) => {
    if (admit) await admit(body as z.output<S>, () => ctx.principal());
    try {
      return compute(body as z.output<S>);
    } catch (error) {
      if (isGeometryError(error)) {
        throw new AppError("unprocessable", `This layout cannot be computed: ${error.message}.`, undefined, { reason: error.reason });
      }
      if (error instanceof RangeError) throw new AppError("unprocessable", `This input cannot be computed: ${error.message}.`);
      throw error;
    }
  });
}
