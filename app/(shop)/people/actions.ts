"use server";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { resetPin, setActive, setLegalName, setRoles } from "@/db/queries/people";
import { runFormAction, type FormState } from "@/lib/api/action";
import { inviteAndMail } from "@/lib/people/invite";
import { inviteSchema, rolesField } from "@/lib/schemas/auth";
import { archiveAddressSchema, legalNameField } from "@/lib/schemas/people";
import { setArchiveAddress } from "@/db/queries/shop-settings";

export async function invitePerson(_: FormState | undefined, formData: FormData): Promise<FormState> {
  return runFormAction(formData, { schema: inviteSchema, action: "people:manage" }, async (value, ctx) => {
    const { email, sent } = await inviteAndMail(ctx, value.email, value.roles);
    revalidatePath("/people");
    return sent ? `Invitation sent to ${email}.` : `Invitation saved for ${email}; the mail will be retried.`;
  });
}

const rolesSchema = z.object({ membershipId: z.string().uuid(), roles: rolesField });

export async function saveRoles(_: FormState | undefined, formData: FormData): Promise<FormState> {
  return runFormAction(formData, { schema: rolesSchema, action: "people:manage" }, async (value, ctx) => {
    await setRoles({ shopId: ctx.shopId, membershipId: value.membershipId, roles: value.roles, actorId: ctx.userId });
    revalidatePath("/people");
    return "Roles saved.";
  });
}

const activeSchema = z.object({ membershipId: z.string().uuid(), active: z.enum(["true", "false"]).transform((v) => v === "true") });

export async function saveActive(_: FormState | undefined, formData: FormData): Promise<FormState> {
  return runFormAction(formData, { schema: activeSchema, action: "people:manage" }, async (value, ctx) => {
    await setActive({ shopId: ctx.shopId, membershipId: value.membershipId, active: value.active, actorId: ctx.userId });
    revalidatePath("/people");
    return value.active ? "Reactivated." : "Deactivated; past sign-offs stay readable.";
  });
}

const pinResetSchema = z.object({ membershipId: z.string().uuid() });

export async function resetMemberPin(_: FormState | undefined, formData: FormData): Promise<FormState> {
  return runFormAction(formData, { schema: pinResetSchema, action: "pin:reset" }, async (value, ctx) => {
    await resetPin({ shopId: ctx.shopId, membershipId: value.membershipId, actorId: ctx.userId });
    revalidatePath("/people");
    return "PIN cleared; they set a new one on their Account page.";
  });
}

const legalNameSchema = z.object({ membershipId: z.string().uuid(), legalName: legalNameField });

export async function saveLegalName(_: FormState | undefined, formData: FormData): Promise<FormState> {
  return runFormAction(formData, { schema: legalNameSchema, action: "people:manage" }, async (value, ctx) => {
    await setLegalName({ shopId: ctx.shopId, membershipId: value.membershipId, legalName: value.legalName, actorId: ctx.userId });
    revalidatePath("/people");
    return "Printed name saved; sign-offs already made keep the name they were signed with.";
  });
}

export async function saveArchiveAddress(_: FormState | undefined, formData: FormData): Promise<FormState> {
  return runFormAction(formData, { schema: archiveAddressSchema, action: "shop:manage" }, async (value, ctx) => {
    await setArchiveAddress({ shopId: ctx.shopId, email: value.email, actorId: ctx.userId });
    revalidatePath("/people");
    return value.email ? `Release seals go to ${value.email}.` : "Release seals go to the shop's leads.";
  });
}
