import { z } from "zod";

const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, "A date like 2026-11-30.");

export const auditQuerySchema = z
  .object({
    q: z.string().trim().max(100).optional().transform((v) => v || undefined),
    from: day.optional().or(z.literal("").transform(() => undefined)),
    to: day.optional().or(z.literal("").transform(() => undefined)),
    page: z.coerce.number().int().min(1).max(10_000).default(1),
    pageSize: z.coerce.number().int().min(1).max(100).default(20),
  })
  .refine((v) => !v.from || !v.to || v.from <= v.to, { path: ["to"], message: "The end date is before the start date." });

// The bulk CSV takes the records list's filters; it pages on the server, so no page here.
export const auditExportQuerySchema = z
  .object({
    q: z.string().trim().max(100).optional().transform((v) => v || undefined),
    from: day.optional().or(z.literal("").transform(() => undefined)),
    to: day.optional().or(z.literal("").transform(() => undefined)),
  })
  .refine((v) => !v.from || !v.to || v.from <= v.to, { path: ["to"], message: "The end date is before the start date." });
