// The traveller's input: one plain object holding everything the printed record shows, already in the
// units and words the shop reads. The renderer does no look-ups and no arithmetic on the record, so
// what is printed is exactly what the caller passed (and what the seal covers is the caller's concern).
import { z } from "zod";

export const TRAVELLER_JOB_STATES = ["planned", "in_progress", "on_hold", "ready_for_release", "released", "void"] as const;
export type TravellerJobState = (typeof TRAVELLER_JOB_STATES)[number];

export const TRAVELLER_STEP_KINDS = ["check", "measure", "photo", "caution", "weld", "hold", "torque", "coating", "geometry"] as const;
export type TravellerStepKind = (typeof TRAVELLER_STEP_KINDS)[number];

export const SIGN_OFF_MEANINGS = ["performed", "inspected", "dispositioned", "released"] as const;
export type SignOffMeaning = (typeof SIGN_OFF_MEANINGS)[number];

export const TRAVELLER_DISPOSITIONS = ["rework", "repair", "use_as_is", "scrap"] as const;
export type TravellerDisposition = (typeof TRAVELLER_DISPOSITIONS)[number];

export const PAPER_SIZES = ["a4", "letter"] as const;
export type PaperSize = (typeof PAPER_SIZES)[number];

const text = (max: number) => z.string().trim().max(max);
const required = (max: number, what: string) => z.string().trim().min(1, `${what} is required.`).max(max);
const hex64 = z.string().regex(/^[0-9a-f]{64}$/, "A SHA-256 is 64 lower-case hex characters.");
/** An instant: a Date from the database or an ISO 8601 date-time with its offset. */
const instant = z.union([z.date(), z.iso.datetime({ offset: true })]).transform((v) => new Date(v));
/** A calendar day (a due date has no time of day). */
const day = z.iso.date();
const finite = z.number().finite();

export const signOffSchema = z
  .object({
    /** the sign-off's id in the jobs database; amendments point at it */
    id: required(100, "A sign-off id"),
    printedName: required(120, "The printed name"),
    /** the signer's role when signing, e.g. "welder", "inspector", "lead" */
    role: required(40, "The role"),
    meaning: z.enum(SIGN_OFF_MEANINGS),
    signedAt: instant,
    /** weld joints: the round the sign-off belongs to (the first welding, then each repair) */
    round: z.number().int().min(1).max(99).optional(),
    /** set when this sign-off corrects an earlier one: signed records are never changed, only amended */
    amends: z.object({ signOffId: required(100, "The amended sign-off id"), reason: required(1000, "The reason") }).strict().optional(),
  })
  .strict();

export const measurementSchema = z
  .object({
    /** what was measured, when a step has several readings ("left U-bolt nut") */
    label: text(120).optional(),
    value: finite,
    unit: text(16),
    /** decimals to print; by default up to 3, trailing zeros trimmed */
    decimals: z.number().int().min(0).max(6).optional(),
    /** the limits as the shop reads them, e.g. "12.0 ± 0.5 mm" or "≥ 5 °C above dew point" */
    toleranceText: text(120),
    verdict: z.enum(["pass", "fail", "na"]),
  })
  .strict();

export const stepSchema = z
  .object({
    key: required(64, "A step key"),
    title: required(200, "A step title"),
    kind: z.enum(TRAVELLER_STEP_KINDS),
    /** what was found or done, in words (a check's answer, a caution's hazards, a hold point's finding) */
    resultText: text(4000).default(""),
    measurements: z.array(measurementSchema).max(50).default([]),
    /** every sign-off of the step in signing order, amendments included */
    signOffs: z.array(signOffSchema).max(50).default([]),
  })
  .strict();

export const sectionSchema = z
  .object({
    key: required(64, "A section key"),
    title: required(200, "A section title"),
    steps: z.array(stepSchema).max(500),
  })
  .strict();

const point = z.object({ y: finite, z: finite }).strict();

