// Welder qualifications: the words, and the zod schemas the API and the lead's forms share. Pure.
import { z } from "zod";
import { CONTINUITY_CODES, parseIsoDate, type ContinuityCode, type ContinuityStatus } from "@/lib/welding";
import { WPS_POSITIONS, WPS_PROCESSES } from "./wps-schema";

export const CONTINUITY_STATUSES = ["current", "lapsing", "lapsed"] as const satisfies readonly ContinuityStatus[];

export const CONTINUITY_STATUS_LABELS: Record<ContinuityStatus, string> = {
  current: "Current",
  lapsing: "Lapsing",
  lapsed: "Lapsed",
};

export const CODE_LABELS: Record<ContinuityCode, string> = {
  "asme-ix": "ASME BPVC Section IX, QW-322.1",
  "aws-d1.1": "AWS D1.1, clause 6.2.3.1 (2020)",
};

export const CODE_RULES: Record<ContinuityCode, string> = {
  "asme-ix": "A process lapses when the welder has not used it for 6 months or more: lapsed on the 6-month anniversary of the last use.",
  "aws-d1.1": "A process lapses when unused for a period exceeding six months: the anniversary is still good, lapsed from the day after.",
};

// Calendar dates are UTC days throughout Gusset's continuity sums, so the server's zone never shifts them.
export function todayIso(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}

const isoDate = (label: string) =>
  z
    .string({ error: `Enter ${label} as a date.` })
    .trim()
    .refine(
      (s) => {
        try {
          parseIsoDate(s);
          return true;
        } catch {
          return false;
        }
      },
      { error: `${label[0]!.toUpperCase()}${label.slice(1)} must be a calendar date (YYYY-MM-DD).` },
    )
    .refine((s) => s <= todayIso(), { error: `${label[0]!.toUpperCase()}${label.slice(1)} cannot be in the future.` });

const mm = (label: string, max: number) =>
  z
    .number({ error: (iss) => (iss.input === undefined ? `Enter ${label}.` : `${label[0]!.toUpperCase()}${label.slice(1)} must be a number in mm.`) })
    .gt(0, { error: "Must be above 0 mm." })
    .max(max, { error: `Must be at most ${max} mm.` });

const qualificationFieldSchemas = {
  welderUserId: z.string({ error: "Choose the welder." }).trim().min(1, { error: "Choose the welder." }).max(64),
  process: z.enum(WPS_PROCESSES, { error: `Process is one of ${WPS_PROCESSES.join(", ")}.` }),
  positions: z
    .array(z.enum(WPS_POSITIONS, { error: `A position is one of ${WPS_POSITIONS.join(", ")}.` }), { error: "Tick the positions qualified." })
    .min(1, { error: "Tick the positions qualified." })
    .transform((p) => WPS_POSITIONS.filter((x) => p.includes(x))),
  thicknessMinMm: mm("the minimum thickness", 300),
  thicknessMaxMm: mm("the maximum thickness", 300),
  diameterMinMm: mm("the minimum diameter", 3000),
  diameterMaxMm: mm("the maximum diameter", 3000),
  fillerFNumber: z
    .number({ error: (iss) => (iss.input === undefined ? "Enter the filler F-No." : "The F-No. is a whole number, such as 6.") })
    .int({ error: "The F-No. is a whole number, such as 6." })
    .min(1, { error: "The F-No. is between 1 and 99." })
    .max(99, { error: "The F-No. is between 1 and 99." }),
  testDate: isoDate("the test date"),
  wpsId: z.string().uuid({ error: "Choose a WPS from the library." }),
  notes: z.string().trim().max(1000, { error: "At most 1000 characters." }),
  // A use of the process on a job before the shop kept it in Gusset (paper traveller); only ever moves forward.
  lastUsedOn: isoDate("the last use"),
};

type Ranges = { thicknessMinMm?: number | null; thicknessMaxMm?: number | null; diameterMinMm?: number | null; diameterMaxMm?: number | null };

export function rangeIssues(v: Ranges): { path: string; message: string }[] {
  const out: { path: string; message: string }[] = [];
  if (v.thicknessMinMm != null && v.thicknessMaxMm != null && v.thicknessMinMm > v.thicknessMaxMm) {
    out.push({ path: "thicknessMinMm", message: "The minimum thickness is above the maximum." });
  }
  if (v.diameterMinMm != null && v.diameterMaxMm != null && v.diameterMinMm > v.diameterMaxMm) {
    out.push({ path: "diameterMinMm", message: "The minimum diameter is above the maximum." });
  }
  return out;
}

