import { z } from "zod";
import { pinSchema } from "@/lib/auth/pin-schema";

export const pinFormSchema = z
  .object({
    password: z.string({ message: "Enter your account password." }).min(1, "Enter your account password."),
    pin: pinSchema,
    confirm: z.string({ message: "Type the PIN again." }),
  })
  .refine((v) => v.pin === v.confirm, { path: ["confirm"], message: "The two PINs differ." });

export const unitsSchema = z.object({ unitSystem: z.enum(["metric", "imperial"], { message: "Choose metric or imperial." }) });