/** One front-view capture (y lateral, z up, mm, frame-fixed, at ride height), as lib/geometry takes it. */
export const geometryCaptureSchema = z
  .object({
    lateralLink: z.object({ frameEnd: point, axleEnd: point }).strict(),
    dragLink: z.object({ pitmanEnd: point, knuckleEnd: point }).strict(),
    axleCenter: point,
    lateralLinkAngleDeg: finite,
    dragLinkAngleDeg: finite,
    /** worst wheel steer over the travel range checked, degrees */
    worstWheelSteerDeg: finite,
    /** heave at which the worst steer occurs, mm (+ bump) */
    worstAtTravelMm: finite.optional(),
    /** the travel range checked, as words, e.g. "−75 to +100 mm" */
    travelText: text(80).optional(),
    /** steering-wheel degrees per road-wheel degree, when the capture gave one */
    steeringRatio: finite.optional(),
    /** [travel mm, wheel steer deg] over the travel range, for the before/after chart */
    curve: z.array(z.tuple([finite, finite])).max(401).optional(),
  })
  .strict();

export const JOINT_STATES = ["welding", "awaiting_inspection", "repair", "accepted"] as const;
export type TravellerJointState = (typeof JOINT_STATES)[number];

/** One pass of a joint as welded: who, to which WPS revision, and its heat input judged against that WPS. */
export const weldPassSchema = z
  .object({
    passNumber: z.number().int().min(1).max(999),
    welderName: required(120, "The welder's name"),
    wpsRef: required(60, "The WPS reference"),
    /** the published WPS revision the pass was checked against; null when none was published */
    wpsRevision: z.number().int().min(1).nullable().default(null),
    /** the value the WPS limits: arc energy, or ISO/TR 17671-1 Q when the WPS states its limit that way */
    heatInputKJPerMm: finite,
    heatInputMaxKJPerMm: finite.optional(),
    /** "na" when the WPS sets no heat-input limit (or none was published) */
    heatInputVerdict: z.enum(["within", "over", "na"]),
    /** the WPS check's other out-of-range findings, in words ("Current 260 A is above the WPS maximum of 240 A.") */
    outOfRange: z.array(text(300)).max(20).default([]),
    /** a lead's acceptance of an out-of-range pass */
    override: z.object({ reason: required(1000, "The override reason"), by: required(120, "Who overrode"), at: instant }).strict().optional(),
    /** struck out by its welder: kept on the record, not part of the weld */
    struckOut: z.boolean().default(false),
  })
  .strict();

export type TravellerWeldPassInput = z.input<typeof weldPassSchema>;

/** The visual inspection closing a round: the decision, who made it and when, and what it was judged by. */
export const weldInspectionSchema = z
  .object({
    round: z.number().int().min(1).max(99),
    result: z.enum(["accept", "reject"]),
    inspectorName: required(120, "The inspector's name"),
    at: instant,
    /** the acceptance criteria in words, e.g. "AWS D1.1:2020 Table 8.1, statically loaded nontubular" */
    criteria: text(160).default(""),
    /** the items that failed the criteria, measured against the limit */
    rejected: z.array(z.object({ item: required(60, "The item"), measured: text(300), limit: text(300) }).strict()).max(20).default([]),
    note: text(1000).default(""),
  })
  .strict();

export const weldRoundSchema = z
  .object({
    round: z.number().int().min(1).max(99),
    passes: z.array(weldPassSchema).max(200).default([]),
    /** null while the round waits for its inspection */
    inspection: weldInspectionSchema.nullable().default(null),
  })
  .strict();

export const weldRowSchema = z
  .object({
    jointId: required(40, "A joint id"),
    /** where the joint is, e.g. "lateral link bracket to tube, front fillet" */
    location: text(200).default(""),
    /** where the joint stands; derived from the last round when left out */
    state: z.enum(JOINT_STATES).optional(),
    welderName: required(120, "The welder's name"),
    wpsRef: required(60, "The WPS reference"),
    process: text(40).default(""),
    filler: required(80, "The filler metal"),
    fillerLot: required(60, "The filler lot"),
    passes: z.number().int().min(0).max(999).optional(),
    preheatC: finite.nullable(),
    heatInputKJPerMm: finite,
    /** the WPS's upper heat-input limit, printed beside the verdict when known */
    heatInputMaxKJPerMm: finite.optional(),
    /** "na" when no published WPS limit was found for the reference */
    heatInputVerdict: z.enum(["within", "over", "na"]),
    /** the first welding, then one round per repair after a rejection, in order */
    rounds: z.array(weldRoundSchema).max(20).default([]),
  })
  .strict()
  .superRefine((w, ctx) => {
    w.rounds.forEach((r, i) => {
      if (r.round !== i + 1) ctx.addIssue({ code: "custom", path: ["rounds", i, "round"], message: "Rounds are numbered 1, 2, 3 … in order." });
      if (r.inspection && r.inspection.round !== r.round) ctx.addIssue({ code: "custom", path: ["rounds", i, "inspection", "round"], message: "An inspection belongs to its own round." });
      if (i < w.rounds.length - 1 && r.inspection?.result !== "reject") {
        ctx.addIssue({ code: "custom", path: ["rounds", i, "inspection"], message: "Only a rejected round is followed by a repair round." });
      }
    });
  });

