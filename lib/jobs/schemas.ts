// Request schemas of the jobs API and forms (zod 4). FormData goes through conform's parseWithZod, which
// turns empty fields into undefined, so optional text defaults to "".
import { z } from "zod";
import { pinSchema } from "@/lib/auth/pin-schema";
import { visualCriteriaSchema, visualObservationsSchema } from "@/lib/welding/schema";
import { DISPOSITION_VALUES, JOB_STATE_VALUES } from "./labels";

const text = (max: number, label: string) => z.string().trim().max(max, `${label} is at most ${max} characters.`);
// A field that must be filled: the same words whether it is missing or empty.
const required = (max: number, label: string, missing: string, min = 1) =>
  z.string({ message: missing }).trim().min(min, missing).max(max, `${label} is at most ${max} characters.`);
const optionalText = (max: number, label: string) => text(max, label).optional().transform((v) => v ?? "");
const id = z.string().trim().min(1).max(64);

export const jobFieldsSchema = z.object({
  customerName: required(120, "The customer's name", "Enter the customer's name.", 2),
  customerPhone: optionalText(40, "A phone number").refine((v) => v === "" || /^[+()\d\s./-]{5,40}$/.test(v), "Digits, spaces and + ( ) - . / only."),
  customerEmail: z.email("Enter an e-mail address like name@example.com.").max(200).optional().transform((v) => v ?? ""),
  vehicleYear: z.coerce.number({ message: "A year like 2011." }).int("A whole year.").min(1900, "A year from 1900.").max(2100, "A year up to 2100.").optional(),
  vehicleMakeModel: required(120, "Make and model", "Describe the vehicle (make and model, as free text).", 2),
  vin: optionalText(40, "A VIN"),
  axleDescription: required(200, "The axle description", "Describe the axle or frame part.", 2),
  axleTag: required(60, "The axle tag", "Enter the axle's ID tag."),
  welderIds: z.array(id).max(10, "At most 10 welders.").default([]),
  inspectorId: id.optional(),
  dueDate: z.iso.date("A date like 2026-03-14.").optional(),
  notes: optionalText(4000, "Notes"),
});

export const createJobSchema = jobFieldsSchema.extend({ procedureVersionId: z.uuid("Choose a published procedure version.") });
export type CreateJobInput = z.output<typeof createJobSchema>;

// A header edit names the version it was based on; everything but the pinned procedure may change.
export const updateJobSchema = jobFieldsSchema
  .partial()
  .extend({
    baseVersion: z.number().int().min(1),
    // null clears them
    dueDate: z.iso.date("A date like 2026-03-14.").nullable().optional(),
    inspectorId: id.nullable().optional(),
  })
  .strict();
export type UpdateJobInput = z.output<typeof updateJobSchema>;

export const listJobsQuerySchema = z.object({
  q: z.string().trim().max(100).optional().catch(undefined),
  status: z.enum([...JOB_STATE_VALUES, "open"]).optional().catch(undefined),
  assignee: z.string().trim().max(64).optional().catch(undefined),
  /** "geometry": only jobs with a geometry step not yet signed (somewhere to save a capture). */
  needs: z.enum(["geometry"]).optional().catch(undefined),
  dueFrom: z.iso.date().optional().catch(undefined),
  dueTo: z.iso.date().optional().catch(undefined),
  sort: z.enum(["number", "due", "customer", "status", "progress", "updated"]).catch("number"),
  dir: z.enum(["asc", "desc"]).catch("desc"),
  page: z.coerce.number().int().min(1).max(100_000).catch(1),
  pageSize: z.coerce.number().int().min(1).max(100).catch(25),
});
export type ListJobsQuery = z.output<typeof listJobsQuerySchema>;

export const saveValueSchema = z.object({ baseVersion: z.number().int().min(0), value: z.record(z.string(), z.unknown()) }).strict();

// The welder's tablet handed to an inspector for one sign-off: the inspector is named by their membership
// and the PIN sent is theirs.
export const handOverSchema = z.object({ membershipId: z.uuid("Choose the inspector who signs.") }).strict();
export type HandOver = z.output<typeof handOverSchema>;

