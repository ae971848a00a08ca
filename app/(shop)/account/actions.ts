"use server";
import { revalidatePath } from "next/cache";
import { assertAccountPassword, setOwnPin, setUnitSystem } from "@/db/queries/people";
import { runFormAction, type FormState } from "@/lib/api/action";
import { pinFormSchema, unitsSchema } from "@/lib/schemas/account";

// Setting a PIN asks for the password too: a PIN alone never proves who is at the tablet.
export async function savePin(_: FormState | undefined, formData: FormData): Promise<FormState> {
  return runFormAction(formData, { schema: pinFormSchema, action: "shop:read" }, async (value, ctx) => {
    await assertAccountPassword(ctx.userId, value.password);
    await setOwnPin({ shopId: ctx.shopId, userId: ctx.userId, pin: value.pin });
    revalidatePath("/", "layout");
    return "Signing PIN saved.";
  });
}

export async function saveUnits(_: FormState | undefined, formData: FormData): Promise<FormState> {
  return runFormAction(formData, { schema: unitsSchema, action: "shop:read" }, async (value, ctx) => {
    await setUnitSystem({ shopId: ctx.shopId, userId: ctx.userId, unitSystem: value.unitSystem });
    revalidatePath("/", "layout");
    return value.unitSystem === "imperial" ? "Showing inches, °F, lbf·ft and psi." : "Showing millimetres, °C, N·m and kPa.";
  });
}
