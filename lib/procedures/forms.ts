// Input schemas of the procedure screens (conform forms) and of the API. Pure: the forms validate in the
// browser with the same schema the server parses.
import { z } from "zod";
import { NM_PER_LBF_FT } from "@/lib/units/factors";
import {
  cautionStep,
  checkStep,
  coatingStep,
  geometryStep,
  holdStep,
  measureStep,
  photoStep,
  procedureMetaSchema,
  TORQUE_UNITS,
  torqueStep,
  versionContentSchema,
  weldStep,
  type Step,
} from "./schema";

export const TORQUE_TO_NM = { N_m: 1, lbf_ft: NM_PER_LBF_FT } as const;

const procedureId = z.string({ message: "Which procedure?" }).uuid("Which procedure?");
const versionNumber = z.number({ message: "Which version?" }).int().min(1);
const key = z.string().regex(/^[a-z0-9][a-z0-9-]{0,63}$/);

// The torque form takes the figure in the maker's unit; the stored step holds N·m.
const torqueFormStep = torqueStep.omit({ torqueNm: true, torqueUnit: true }).extend({
  torqueValue: z.number({ message: "Enter the specified torque." }).finite().positive("The torque must be above 0."),
  torqueUnit: z.enum(TORQUE_UNITS, { message: "Choose N·m or lbf·ft." }),
});

export const stepFormStep = z
  .discriminatedUnion("kind", [checkStep, measureStep, photoStep, cautionStep, weldStep, holdStep, torqueFormStep, coatingStep, geometryStep], {
    message: "Choose a step kind.",
  })
  .transform((s): Step => {
    if (s.kind !== "torque" || !("torqueValue" in s)) return s as Step;
    const { torqueValue, ...rest } = s;
    return { ...rest, torqueNm: torqueValue * TORQUE_TO_NM[s.torqueUnit] };
  });

export const stepFormSchema = z.object({
  procedureId,
  number: versionNumber,
  sectionKey: key,
  originalKey: key.optional(),
  position: z.number().int().min(0).optional(),
  step: stepFormStep,
});

export const metaFormSchema = procedureMetaSchema.extend({ procedureId, number: versionNumber });

export const stepOpSchema = z.object({
  procedureId,
  number: versionNumber,
  stepKey: key,
  op: z.enum(["up", "down", "duplicate", "delete"]),
});

export const sectionFormSchema = z.object({
  procedureId,
  number: versionNumber,
  sectionKey: key.optional(),
  title: z.string({ message: "A section title is required." }).trim().min(1, "A section title is required.").max(200, "Titles are at most 200 characters."),
});

export const sectionOpSchema = z.object({ procedureId, number: versionNumber, sectionKey: key, op: z.enum(["up", "down", "delete"]) });

const changeNote = z
  .string({ message: "Write a change note: what changed and why." })
  .trim()
  .min(5, "Write a change note of at least 5 characters: what changed and why.")
  .max(2000, "Change notes are at most 2000 characters.");

export const publishFormSchema = z.object({ procedureId, number: versionNumber, changeNote, retirePrevious: z.boolean().default(false) });

export const versionRefSchema = z.object({ procedureId, number: versionNumber });

export const newVersionFormSchema = z.object({ procedureId });

export const newProcedureFormSchema = procedureMetaSchema.extend({ template: z.string().max(80).optional() });

// API bodies
export const createProcedureBody = procedureMetaSchema.extend({ content: versionContentSchema.optional() }).strict();

export const patchVersionBody = z
  .object({
    title: z.string().trim().min(3, "A title of at least 3 characters.").max(200, "Titles are at most 200 characters.").optional(),
    scope: z.string().trim().max(4000, "The scope is at most 4000 characters.").optional(),
    code: z.string().trim().max(300, "At most 300 characters.").optional(),
    content: versionContentSchema.optional(),
  })
  .strict()
  .refine((v) => v.title !== undefined || v.scope !== undefined || v.code !== undefined || v.content !== undefined, {
    message: "Send at least one of title, scope, code or content.",
  });

export const publishBody = z.object({ changeNote, retirePrevious: z.boolean().default(true) }).strict();

const LIST_STATES = ["all", "published", "draft", "retired"] as const;
const LIST_SORTS = ["title", "updated"] as const;

export const listQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  state: z.enum(LIST_STATES).default("all"),
  sort: z.enum(LIST_SORTS).default("title"),
  dir: z.enum(["asc", "desc"]).default("asc"),
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
});
export type ListQuery = z.output<typeof listQuerySchema>;