export const signStepSchema = z.object({ pin: pinSchema, baseVersion: z.number().int().min(0), handOver: handOverSchema.optional() }).strict();

export const amendStepSchema = z
  .object({
    pin: pinSchema,
    amendsSignOffId: z.uuid(),
    reason: z.string().trim().min(5, "Say why the signed value is corrected (at least 5 characters).").max(1000),
    value: z.record(z.string(), z.unknown()),
  })
  .strict();

const positive = (label: string, max: number) => z.number({ message: `${label} must be a number.` }).gt(0, `${label} above 0.`).max(max, `${label} up to ${max.toLocaleString("en")}.`);

// Travel speed is given, or worked out from bead length and arc time (ASME IX QW-409.1(a)); the machine's
// arc energy or average power, when read, gives the (c) figure instead.
export const weldPassSchema = z
  .object({
    clientKey: z.string().trim().min(8).max(64),
    volts: positive("Volts", 100),
    amps: positive("Amps", 1500),
    travelSpeed: z
      .object({
        value: positive("Travel speed", 20_000),
        unit: z.enum(["mm/min", "in/min"], { message: "Travel speed is in mm/min or in/min." }),
      })
      .optional(),
    beadLength: z.object({ value: positive("Bead length", 10_000), unit: z.enum(["mm", "in"], { message: "Bead length is in mm or in." }) }).optional(),
    arcTimeS: positive("Arc time", 36_000).optional(),
    machineEnergyKJ: positive("Arc energy read from the machine", 100_000).optional(),
    machinePowerW: positive("Average power read from the machine", 200_000).optional(),
    position: z.string().trim().regex(/^[1-6](F|G|GR)$/, "Position like 1F, 2F, 3F, 4F, 2G, 5G, 6G.").optional(),
    preheatC: z.number({ message: "Measured preheat must be a number." }).min(-60).max(700),
    interpassC: z.number({ message: "Interpass must be a number." }).min(-60).max(700).optional(),
    fillerLot: z.string().trim().min(1, "Enter the filler lot or heat number.").max(60),
  })
  .strict()
  .superRefine((p, ctx) => {
    const fromBead = p.beadLength !== undefined || p.arcTimeS !== undefined;
    // The travel speed is always known: given, or bead length over arc time (a machine reading alone has no speed).
    if (!p.travelSpeed && !(p.beadLength && p.arcTimeS !== undefined)) {
      ctx.addIssue({ code: "custom", path: ["travelSpeed"], message: "Enter the travel speed, or the bead length and the arc time." });
    }
    if (p.travelSpeed && fromBead && p.machineEnergyKJ === undefined && p.machinePowerW === undefined) {
      ctx.addIssue({ code: "custom", path: ["beadLength"], message: "Give the travel speed or the bead length and arc time, not both." });
    }
    if (p.machineEnergyKJ !== undefined && p.machinePowerW !== undefined) {
      ctx.addIssue({ code: "custom", path: ["machinePowerW"], message: "Give the machine's arc energy or its average power, not both." });
    }
    if ((p.machineEnergyKJ !== undefined || p.machinePowerW !== undefined) && !p.beadLength) {
      ctx.addIssue({ code: "custom", path: ["beadLength"], message: "A reading from the machine needs the bead length it was welded over." });
    }
    if (p.machinePowerW !== undefined && p.arcTimeS === undefined) {
      ctx.addIssue({ code: "custom", path: ["arcTimeS"], message: "Average power needs the arc time." });
    }
  });
export type WeldPassBody = z.output<typeof weldPassSchema>;

export const overridePassSchema = z
  .object({
    reason: z.string().trim().min(5, "Say why the pass is accepted as it is (at least 5 characters).").max(1000),
    pin: pinSchema,
  })
  .strict();

