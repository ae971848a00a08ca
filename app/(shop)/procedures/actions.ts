"use server";
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import {
  changeDraft,
  createProcedure,
  discardDraft,
  getProcedure,
  publishVersion,
  retireVersion,
  startNewVersion,
} from "@/db/queries/procedures";
import { runFormAction, type FormState } from "@/lib/api/action";
import { AppError } from "@/lib/errors";
import {
  addSection,
  deleteSection,
  deleteStep,
  duplicateStep,
  locateStep,
  moveSection,
  moveStep,
  renameSection,
  upsertStep,
} from "@/lib/procedures/edit";
import {
  metaFormSchema,
  newProcedureFormSchema,
  newVersionFormSchema,
  publishFormSchema,
  sectionFormSchema,
  sectionOpSchema,
  stepFormSchema,
  stepOpSchema,
  versionRefSchema,
} from "@/lib/procedures/forms";
import { isTemplateSlug, starterTemplate } from "@/lib/procedures/templates";

function refresh() {
  revalidatePath("/procedures", "layout");
}

const editorPath = (id: string, n: number, query = "") => `/procedures/${id}/versions/${n}/edit${query}`;

export async function createProcedureAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  let target: string | undefined;
  const state = await runFormAction(formData, { schema: newProcedureFormSchema, action: "procedure:write" }, async (value, ctx) => {
    let content;
    if (value.template) {
      if (!isTemplateSlug(value.template)) throw new AppError("bad_request", "Unknown starter template.", { template: ["Choose one of the listed templates."] });
      content = starterTemplate(value.template).content;
    }
    const created = await createProcedure({
      shopId: ctx.shopId,
      actorId: ctx.userId,
      title: value.title,
      scope: value.scope,
      code: value.code,
      content,
      via: value.template ? "template" : "form",
    });
    target = editorPath(created.id, created.number);
    refresh();
    return "Draft created.";
  });
  if (target) redirect(target);
  return state;
}

export async function saveMetaAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  return runFormAction(formData, { schema: metaFormSchema, action: "procedure:write" }, async (value, ctx) => {
    await changeDraft({ shopId: ctx.shopId, procedureId: value.procedureId, number: value.number }, () => ({ title: value.title, scope: value.scope, code: value.code }));
    refresh();
    return "Details saved.";
  });
}

// Content-level errors (a duplicate key or joint) come back with a path into the whole version; the form
// shows them on the field of the step being saved.
function stepFieldErrors(fields: Record<string, string[]>, at: { si: number; ti: number } | null) {
  if (!at) return fields;
  const prefix = `content.sections.${at.si}.steps.${at.ti}.`;
  const out: Record<string, string[]> = {};
  for (const [k, v] of Object.entries(fields)) {
    const name = k.startsWith(prefix) ? `step.${k.slice(prefix.length)}`.replace(/^step\.torqueNm$/, "step.torqueValue") : k;
    (out[name] ??= []).push(...v);
  }
  return out;
}

// On success the editor reopens on the saved step (its key may have changed).
export async function saveStepAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  let target: string | undefined;
  const state = await runFormAction(formData, { schema: stepFormSchema, action: "procedure:write" }, async (value, ctx) => {
    let at: { si: number; ti: number } | null = null;
    let savedKey = value.originalKey ?? "";
    try {
      await changeDraft({ shopId: ctx.shopId, procedureId: value.procedureId, number: value.number }, (current) => {
        const { content, key } = upsertStep(current.content, { sectionKey: value.sectionKey, originalKey: value.originalKey, step: value.step, position: value.position });
        savedKey = key;
        at = locateStep(content, key);
        return { content };
      });
    } catch (error) {
      if (error instanceof AppError && error.fields) throw new AppError(error.code, error.message, stepFieldErrors(error.fields, at));
      throw error;
    }
    refresh();
    target = editorPath(value.procedureId, value.number, `?step=${encodeURIComponent(savedKey)}`);
    return value.originalKey ? `Step “${value.step.title}” saved.` : `Step “${value.step.title}” added.`;
  });
  if (target) redirect(target);
  return state;
}

