// Jobs and their checklists. A job pins one published procedure version for life; its checklist rows
// (job_step) are materialised from that version's content when the job is created. Sign-offs, activity,
// nonconformances and dispositions are append-only: db/sql/020-jobs.sql refuses changes for every role.
import { sql, type SQL } from "drizzle-orm";
import {
  type AnyPgColumn,
  boolean,
  check,
  date,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import type { Step, StepKind } from "@/lib/procedures/schema";
import type { JobWeldMap } from "@/lib/weld-map";
import type { VisualCriteria, VisualItemResult, VisualObservations, WpsFinding } from "@/lib/welding";
import { user } from "./auth";
import { procedure, procedureVersion } from "./procedures";
import { shop } from "./shops";
import { wpsRevision } from "./welding";

export const JOB_STATES = ["planned", "in_progress", "on_hold", "ready_for_release", "released", "void"] as const;
export type JobState = (typeof JOB_STATES)[number];

export const SIGN_MEANINGS = ["performed", "inspected", "dispositioned", "released"] as const;
export type SignMeaning = (typeof SIGN_MEANINGS)[number];

export const DISPOSITIONS = ["rework", "repair", "use_as_is", "scrap"] as const;
export type Disposition = (typeof DISPOSITIONS)[number];

// Per shop and year; the next number is taken with an upsert inside the job's own transaction.
export const jobCounter = pgTable(
  "job_counter",
  {
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    year: integer("year").notNull(),
    last: integer("last").notNull().default(0),
  },
  (t) => [primaryKey({ columns: [t.shopId, t.year] })],
);

export const job = pgTable(
  "job",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    number: text("number").notNull(),
    year: integer("year").notNull(),
    seq: integer("seq").notNull(),
    status: text("status", { enum: JOB_STATES }).notNull().default("planned"),
    customerName: text("customer_name").notNull(),
    customerPhone: text("customer_phone").notNull().default(""),
    customerEmail: text("customer_email").notNull().default(""),
    vehicleYear: integer("vehicle_year"),
    vehicleMakeModel: text("vehicle_make_model").notNull().default(""),
    vin: text("vin").notNull().default(""),
    // The warning shown when the VIN was entered; a mismatch never blocks a job.
    vinWarning: text("vin_warning"),
    axleDescription: text("axle_description").notNull().default(""),
    axleTag: text("axle_tag").notNull().default(""),
    procedureId: uuid("procedure_id").notNull().references(() => procedure.id),
    procedureVersionId: uuid("procedure_version_id").notNull().references(() => procedureVersion.id),
    procedureVersionNumber: integer("procedure_version_number").notNull(),
    procedureTitle: text("procedure_title").notNull(),
    dueDate: date("due_date"),
    notes: text("notes").notNull().default(""),
    // Where each weld joint is (lib/weld-map JobWeldMap): copied from the procedure version when the job is
    // made, re-based on a photo of this axle while the job is open; null when the version has no map.
    weldMap: jsonb("weld_map").$type<JobWeldMap>(),
    // Progress kept beside the row so the job list sorts and shows it without reading every step.
    stepsTotal: integer("steps_total").notNull().default(0),
    stepsSigned: integer("steps_signed").notNull().default(0),
    openNonconformances: integer("open_nonconformances").notNull().default(0),
    // Optimistic concurrency of the header (customer, vehicle, assignees, due date, notes).
    version: integer("version").notNull().default(1),
    createdBy: text("created_by").notNull().references(() => user.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
    startedAt: timestamp("started_at", { withTimezone: true }),
    releasedAt: timestamp("released_at", { withTimezone: true }),
    releasedBy: text("released_by").references(() => user.id),
    voidedAt: timestamp("voided_at", { withTimezone: true }),
    voidedBy: text("voided_by").references(() => user.id),
    voidReason: text("void_reason"),
    // What the search box matches: number, VIN, axle tag, customer. A trigram index (db/sql/020-jobs.sql)
    // makes `like '%…%'` on it fast.
    searchText: text("search_text").generatedAlwaysAs(
      (): SQL =>
        sql`lower(${job.number} || ' ' || ${job.vin} || ' ' || ${job.axleTag} || ' ' || ${job.customerName})`,
    ),
  },
  (t) => [
    uniqueIndex("job_shop_number_idx").on(t.shopId, t.number),
    index("job_shop_seq_idx").on(t.shopId, t.year, t.seq),
    index("job_shop_status_idx").on(t.shopId, t.status, t.dueDate),
    index("job_shop_due_idx").on(t.shopId, t.dueDate),
    index("job_shop_created_idx").on(t.shopId, t.createdAt),
    index("job_shop_customer_idx").on(t.shopId, sql`lower(${t.customerName})`),
    check("job_void_reason", sql`${t.status} <> 'void' or ${t.voidReason} is not null`),
  ],
);

export const ASSIGNMENT_ROLES = ["welder", "inspector"] as const;

export const jobAssignment = pgTable(
  "job_assignment",
  {
    jobId: uuid("job_id").notNull().references(() => job.id),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    userId: text("user_id").notNull().references(() => user.id),
    role: text("role", { enum: ASSIGNMENT_ROLES }).notNull(),
    assignedAt: timestamp("assigned_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.jobId, t.userId, t.role] }), index("job_assignment_user_idx").on(t.shopId, t.userId, t.role)],
);

export const jobStep = pgTable(
  "job_step",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    jobId: uuid("job_id").notNull().references(() => job.id),
    position: integer("position").notNull(),
    sectionKey: text("section_key").notNull(),
    sectionTitle: text("section_title").notNull(),
    sectionPosition: integer("section_position").notNull(),
    stepKey: text("step_key").notNull(),
    kind: text("kind").$type<StepKind>().notNull(),
    title: text("title").notNull(),
    spec: jsonb("spec").$type<Step>().notNull(),
    // The working value before signing (SI units). Frozen once a sign-off exists (trigger).
    value: jsonb("value").$type<Record<string, unknown>>(),
    // Every write names the version it was based on; a stale one is a conflict, never an overwrite.
    version: integer("version").notNull().default(0),
    updatedBy: text("updated_by").references(() => user.id),
    updatedAt: timestamp("updated_at", { withTimezone: true }),
    signedAt: timestamp("signed_at", { withTimezone: true }),
  },
  (t) => [
    uniqueIndex("job_step_key_idx").on(t.jobId, t.stepKey),
    uniqueIndex("job_step_position_idx").on(t.jobId, t.position),
    index("job_step_shop_idx").on(t.shopId, t.jobId),
  ],
);

export const signOff = pgTable(
  "sign_off",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    jobId: uuid("job_id").notNull().references(() => job.id),
    // A step's sign-off, a disposition's (nonconformanceId) or the job's release (neither).
    stepId: uuid("step_id").references(() => jobStep.id),
    nonconformanceId: uuid("nonconformance_id").references((): AnyPgColumn => nonconformance.id),
    userId: text("user_id").notNull().references(() => user.id),
    printedName: text("printed_name").notNull(),
    role: text("role").notNull(),
    meaning: text("meaning", { enum: SIGN_MEANINGS }).notNull(),
    signedAt: timestamp("signed_at", { withTimezone: true }).notNull().defaultNow(),
    // The canonical content that was signed and its SHA-256 (RFC 8785 JSON; lib/jobs/content.ts).
    content: jsonb("content").$type<Record<string, unknown>>().notNull(),
    contentHash: text("content_hash").notNull(),
    amendsSignOffId: uuid("amends_sign_off_id").references((): AnyPgColumn => signOff.id),
    reason: text("reason"),
    // Weld joints are welded and inspected in rounds (1, then one per repair); null elsewhere.
    round: integer("round"),
  },
  (t) => [
    index("sign_off_job_idx").on(t.jobId, t.signedAt),
    index("sign_off_user_idx").on(t.shopId, t.userId),
    // One original sign-off per step and meaning; corrections are amendments pointing at it.
    // A weld joint gets one "performed" and one "inspected" sign-off per round.
    uniqueIndex("sign_off_step_round_idx")
      .on(t.stepId, t.meaning, sql`coalesce(${t.round}, 1)`)
      .where(sql`${t.amendsSignOffId} is null and ${t.stepId} is not null`),
    uniqueIndex("sign_off_release_idx").on(t.jobId).where(sql`${t.meaning} = 'released'`),
    uniqueIndex("sign_off_nc_idx").on(t.nonconformanceId).where(sql`${t.nonconformanceId} is not null`),
    check("sign_off_amendment_reason", sql`${t.amendsSignOffId} is null or length(trim(${t.reason})) > 0`),
    check("sign_off_hash", sql`${t.contentHash} ~ '^[0-9a-f]{64}$'`),
  ],
);

export const nonconformance = pgTable(
  "nonconformance",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    jobId: uuid("job_id").notNull().references(() => job.id),
    stepId: uuid("step_id").notNull().references(() => jobStep.id),
    number: integer("number").notNull(),
    description: text("description").notNull(),
    proposedDisposition: text("proposed_disposition", { enum: DISPOSITIONS }).notNull(),
    // The step's value when it was raised, so the record shows what was out of tolerance.
    observed: jsonb("observed").$type<Record<string, unknown>>(),
    raisedBy: text("raised_by").notNull().references(() => user.id),
    raisedAt: timestamp("raised_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("nonconformance_number_idx").on(t.jobId, t.number), index("nonconformance_step_idx").on(t.stepId)],
);

// A nonconformance is open until it has a disposition; one disposition each, signed by its decider.
export const nonconformanceDisposition = pgTable(
  "nonconformance_disposition",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    jobId: uuid("job_id").notNull().references(() => job.id),
    nonconformanceId: uuid("nonconformance_id").notNull().references(() => nonconformance.id),
    disposition: text("disposition", { enum: DISPOSITIONS }).notNull(),
    notes: text("notes").notNull().default(""),
    decidedBy: text("decided_by").notNull().references(() => user.id),
    signOffId: uuid("sign_off_id").notNull().references(() => signOff.id),
    decidedAt: timestamp("decided_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("nonconformance_disposition_nc_idx").on(t.nonconformanceId), index("nonconformance_disposition_job_idx").on(t.jobId)],
);

export const photo = pgTable(
  "photo",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    jobId: uuid("job_id").notNull().references(() => job.id),
    stepId: uuid("step_id").references(() => jobStep.id),
    nonconformanceId: uuid("nonconformance_id").references(() => nonconformance.id),
    key: text("key").notNull(),
    thumbKey: text("thumb_key").notNull(),
    // SHA-256 of the stored (re-encoded, metadata-free) image: the bytes anyone can fetch and check.
    sha256: text("sha256").notNull(),
    contentType: text("content_type").notNull(),
    size: integer("size").notNull(),
    width: integer("width").notNull(),
    height: integer("height").notNull(),
    originalType: text("original_type").notNull(),
    originalSize: integer("original_size").notNull(),
    idempotencyKey: text("idempotency_key").notNull(),
    caption: text("caption").notNull().default(""),
    uploadedBy: text("uploaded_by").notNull().references(() => user.id),
    uploadedAt: timestamp("uploaded_at", { withTimezone: true }).notNull().defaultNow(),
    // Taken off an unsigned step by its welder; the file and the row stay.
    removedAt: timestamp("removed_at", { withTimezone: true }),
    removedBy: text("removed_by").references(() => user.id),
  },
  (t) => [
    uniqueIndex("photo_idempotency_idx").on(t.shopId, t.idempotencyKey),
    index("photo_job_idx").on(t.jobId, t.uploadedAt),
    index("photo_step_idx").on(t.stepId),
  ],
);

// One row per weld pass, keyed by job + step and the joint's round (1, then one per repair). Values are SI
// (V, A, mm/min, °C, kJ/mm). The pass is checked against the published WPS revision it was welded to; its
// findings are kept with it, and an out-of-range pass needs a nonconformance or a lead's override.
export const weldPass = pgTable(
  "weld_pass",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    jobId: uuid("job_id").notNull().references(() => job.id),
    stepId: uuid("step_id").notNull().references(() => jobStep.id),
    passNumber: integer("pass_number").notNull(),
    welderId: text("welder_id").notNull().references(() => user.id),
    process: text("process").notNull(),
    volts: doublePrecision("volts").notNull(),
    amps: doublePrecision("amps").notNull(),
    travelSpeedMmPerMin: doublePrecision("travel_speed_mm_per_min").notNull(),
    travelSpeedUnit: text("travel_speed_unit", { enum: ["mm/min", "in/min"] }).notNull(),
    preheatC: doublePrecision("preheat_c").notNull(),
    interpassC: doublePrecision("interpass_c"),
    fillerLot: text("filler_lot").notNull(),
    arcEnergyKJPerMm: doublePrecision("arc_energy_kj_per_mm").notNull(),
    heatInputKJPerMm: doublePrecision("heat_input_kj_per_mm").notNull(),
    round: integer("round").notNull().default(1),
    position: text("position").notNull().default(""),
    fillerClassification: text("filler_classification").notNull().default(""),
    wpsRevisionId: uuid("wps_revision_id").references(() => wpsRevision.id),
    wpsReference: text("wps_reference").notNull().default(""),
    wpsRevisionNumber: integer("wps_revision_number"),
    // How heat input was found: ASME IX QW-409.1 (a) from V·A/speed, or (c) from the machine's energy or power.
    heatInputMethod: text("heat_input_method", { enum: ["voltage-current", "energy", "power"] }).notNull().default("voltage-current"),
    beadLengthMm: doublePrecision("bead_length_mm"),
    arcTimeS: doublePrecision("arc_time_s"),
    machineEnergyKJ: doublePrecision("machine_energy_kj"),
    machinePowerW: doublePrecision("machine_power_w"),
    jPerIn: doublePrecision("j_per_in"),
    wpsFindings: jsonb("wps_findings").$type<WpsFinding[]>().notNull().default([]),
    outOfRange: boolean("out_of_range").notNull().default(false),
    clientKey: text("client_key").notNull(),
    recordedAt: timestamp("recorded_at", { withTimezone: true }).notNull().defaultNow(),
    // Struck out by its welder before the step was signed (a mistyped pass); the row stays.
    removedAt: timestamp("removed_at", { withTimezone: true }),
    removedBy: text("removed_by").references(() => user.id),
  },
  (t) => [
    uniqueIndex("weld_pass_number_idx").on(t.stepId, t.passNumber),
    uniqueIndex("weld_pass_client_key_idx").on(t.shopId, t.clientKey),
    index("weld_pass_job_idx").on(t.jobId, t.stepId),
    index("weld_pass_welder_idx").on(t.shopId, t.welderId),
    // The quality figures read a shop's passes by date (db/queries/quality.ts; measured in bench/quality.ts).
    index("weld_pass_shop_recorded_idx").on(t.shopId, t.recordedAt),
    check("weld_pass_round", sql`${t.round} >= 1`),
  ],
);

// A lead accepts an out-of-range pass with a reason (PIN-verified); the welder's sign-off of the round then
// carries it. One per pass, never changed (db/sql/050-welds.sql).
export const weldPassOverride = pgTable(
  "weld_pass_override",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    jobId: uuid("job_id").notNull().references(() => job.id),
    stepId: uuid("step_id").notNull().references(() => jobStep.id),
    passId: uuid("pass_id").notNull().references(() => weldPass.id),
    reason: text("reason").notNull(),
    leadId: text("lead_id").notNull().references(() => user.id),
    printedName: text("printed_name").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("weld_pass_override_pass_idx").on(t.passId), check("weld_pass_override_reason", sql`length(trim(${t.reason})) >= 5`)],
);