const f = qualificationFieldSchemas;
const base = {
  welderUserId: f.welderUserId,
  process: f.process,
  positions: f.positions,
  thicknessMinMm: f.thicknessMinMm,
  thicknessMaxMm: f.thicknessMaxMm.nullable().optional(),
  diameterMinMm: f.diameterMinMm.nullable().optional(),
  diameterMaxMm: f.diameterMaxMm.nullable().optional(),
  fillerFNumber: f.fillerFNumber,
  testDate: f.testDate,
  wpsId: f.wpsId.nullable().optional(),
  notes: f.notes.optional(),
  lastUsedOn: f.lastUsedOn.nullable().optional(),
};

/** POST /api/qualifications. Empty maxima mean "unlimited"; an empty minimum diameter means plate or any pipe. */
export const qualificationCreateSchema = z.strictObject(base).superRefine((v, ctx) => {
  for (const i of rangeIssues(v)) ctx.addIssue({ code: "custom", path: [i.path], message: i.message });
});
export type QualificationCreate = z.output<typeof qualificationCreateSchema>;

/** PATCH /api/qualifications/{id}: any subset; the welder and process of a qualification never change. */
export const qualificationPatchSchema = z
  .strictObject({
    positions: f.positions.optional(),
    thicknessMinMm: f.thicknessMinMm.optional(),
    thicknessMaxMm: base.thicknessMaxMm,
    diameterMinMm: base.diameterMinMm,
    diameterMaxMm: base.diameterMaxMm,
    fillerFNumber: f.fillerFNumber.optional(),
    testDate: f.testDate.optional(),
    wpsId: base.wpsId,
    notes: base.notes,
    lastUsedOn: base.lastUsedOn,
  })
  .refine((v) => Object.keys(v).length > 0, { message: "Send at least one field to change." });
export type QualificationPatch = z.output<typeof qualificationPatchSchema>;

/** The lead's form (new and edit share it; on edit the welder and process are fixed hidden fields). */
export const qualificationFormSchema = z
  .object({
    id: z.string().uuid().optional(),
    welderUserId: f.welderUserId,
    process: f.process,
    positions: f.positions,
    thicknessMinMm: f.thicknessMinMm,
    thicknessMaxMm: f.thicknessMaxMm.optional(),
    diameterMinMm: f.diameterMinMm.optional(),
    diameterMaxMm: f.diameterMaxMm.optional(),
    fillerFNumber: f.fillerFNumber,
    testDate: f.testDate,
    wpsId: f.wpsId.optional(),
    notes: f.notes.optional(),
    lastUsedOn: f.lastUsedOn.optional(),
  })
  .superRefine((v, ctx) => {
    for (const i of rangeIssues(v)) ctx.addIssue({ code: "custom", path: [i.path], message: i.message });
  });

export const continuityCodeSchema = z.strictObject({
  code: z.enum(CONTINUITY_CODES, { error: `The code is one of ${CONTINUITY_CODES.join(", ")}.` }),
});

export const qualificationListQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  process: z.enum(WPS_PROCESSES, { error: `process is one of ${WPS_PROCESSES.join(", ")}` }).optional(),
  status: z.enum(CONTINUITY_STATUSES, { error: `status is one of ${CONTINUITY_STATUSES.join(", ")}` }).optional(),
  welder: z.string().trim().min(1).max(64).optional(),
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
});

export const CERTIFICATE_MAX_BYTES = 20 * 1024 * 1024;
export const CERTIFICATE_TYPES = ["application/pdf", "image/jpeg", "image/png"] as const;

// Lapsing notices go to the leads at these days ahead of the lapse, once each: a lead hears about a
// qualification up to four times, never twice in a day, rather than every day for a month.
export const NOTICE_STAGES = [30, 14, 7, 1] as const;

/** The reminder stage a qualification with `daysLeft` is in, or null outside the 1–30 day window. */
export function noticeStage(daysLeft: number): number | null {
  if (!Number.isInteger(daysLeft) || daysLeft < 1 || daysLeft > NOTICE_STAGES[0]) return null;
  let stage: number = NOTICE_STAGES[0];
  for (const s of NOTICE_STAGES) if (daysLeft <= s) stage = s;
  return stage;
}
