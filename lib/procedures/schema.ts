// Gusset's procedure content: sections of ordered steps, each of one kind. This one schema defines the
// stored version content, the procedure file (import/export) and the starter templates.
import { z } from "zod";
import { procedureWeldMapSchema, type ProcedureWeldMap } from "@/lib/weld-map";

export const STEP_KINDS = ["check", "measure", "photo", "caution", "weld", "hold", "torque", "coating", "geometry"] as const;
export type StepKind = (typeof STEP_KINDS)[number];

export const SIGNER_ROLES = ["welder", "inspector", "lead"] as const;

// Quantities a `measure` step can ask for; values are stored in the unit named here (see lib/units BASE_UNIT).
export const MEASURE_QUANTITIES = {
  length: "mm",
  angle: "deg",
  temperature: "degC",
  thickness: "um",
  torque: "N_m",
  pressure: "kPa",
} as const;
export type MeasureQuantity = keyof typeof MEASURE_QUANTITIES;

const key = z
  .string({ message: "A key is required." })
  .regex(/^[a-z0-9][a-z0-9-]{0,63}$/, "Keys are lower-case letters, digits and dashes (up to 64), starting with a letter or digit.");

const finite = (label: string) => z.number({ message: `${label} must be a number.` }).finite(`${label} must be a finite number.`);

const stepBase = {
  key,
  title: z.string({ message: "A title is required." }).trim().min(1, "A title is required.").max(200, "Titles are at most 200 characters."),
  instructions: z.string().max(20_000, "Instructions are at most 20,000 characters.").default(""),
  signedBy: z.enum(SIGNER_ROLES, { message: "signedBy is welder, inspector or lead." }).default("welder"),
  photos: z
    .object({
      required: z.boolean().default(false),
      min: z.number({ message: "The photo count must be a number." }).int("Photos are counted in whole numbers.").min(0, "The photo count cannot be negative.").max(20, "At most 20 photos can be required.").default(0),
    })
    .strict()
    .default({ required: false, min: 0 })
    .refine((p) => !p.required || p.min >= 1, { message: "A required photo needs min of at least 1.", path: ["min"] }),
};

const tolerance = z.discriminatedUnion(
  "type",
  [
    z.object({ type: z.literal("plusMinus"), plus: finite("The plus tolerance").nonnegative("The plus tolerance cannot be negative."), minus: finite("The minus tolerance").nonnegative("The minus tolerance cannot be negative.") }).strict(),
    z.object({ type: z.literal("range"), min: finite("The minimum"), max: finite("The maximum") }).strict().refine((t) => t.max >= t.min, { message: "The maximum must not be below the minimum.", path: ["max"] }),
    z.object({ type: z.literal("min"), min: finite("The minimum") }).strict(),
    z.object({ type: z.literal("max"), max: finite("The maximum") }).strict(),
  ],
  { message: "tolerance.type is plusMinus, range, min or max." },
);

export const checkStep = z.object({ ...stepBase, kind: z.literal("check") }).strict();
export const measureStep = z
  .object({
    ...stepBase,
    kind: z.literal("measure"),
    quantity: z.enum(Object.keys(MEASURE_QUANTITIES) as [MeasureQuantity, ...MeasureQuantity[]], { message: "Unknown quantity." }),
    nominal: finite("The nominal value").optional(),
    tolerance,
  })
  .strict()
  .refine((s) => s.tolerance.type !== "plusMinus" || s.nominal !== undefined, { message: "A ± tolerance needs a nominal value.", path: ["nominal"] });
export const photoStep = z.object({ ...stepBase, kind: z.literal("photo") }).strict();
export const HAZARDS = ["ppe", "ventilation", "fire-watch", "coatings-removed", "vehicle-supported", "battery-disconnected", "other"] as const;
export const cautionStep = z
  .object({
    ...stepBase,
    kind: z.literal("caution"),
    hazards: z.array(z.enum(HAZARDS, { message: "Unknown hazard." })).min(1, "Name at least one hazard."),
    acknowledgement: z
      .string({ message: "Write what the signer acknowledges." })
      .trim()
      .min(3, "Write what the signer acknowledges (at least 3 characters).")
      .max(500, "At most 500 characters."),
  })
  .strict();
