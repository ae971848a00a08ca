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
  })
  .strict();

export const weldRowSchema = z
  .object({
    jointId: required(40, "A joint id"),
    /** where the joint is, e.g. "lateral link bracket to tube, front fillet" */
    location: text(200).default(""),
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
    inspections: z
      .array(
        z
          .object({
            result: z.enum(["accept", "reject"]),
            inspectorName: required(120, "The inspector's name"),
            at: instant,
            note: text(500).default(""),
          })
          .strict(),
      )
      .max(20)
      .default([]),
  })
  .strict();

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
    geometry: z.object({ before: geometryCaptureSchema.nullable(), after: geometryCaptureSchema.nullable() }).strict().nullable().default(null),
    welds: z.array(weldRowSchema).max(500).default([]),
    nonconformances: z.array(nonconformanceSchema).max(500).default([]),
    materials: z
      .object({
        parts: z.array(z.object({ item: required(120, "The item"), spec: text(120), heatNumber: required(60, "The heat number") }).strict()).max(100).default([]),
        fillers: z.array(z.object({ classification: required(80, "The classification"), diameterMm: finite.positive().optional(), lot: required(60, "The lot") }).strict()).max(100).default([]),
      })
      .strict()
      .default({ parts: [], fillers: [] }),
    photos: z.array(photoSchema).max(200).default([]),
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
