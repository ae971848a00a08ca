import { z } from "zod";
import { rolesField } from "./auth";

export const peopleQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
  inactive: z.enum(["0", "1"]).default("0"),
});

// The name printed on a person's sign-offs: letters, spaces and the marks names use, no control characters.
export const legalNameField = z
  .string()
  .trim()
  .min(2, "At least 2 characters.")
  .max(120, "At most 120 characters.")
  .regex(/^[^\p{Cc}\p{Cf}]+$/u, "Only letters, spaces and punctuation.");

export const personPatchSchema = z
  .object({ roles: rolesField.optional(), active: z.boolean().optional(), legalName: legalNameField.optional() })
  .strict()
  .refine((v) => v.roles !== undefined || v.active !== undefined || v.legalName !== undefined, { message: "Send roles, active, legalName or a mix." });

export const acceptInviteApiSchema = z.object({
  name: z.string().trim().min(2, "At least 2 characters.").max(80),
  password: z.string().min(10, "At least 10 characters.").max(128),
});

export const pinApiSchema = z.object({ password: z.string().min(1, "Enter your account password."), pin: z.string().regex(/^\d{4,8}$/, "A PIN is 4 to 8 digits, nothing else.") });

// The shop's archive address for release seals; empty or null clears it (the leads get them instead).
// A form sends an empty field as nothing at all, so a missing address clears it too.
export const archiveAddressSchema = z
  .object({
    email: z.preprocess(
      (v) => (v === "" || v === undefined ? null : v),
      z.string().trim().toLowerCase().email("That is not an e-mail address.").max(254).nullable(),
    ),
  })
  .strict();