export const WELD_PROCESSES = ["SMAW", "GMAW", "FCAW", "GTAW", "SAW"] as const;
export const JOINT_TYPES = ["fillet", "groove", "plug"] as const;
export const weldStep = z
  .object({
    ...stepBase,
    kind: z.literal("weld"),
    jointId: z.string().regex(/^W\d{1,3}$/, "A joint id is W followed by a number (W1, W2…)."),
    jointType: z.enum(JOINT_TYPES, { message: "Joint type is fillet, groove or plug." }),
    sizeMm: finite("The weld size").positive("The weld size must be above 0 mm.").max(50, "A weld size above 50 mm is not a bracket weld."),
    lengthMm: finite("The weld length").positive("The weld length must be above 0 mm.").max(5000, "At most 5000 mm."),
    position: z.string().trim().regex(/^[1-6](F|G|GR)$/, "Position like 1F, 2F, 3F, 4F, 2G, 5G, 6G."),
    process: z.enum(WELD_PROCESSES, { message: "Process is SMAW, GMAW, FCAW, GTAW or SAW." }),
    wpsRef: z.string({ message: "Name the WPS this weld follows." }).trim().min(1, "Name the WPS this weld follows.").max(60, "At most 60 characters."),
    filler: z.string({ message: "Name the filler metal." }).trim().min(1, "Name the filler metal.").max(60, "At most 60 characters."),
    minPreheatC: finite("The minimum preheat").min(-40, "Preheat below −40 °C is not a preheat.").max(400, "Preheat above 400 °C is outside this procedure's range."),
  })
  .strict();
export const holdStep = z
  .object({
    ...stepBase,
    kind: z.literal("hold"),
    inspection: z
      .string({ message: "Say what the inspector checks at this hold point." })
      .trim()
      .min(3, "Say what the inspector checks at this hold point.")
      .max(2000, "At most 2000 characters."),
  })
  .strict();
export const TORQUE_UNITS = ["N_m", "lbf_ft"] as const;
export const torqueStep = z
  .object({
    ...stepBase,
    kind: z.literal("torque"),
    fastener: z.string({ message: "Name the fastener." }).trim().min(1, "Name the fastener.").max(120, "At most 120 characters."),
    torqueNm: finite("The torque").positive("The torque must be above 0.").max(5000, "At most 5000 N·m."),
    // The unit the maker's figure is given in, for display; the value is always stored in N·m.
    torqueUnit: z.enum(TORQUE_UNITS, { message: "Torque unit is N_m or lbf_ft." }).optional(),
    tolerancePct: finite("The torque tolerance").min(0, "The tolerance cannot be negative.").max(50, "At most ±50 %.").default(10),
    pattern: z.string().max(500, "At most 500 characters.").default(""),
  })
  .strict();
export const coatingStep = z
  .object({
    ...stepBase,
    kind: z.literal("coating"),
    surfacePrep: z.string({ message: "Name the surface preparation grade." }).trim().min(1, "Name the surface preparation grade.").max(120, "At most 120 characters."),
    product: z.string({ message: "Name the coating product." }).trim().min(1, "Name the coating product.").max(120, "At most 120 characters."),
    dewPointMarginC: finite("The dew-point margin").min(0, "The margin cannot be negative.").max(20, "At most 20 °C.").default(3),
    dftMinUm: finite("The minimum DFT").positive("The minimum DFT must be above 0 µm.").max(5000, "At most 5000 µm."),
    dftMaxUm: finite("The maximum DFT").positive("The maximum DFT must be above 0 µm.").max(5000, "At most 5000 µm."),
  })
  .strict()
  .refine((s) => s.dftMaxUm >= s.dftMinUm, { message: "The maximum DFT must not be below the minimum.", path: ["dftMaxUm"] });
