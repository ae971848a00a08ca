"use server";
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { createQualification, setContinuityCode, updateQualification } from "@/db/queries/qualifications";
import { runFormAction, type FormState } from "@/lib/api/action";
import { continuityCodeSchema, qualificationFormSchema } from "@/lib/welding/qualification-schema";

export async function saveQualificationAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  let created: string | undefined;
  const state = await runFormAction(formData, { schema: qualificationFormSchema, action: "qualification:write" }, async (v, ctx) => {
    if (v.id) {
      // The form holds every field, so an emptied one is cleared; the welder and the process never change.
      await updateQualification({
        shopId: ctx.shopId,
        actorId: ctx.userId,
        id: v.id,
        patch: {
          positions: v.positions,
          thicknessMinMm: v.thicknessMinMm,
          thicknessMaxMm: v.thicknessMaxMm ?? null,
          diameterMinMm: v.diameterMinMm ?? null,
          diameterMaxMm: v.diameterMaxMm ?? null,
          fillerFNumber: v.fillerFNumber,
          testDate: v.testDate,
          wpsId: v.wpsId ?? null,
          notes: v.notes ?? "",
          ...(v.lastUsedOn ? { lastUsedOn: v.lastUsedOn } : {}),
        },
      });
      revalidatePath("/qualifications", "layout");
      return "Qualification saved.";
    }
    const { id } = await createQualification({ shopId: ctx.shopId, actorId: ctx.userId, input: { ...v, notes: v.notes ?? "" } });
    created = id;
    return "Qualification added.";
  });
  if (created) {
    revalidatePath("/qualifications", "layout");
    redirect(`/qualifications/${created}?added=1`);
  }
  // After a save the edit form stays open: keep what the lead typed rather than resetting it.
  return state.ok ? { ...state, initialValue: undefined } : state;
}

export async function setCodeAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  return runFormAction(formData, { schema: continuityCodeSchema, action: "qualification:write" }, async (v, ctx) => {
    await setContinuityCode({ shopId: ctx.shopId, code: v.code, actorId: ctx.userId });
    revalidatePath("/qualifications", "layout");
    revalidatePath("/wps", "layout");
    return "Continuity code saved: every status now follows it.";
  });
}