export const nonconformanceSchema = z
  .object({
    number: z.number().int().min(1),
    stepKey: text(64).optional(),
    description: required(2000, "A description"),
    raisedBy: text(120).optional(),
    raisedAt: instant.optional(),
    /** null while the nonconformance is open */
    disposition: z.enum(TRAVELLER_DISPOSITIONS).nullable(),
    dispositionNotes: text(2000).default(""),
    dispositionedBy: text(120).optional(),
    dispositionedAt: instant.optional(),
  })
  .strict()
  .refine((n) => n.disposition === null || (n.dispositionedBy && n.dispositionedAt), {
    message: "A disposition needs who decided it and when.",
    path: ["dispositionedBy"],
  });

export const MATERIAL_KINDS = ["base", "filler", "other"] as const;

/** One material entry (ISO 3834-2 traceability): what went into the job, by heat or lot number. */
export const materialEntrySchema = z
  .object({
    kind: z.enum(MATERIAL_KINDS),
    description: required(200, "The description"),
    specification: text(120).default(""),
    heatNumber: required(60, "The heat or lot number"),
    certificate: text(120).default(""),
    /** no longer used on the job: printed as withdrawn, with the reason */
    withdrawn: z.boolean().default(false),
    /** set when this entry corrects (or withdraws) an earlier one */
    reason: text(1000).default(""),
    corrects: z.boolean().default(false),
    recordedBy: text(120).default(""),
    recordedAt: instant.optional(),
  })
  .strict();

const JPEG = [0xff, 0xd8, 0xff];
const PNG = [0x89, 0x50, 0x4e, 0x47];
const startsWith = (b: Uint8Array, sig: number[]) => sig.every((v, i) => b[i] === v);

/** Thumbnail bytes as a Buffer / Uint8Array or base64 text (a data: URL prefix is allowed). */
const imageBytes = z
  .union([z.custom<Uint8Array>((v) => v instanceof Uint8Array, "Photo bytes must be a Buffer, a Uint8Array or base64 text."), z.string()])
  .transform((v, ctx) => {
    if (typeof v !== "string") return Buffer.from(v.buffer, v.byteOffset, v.byteLength);
    const b64 = v.replace(/^data:image\/[a-z]+;base64,/, "");
    if (!/^[A-Za-z0-9+/=\s]*$/.test(b64)) {
      ctx.addIssue({ code: "custom", message: "Photo bytes are not base64." });
      return z.NEVER;
    }
    return Buffer.from(b64, "base64");
  })
  .refine((b) => startsWith(b, JPEG) || startsWith(b, PNG), "A thumbnail must be a JPEG or PNG (convert WebP/HEIC first).");

export const photoSchema = z
  .object({
    image: imageBytes,
    caption: text(200).default(""),
    stepKey: text(64).optional(),
    takenAt: instant.optional(),
    /** SHA-256 of the original photo, printed short so a print can be matched to the stored file */
    sha256: hex64.optional(),
  })
  .strict();

const rel = z.number().finite().min(0).max(1);

/** Where each weld joint is: each image once, each joint's marker on it (image-relative 0..1) with its state. */
export const weldMapSchema = z
  .object({
    images: z
      .array(z.object({ id: required(100, "An image id"), image: imageBytes, width: z.number().int().min(1), height: z.number().int().min(1), label: text(120).default(""), sha256: hex64.optional() }).strict())
      .max(8),
    joints: z
      .array(
        z
          .object({
            jointId: required(40, "A joint id"),
            imageId: required(100, "An image id"),
            x: rel,
            y: rel,
            path: z.array(z.object({ x: rel, y: rel }).strict()).max(24).optional(),
            state: z.enum([...JOINT_STATES, "planned"]),
          })
          .strict(),
      )
      .max(500),
  })
  .strict();