export const raiseNcSchema = z
  .object({
    stepId: z.uuid(),
    description: z.string().trim().min(5, "Describe what is wrong (at least 5 characters).").max(4000),
    proposedDisposition: z.enum(DISPOSITION_VALUES, { message: "Propose rework, repair, use as is or scrap." }),
    photoIds: z.array(z.uuid()).max(10).default([]),
  })
  .strict();

export const dispositionSchema = z
  .object({
    disposition: z.enum(DISPOSITION_VALUES, { message: "Choose rework, repair, use as is or scrap." }),
    notes: z.string().trim().max(4000).default(""),
    pin: pinSchema,
  })
  .strict();

export const releaseSchema = z.object({ pin: pinSchema }).strict();
export const voidSchema = z.object({ reason: z.string().trim().min(5, "Say why the job is void (at least 5 characters).").max(1000) }).strict();

export { PHOTO_MAX_BYTES } from "./limits";
export const photoFieldsSchema = z.object({
  idempotencyKey: z.string().trim().regex(/^[A-Za-z0-9_-]{8,64}$/, "The upload key is 8 to 64 letters, digits, - or _."),
  stepId: z.uuid().optional(),
  caption: z.string().trim().max(300).default(""),
});

export const MATERIAL_KIND_VALUES = ["base", "filler", "other"] as const;
export const materialSchema = z
  .object({
    kind: z.enum(MATERIAL_KIND_VALUES, { message: "Choose base metal, filler or other." }),
    description: required(200, "The description", "Say what it is (for example: bracket plate 10 mm).", 2),
    specification: optionalText(120, "The specification"),
    heatNumber: required(60, "The heat or lot number", "Enter the heat (cast) or lot number as marked."),
    certificate: optionalText(120, "The certificate reference"),
    correctsId: z.uuid().optional(),
    withdrawn: z.boolean().default(false),
    reason: optionalText(1000, "The reason"),
  })
  .strict()
  .superRefine((m, ctx) => {
    if (m.correctsId && m.reason.length < 5) ctx.addIssue({ code: "custom", path: ["reason"], message: "Say why the entry is corrected (at least 5 characters)." });
    if (m.withdrawn && !m.correctsId) ctx.addIssue({ code: "custom", path: ["withdrawn"], message: "Only an existing entry can be withdrawn." });
  });
export type MaterialInput = z.output<typeof materialSchema>;

// A visual inspection of a weld joint's round: observations judged by the chosen criteria (lib/welding
// judgeVisual), the inspector's decision, at least one photo, signed with the PIN ("inspected").
export const inspectionSchema = z
  .object({
    criteria: visualCriteriaSchema.default("aws-d1.1-static"),
    observations: visualObservationsSchema,
    decision: z.enum(["accepted", "rejected"], { message: "Accept or reject the joint." }),
    notes: z.string().trim().max(4000, "Notes are at most 4,000 characters.").default(""),
    photoIds: z.array(z.uuid()).min(1, "Take at least one photo of the joint as inspected.").max(12, "At most 12 photos."),
    pin: pinSchema,
    handOver: handOverSchema.optional(),
  })
  .strict();
export type InspectionBody = z.output<typeof inspectionSchema>;

// How a rejected weld was removed before its repair round: method, depth and length removed (mm), a photo.
export const repairSchema = z
  .object({
    method: z.enum(["grinding", "air-arc-gouging", "machining", "other"], { message: "Choose how the weld was removed." }),
    methodNote: optionalText(500, "The note on the method"),
    depthMm: z.number({ message: "Depth removed is a number in mm." }).positive("Depth removed is above 0 mm.").max(100, "Depth removed is at most 100 mm."),
    lengthMm: z.number({ message: "Length removed is a number in mm." }).positive("Length removed is above 0 mm.").max(100_000, "Length removed is at most 100 m."),
    photoId: z.uuid("Take a photo of the prepared groove."),
  })
  .strict()
  .refine((r) => r.method !== "other" || r.methodNote.length >= 3, { message: "Say which method was used.", path: ["methodNote"] });
export type RepairBody = z.output<typeof repairSchema>;