export const INSPECTION_DECISIONS = ["accepted", "rejected"] as const;
export type InspectionDecision = (typeof INSPECTION_DECISIONS)[number];

// One visual inspection per weld joint and round, signed with the inspector's PIN ("inspected"). A
// rejection opens the next round (repair passes); every round stays on the record in order.
export const weldInspection = pgTable(
  "weld_inspection",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    jobId: uuid("job_id").notNull().references(() => job.id),
    stepId: uuid("step_id").notNull().references(() => jobStep.id),
    round: integer("round").notNull(),
    criteria: text("criteria").$type<VisualCriteria>().notNull(),
    observations: jsonb("observations").$type<VisualObservations>().notNull(),
    // What the criteria said of the observations (lib/welding judgeVisual), limits included.
    items: jsonb("items").$type<VisualItemResult[]>().notNull(),
    judged: text("judged", { enum: ["accept", "reject"] }).notNull(),
    decision: text("decision", { enum: INSPECTION_DECISIONS }).notNull(),
    notes: text("notes").notNull().default(""),
    photoIds: uuid("photo_ids").array().notNull(),
    inspectorId: text("inspector_id").notNull().references(() => user.id),
    signOffId: uuid("sign_off_id").notNull().references(() => signOff.id),
    inspectedAt: timestamp("inspected_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("weld_inspection_round_idx").on(t.stepId, t.round),
    uniqueIndex("weld_inspection_sign_off_idx").on(t.signOffId),
    index("weld_inspection_job_idx").on(t.jobId, t.inspectedAt),
    index("weld_inspection_shop_inspected_idx").on(t.shopId, t.inspectedAt),
    check("weld_inspection_photos", sql`cardinality(${t.photoIds}) >= 1`),
    check("weld_inspection_accept", sql`${t.decision} = 'rejected' or ${t.judged} = 'accept'`),
  ],
);

