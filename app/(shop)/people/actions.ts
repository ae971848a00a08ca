"use server";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { membersRoles, resetPin, setActive, setLegalName, setRoles } from "@/db/queries/people";
import { AppError } from "@/lib/errors";
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

// Every active person on the page, with the roles ticked for them: one Save for the whole table.
const rolesSchema = z.object({
  members: z.array(z.object({ membershipId: z.string().uuid(), name: z.string().trim().max(200).default(""), roles: rolesField }), { message: "Nobody to save." }).min(1, "Nobody to save.").max(100),
});

export async function saveRoles(_: FormState | undefined, formData: FormData): Promise<FormState> {
  return runFormAction(formData, { schema: rolesSchema, action: "people:manage" }, async (value, ctx) => {
    // Only the people whose roles changed are written (and logged); the rest stay as they are.
    const current = new Map((await membersRoles(ctx.shopId, value.members.map((m) => m.membershipId))).map((m) => [m.id, m.roles]));
    const changed = value.members.filter((m) => {
      const before = current.get(m.membershipId);
      return !before || before.length !== m.roles.length || m.roles.some((r) => !before.includes(r));
    });
    let saved = 0;
    for (const [i, m] of value.members.entries()) {
      if (!changed.includes(m)) continue;
      try {
        await setRoles({ shopId: ctx.shopId, membershipId: m.membershipId, roles: m.roles, actorId: ctx.userId });
        saved++;
      } catch (error) {
        if (error instanceof AppError) {
          revalidatePath("/people");
          const done = saved ? ` The roles of ${saved} ${saved === 1 ? "person were" : "people were"} saved before this one.` : "";
          throw new AppError(error.code, `${m.name || "One person"}: ${error.message}${done}`, { [`members[${i}].roles`]: [error.message] });
        }
        throw error;
      }
    }
    revalidatePath("/people");
    if (changed.length === 0) return "No roles changed.";
    return changed.length === 1 ? `Roles of ${changed[0]!.name || "1 person"} saved.` : `Roles of ${changed.length} people saved.`;
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