export async function stepOpAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  let target: string | undefined;
  const state = await runFormAction(formData, { schema: stepOpSchema, action: "procedure:write" }, async (value, ctx) => {
    let message = "";
    await changeDraft({ shopId: ctx.shopId, procedureId: value.procedureId, number: value.number }, (current) => {
      switch (value.op) {
        case "up":
        case "down":
          message = value.op === "up" ? "Moved up." : "Moved down.";
          return { content: moveStep(current.content, value.stepKey, value.op) };
        case "duplicate": {
          const r = duplicateStep(current.content, value.stepKey);
          message = `Duplicated as ${r.key}.`;
          target = editorPath(value.procedureId, value.number, `?step=${encodeURIComponent(r.key)}`);
          return { content: r.content };
        }
        case "delete":
          message = "Step deleted.";
          return { content: deleteStep(current.content, value.stepKey) };
      }
    });
    refresh();
    return message;
  });
  if (target) redirect(target);
  return state;
}

export async function sectionAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  return runFormAction(formData, { schema: sectionFormSchema, action: "procedure:write" }, async (value, ctx) => {
    await changeDraft({ shopId: ctx.shopId, procedureId: value.procedureId, number: value.number }, (current) =>
      value.sectionKey ? { content: renameSection(current.content, value.sectionKey, value.title) } : { content: addSection(current.content, value.title).content },
    );
    refresh();
    return value.sectionKey ? "Section renamed." : `Section “${value.title}” added.`;
  });
}

export async function sectionOpAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  return runFormAction(formData, { schema: sectionOpSchema, action: "procedure:write" }, async (value, ctx) => {
    await changeDraft({ shopId: ctx.shopId, procedureId: value.procedureId, number: value.number }, (current) => {
      if (value.op === "delete") return { content: deleteSection(current.content, value.sectionKey) };
      return { content: moveSection(current.content, value.sectionKey, value.op) };
    });
    refresh();
    return value.op === "delete" ? "Section deleted." : "Section moved.";
  });
}

export async function publishAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  let target: string | undefined;
  const state = await runFormAction(formData, { schema: publishFormSchema, action: "procedure:write" }, async (value, ctx) => {
    const before = await getProcedure(ctx.shopId, value.procedureId);
    const previous = before.allVersions.find((v) => v.number < value.number && v.status !== "draft");
    await publishVersion({
      shopId: ctx.shopId,
      procedureId: value.procedureId,
      number: value.number,
      actorId: ctx.userId,
      changeNote: value.changeNote,
      retirePrevious: value.retirePrevious,
    });
    refresh();
    target = previous
      ? `/procedures/${value.procedureId}/diff?from=${previous.number}&to=${value.number}&published=1`
      : `/procedures/${value.procedureId}/versions/${value.number}?published=1`;
    return `Version ${value.number} published.`;
  });
  if (target) redirect(target);
  return state;
}

export async function retireAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  return runFormAction(formData, { schema: versionRefSchema, action: "procedure:write" }, async (value, ctx) => {
    await retireVersion({ shopId: ctx.shopId, procedureId: value.procedureId, number: value.number, actorId: ctx.userId });
    refresh();
    return `Version ${value.number} retired: it stays readable, new jobs cannot pick it.`;
  });
}

export async function newVersionAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  let target: string | undefined;
  const state = await runFormAction(formData, { schema: newVersionFormSchema, action: "procedure:write" }, async (value, ctx) => {
    const v = await startNewVersion({ shopId: ctx.shopId, procedureId: value.procedureId, actorId: ctx.userId });
    refresh();
    target = editorPath(value.procedureId, v.number);
    return `Version ${v.number} started as a copy of version ${v.from}.`;
  });
  if (target) redirect(target);
  return state;
}

export async function discardDraftAction(_: FormState | undefined, formData: FormData): Promise<FormState> {
  let target: string | undefined;
  const state = await runFormAction(formData, { schema: versionRefSchema, action: "procedure:write" }, async (value, ctx) => {
    const r = await discardDraft({ shopId: ctx.shopId, procedureId: value.procedureId, number: value.number, actorId: ctx.userId });
    refresh();
    target = r.procedureDeleted ? "/procedures" : `/procedures/${value.procedureId}`;
    return "Draft discarded.";
  });
  if (target) redirect(target);
  return state;
}
