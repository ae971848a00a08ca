import { z } from "zod";
import { ROLES } from "@/lib/authz";

export const signInSchema = z.object({
  email: z.string({ message: "Enter your e-mail address." }).trim().toLowerCase().email("That is not an e-mail address."),
  password: z.string({ message: "Enter your password." }).min(1, "Enter your password."),
});

export const rolesField = z
  .array(z.enum(ROLES, { message: "Unknown role." }), { message: "Choose at least one role." })
  .min(1, "Choose at least one role.")
  .transform((roles) => [...new Set(roles)]);

export const inviteSchema = z.object({
  email: z.string({ message: "Enter an e-mail address." }).trim().toLowerCase().email("That is not an e-mail address.").max(254),
  roles: rolesField,
});

export const acceptInviteSchema = z
  .object({
    token: z.string().min(10),
    name: z.string({ message: "Enter your name as it should appear on sign-offs." }).trim().min(2, "At least 2 characters.").max(80),
    password: z.string({ message: "Choose a password." }).min(10, "At least 10 characters.").max(128),
    confirm: z.string({ message: "Type the password again." }),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ." });
