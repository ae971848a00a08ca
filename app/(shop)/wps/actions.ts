"use server";
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { z } from "zod";
import { createWps, publishRevision, retireRevision, saveDraft, startRevision } from "@/db/queries/wps";
import { runFormAction, type FormState } from "@/lib/api/action";
import { changeNoteSchema, formToContent, retireSchema, wpsCreateSchema, wpsDraftFormSchema } from "@/lib/welding/wps-schema";

// redirect() throws on purpose, so it is called after runFormAction has returned, never inside it.

export async function startWpsAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  let created: string | undefined;
  const state = await runFormAction(formData, { schema: wpsCreateSchema, action: "wps:write" }, async (value, ctx) => {
    created = (await createWps({ shopId: ctx.shopId, actorId: ctx.userId, ...value })).id;
    return "Draft started.";
  });
  if (created) redirect(`/wps/${created}/revisions/1/edit`);
  return state;
}

export async function saveDraftAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  const state = await runFormAction(formData, { schema: wpsDraftFormSchema, action: "wps:write" }, async (value, ctx) => {
    await saveDraft({ shopId: ctx.shopId, wpsId: value.wpsId, number: value.number, actorId: ctx.userId, content: formToContent(value) });
    revalidatePath("/wps", "layout");
    return `Draft revision ${value.number} saved.`;
  });
  // The editor stays open after a save: keep what the lead typed on screen instead of resetting the form.
  return state.ok ? { ...state, initialValue: undefined } : state;
}

const revisionRef = { wpsId: z.string().uuid(), number: z.coerce.number().int().min(1) };
const publishFormSchema = z.object({ ...revisionRef, changeNote: changeNoteSchema });

export async function publishAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  let done: { wpsId: string; number: number } | undefined;
  const state = await runFormAction(formData, { schema: publishFormSchema, action: "wps:write" }, async (value, ctx) => {
    await publishRevision({ shopId: ctx.shopId, wpsId: value.wpsId, number: value.number, changeNote: value.changeNote, actorId: ctx.userId });
    done = { wpsId: value.wpsId, number: value.number };
    return `Revision ${value.number} published.`;
  });
  if (done) {
    revalidatePath("/wps", "layout");
    redirect(`/wps/${done.wpsId}?published=${done.number}`);
  }
  return state;
}

const retireFormSchema = z.object({ ...revisionRef, reason: retireSchema.shape.reason });

export async function retireAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  return runFormAction(formData, { schema: retireFormSchema, action: "wps:write" }, async (value, ctx) => {
    await retireRevision({ shopId: ctx.shopId, wpsId: value.wpsId, number: value.number, reason: value.reason, actorId: ctx.userId });
    revalidatePath("/wps", "layout");
    return `Revision ${value.number} retired: the WPS is out of use until a new revision is published.`;
  });
}

const newRevisionSchema = z.object({ wpsId: z.string().uuid() });

export async function newRevisionAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  let started: { wpsId: string; number: number } | undefined;
  const state = await runFormAction(formData, { schema: newRevisionSchema, action: "wps:write" }, async (value, ctx) => {
    const { number } = await startRevision({ shopId: ctx.shopId, wpsId: value.wpsId, actorId: ctx.userId });
    started = { wpsId: value.wpsId, number };
    return `Draft revision ${number} started.`;
  });
  if (started) redirect(`/wps/${started.wpsId}/revisions/${started.number}/edit`);
  return state;
}