export const travellerDataSchema = z
  .object({
    shopName: required(200, "The shop name"),
    jobNumber: required(40, "The job number"),
    state: z.enum(TRAVELLER_JOB_STATES),
    /** must agree with state; anything not released prints as work in progress */
    released: z.boolean(),
    /** the customer's name only: phone and e-mail stay off paper */
    customerName: required(200, "The customer name"),
    vehicle: z
      .object({
        year: z.number().int().min(1900).max(2100).nullable(),
        makeModel: text(200),
        vin: text(17),
        /** set when the VIN's check digit (49 CFR 565.15) does not match: warned, never blocked */
        vinCheckDigitWarning: z.boolean().default(false),
      })
      .strict(),
    axle: z.object({ description: text(300), idTag: text(60) }).strict(),
    procedure: z
      .object({
        title: required(200, "The procedure title"),
        version: z.number().int().min(1),
        /** SHA-256 of the pinned version's content */
        contentHash: hex64,
      })
      .strict(),
    dates: z.object({ created: instant, due: day.nullable(), released: instant.nullable() }).strict(),
    /** the job-level sign-off with meaning "released" (the lead's release), when there is one */
    release: z.object({ printedName: required(120, "The printed name"), role: required(40, "The role"), signedAt: instant }).strict().nullable().default(null),
    seal: z.object({ sha256: hex64, entries: z.number().int().min(0) }).strict(),
    /** absolute URL the QR code carries and the page prints under it */
    verifyUrl: z.url({ protocol: /^https?$/ }).max(300),
    sections: z.array(sectionSchema).max(100),
    geometry: z
      .object({ before: geometryCaptureSchema.nullable(), after: geometryCaptureSchema.nullable(), roadTestNote: text(1500).optional() })
      .strict()
      .nullable()
      .default(null),
    welds: z.array(weldRowSchema).max(500).default([]),
    nonconformances: z.array(nonconformanceSchema).max(500).default([]),
    materials: z
      .object({
        /** the job's material entries as they stand (corrected ones replaced by their correction) */
        entries: z.array(materialEntrySchema).max(200).default([]),
        /** filler lots as logged on the weld passes, for checking against the entries */
        fillers: z.array(z.object({ classification: text(80), diameterMm: finite.positive().optional(), lot: required(60, "The lot"), joints: z.array(text(40)).max(100).default([]) }).strict()).max(100).default([]),
      })
      .strict()
      .default({ entries: [], fillers: [] }),
    photos: z.array(photoSchema).max(200).default([]),
    /** the job's weld map; null when it has none */
    weldMap: weldMapSchema.nullable().default(null),
    paper: z.enum(PAPER_SIZES).default("a4"),
    /** IANA zone the times print in, e.g. "Europe/Berlin"; the offset is printed beside each time */
    timeZone: z
      .string()
      .default("UTC")
      .refine((tz) => {
        try {
          new Intl.DateTimeFormat("en", { timeZone: tz });
          return true;
        } catch {
          return false;
        }
      }, "Unknown time zone."),
    /** when this print was made (now when left out); also the PDF's creation date */
    printedAt: instant.optional(),
  })
  .strict()
  .superRefine((d, ctx) => {
    if (d.released !== (d.state === "released")) {
      ctx.addIssue({ code: "custom", path: ["released"], message: `released must be ${d.state === "released"} when the state is ${d.state}.` });
    }
    if (d.released && !d.dates.released) {
      ctx.addIssue({ code: "custom", path: ["dates", "released"], message: "A released job needs its release time." });
    }
    const ids = new Set<string>();
    for (const s of d.sections) for (const st of s.steps) for (const so of st.signOffs) ids.add(so.id);
    d.sections.forEach((s, si) =>
      s.steps.forEach((st, ti) =>
        st.signOffs.forEach((so, oi) => {
          if (so.amends && (!ids.has(so.amends.signOffId) || so.amends.signOffId === so.id)) {
            ctx.addIssue({
              code: "custom",
              path: ["sections", si, "steps", ti, "signOffs", oi, "amends", "signOffId"],
              message: "An amendment must point at another sign-off on this traveller.",
            });
          }
        }),
      ),
    );
  });

/** What callers pass (dates as Date or ISO text, photos as bytes or base64, defaults optional). */
export type TravellerData = z.input<typeof travellerDataSchema>;
/** The checked, normalised form the renderer draws from. */
export type TravellerRecord = z.output<typeof travellerDataSchema>;

export function parseTravellerData(data: TravellerData): TravellerRecord {
  return travellerDataSchema.parse(data);
}