// How a rejected weld was taken out before its repair round is welded: method, how deep and how long the
// removal went, and a photo of the prepared groove. One per repair round, written once.
export const REPAIR_METHODS = ["grinding", "air-arc-gouging", "machining", "other"] as const;
export type RepairMethod = (typeof REPAIR_METHODS)[number];

export const weldRepair = pgTable(
  "weld_repair",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    jobId: uuid("job_id").notNull().references(() => job.id),
    stepId: uuid("step_id").notNull().references(() => jobStep.id),
    round: integer("round").notNull(),
    method: text("method", { enum: REPAIR_METHODS }).notNull(),
    methodNote: text("method_note").notNull().default(""),
    depthMm: doublePrecision("depth_mm").notNull(),
    lengthMm: doublePrecision("length_mm").notNull(),
    photoId: uuid("photo_id").notNull().references(() => photo.id),
    recordedBy: text("recorded_by").notNull().references(() => user.id),
    recordedAt: timestamp("recorded_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("weld_repair_round_idx").on(t.stepId, t.round),
    index("weld_repair_job_idx").on(t.jobId),
    check("weld_repair_round", sql`${t.round} >= 2`),
    check("weld_repair_sizes", sql`${t.depthMm} > 0 and ${t.lengthMm} > 0`),
  ],
);