export const GEOMETRY_CAPTURES = ["before", "after", "both"] as const;
export const geometryStep = z
  .object({
    ...stepBase,
    kind: z.literal("geometry"),
    capture: z.enum(GEOMETRY_CAPTURES, { message: "capture is before, after or both." }).default("both"),
  })
  .strict();

export const stepSchema = z.discriminatedUnion(
  "kind",
  [checkStep, measureStep, photoStep, cautionStep, weldStep, holdStep, torqueStep, coatingStep, geometryStep],
  { message: `Unknown step kind; use one of ${STEP_KINDS.join(", ")}.` },
);
export type Step = z.output<typeof stepSchema>;
const sectionSchema = z
  .object({
    key,
    title: z.string({ message: "A section title is required." }).trim().min(1, "A section title is required.").max(200, "Titles are at most 200 characters."),
    steps: z.array(stepSchema).max(200, "At most 200 steps in a section."),
  })
  .strict();

// Keys are unique across the whole version; weld joint ids too.
function contentRules(content: { sections: z.output<typeof sectionSchema>[]; weldMap?: ProcedureWeldMap | undefined }, ctx: z.RefinementCtx) {
  const sectionKeys = new Map<string, number>();
  const stepKeys = new Map<string, string>();
  const joints = new Map<string, string>();
  content.sections.forEach((section, si) => {
    if (sectionKeys.has(section.key)) ctx.addIssue({ code: "custom", path: ["sections", si, "key"], message: `Duplicate section key "${section.key}".` });
    sectionKeys.set(section.key, si);
    section.steps.forEach((step, ti) => {
      if (stepKeys.has(step.key)) ctx.addIssue({ code: "custom", path: ["sections", si, "steps", ti, "key"], message: `Duplicate step key "${step.key}" (also in ${stepKeys.get(step.key)}).` });
      stepKeys.set(step.key, section.key);
      if (step.kind === "weld") {
        if (joints.has(step.jointId)) ctx.addIssue({ code: "custom", path: ["sections", si, "steps", ti, "jointId"], message: `Duplicate weld joint "${step.jointId}".` });
        joints.set(step.jointId, step.key);
      }
    });
  });
  // A marker names a joint of this version's weld steps.
  content.weldMap?.joints.forEach((j, i) => {
    if (!joints.has(j.jointId)) ctx.addIssue({ code: "custom", path: ["weldMap", "joints", i, "jointId"], message: `The weld map places ${j.jointId}, but no weld step has that joint.` });
  });
}

const sectionsShape = { sections: z.array(sectionSchema).max(50, "At most 50 sections.") };

/** The content a version-1 procedure file carries: sections of steps, no weld map. */
export const versionContentV1Schema = z.object(sectionsShape).strict().superRefine(contentRules);

/** A version's content: its steps and, when the lead has placed them, where the weld joints are (sealed with it). */
export const versionContentSchema = z
  .object({ ...sectionsShape, weldMap: procedureWeldMapSchema.optional() })
  .strict()
  .superRefine(contentRules);
export type VersionContent = z.output<typeof versionContentSchema>;

/** The weld joint ids of a version, in step order. */
export function weldJointIds(content: { sections: readonly { steps: readonly Step[] }[] }): string[] {
  return content.sections.flatMap((s) => s.steps.flatMap((t) => (t.kind === "weld" ? [t.jointId] : [])));
}

export const procedureMetaSchema = z
  .object({
    title: z.string({ message: "A title is required." }).trim().min(3, "A title of at least 3 characters.").max(200, "Titles are at most 200 characters."),
    scope: z.string({ message: "The scope is text." }).trim().max(4000, "The scope is at most 4000 characters.").default(""),
    code: z.string({ message: "The code or standard is text." }).trim().max(300, "At most 300 characters.").default(""),
  })
  .strict();