export const MATERIAL_KINDS = ["base", "filler", "other"] as const;
export type MaterialKind = (typeof MATERIAL_KINDS)[number];

// Material and consumable traceability per job (ISO 3834-2): what went into the axle, by heat (cast) or lot
// number. Never changed: a correction is a new row pointing at the one it replaces (withdrawn: no longer used).
export const jobMaterial = pgTable(
  "job_material",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    jobId: uuid("job_id").notNull().references(() => job.id),
    kind: text("kind", { enum: MATERIAL_KINDS }).notNull(),
    description: text("description").notNull(),
    specification: text("specification").notNull().default(""),
    heatNumber: text("heat_number").notNull(),
    certificate: text("certificate").notNull().default(""),
    correctsId: uuid("corrects_id").references((): AnyPgColumn => jobMaterial.id),
    withdrawn: boolean("withdrawn").notNull().default(false),
    reason: text("reason"),
    recordedBy: text("recorded_by").notNull().references(() => user.id),
    recordedAt: timestamp("recorded_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("job_material_job_idx").on(t.jobId, t.recordedAt),
    uniqueIndex("job_material_corrects_idx").on(t.correctsId).where(sql`${t.correctsId} is not null`),
    check("job_material_correction_reason", sql`${t.correctsId} is null or length(trim(${t.reason})) > 0`),
  ],
);

export const jobActivity = pgTable(
  "job_activity",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    jobId: uuid("job_id").notNull().references(() => job.id),
    actorId: text("actor_id").references(() => user.id),
    action: text("action").notNull(),
    stepId: uuid("step_id"),
    detail: jsonb("detail").$type<Record<string, unknown>>().notNull().default({}),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("job_activity_job_idx").on(t.jobId, t.at)],
);
