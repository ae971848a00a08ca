// The shop's welding libraries: WPSs with their revisions, welder qualifications, the last use of each
// process by each welder (continuity), and the lapsing notices already mailed. A published or retired WPS
// revision never changes: db/sql/030-welding.sql refuses it for every role, superuser included.
import { sql } from "drizzle-orm";
import { check, date, doublePrecision, index, integer, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import type { WpsPosition, WpsProcess, WpsStatus } from "@/lib/welding/wps-schema";
import { user } from "./auth";
import { mailOutbox, shop } from "./shops";

// The process list is repeated in SQL checks below; app/api/wps/schema.ts WPS_PROCESSES is the source.
const PROCESS_CHECK = sql.raw(`('SMAW','GMAW','FCAW','GTAW','SAW')`);

export const wps = pgTable(
  "wps",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    // Printed on travellers and quoted on weld steps, so it never changes once made (trigger).
    reference: text("reference").notNull(),
    createdBy: text("created_by").notNull().references(() => user.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("wps_shop_reference_idx").on(t.shopId, t.reference)],
);

export const wpsRevision = pgTable(
  "wps_revision",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    wpsId: uuid("wps_id").notNull().references(() => wps.id),
    number: integer("number").notNull(),
    status: text("status").$type<WpsStatus>().notNull().default("draft"),
    title: text("title").notNull().default(""),
    process: text("process").$type<WpsProcess>(),
    iso4063: integer("iso4063"),
    baseMetals: text("base_metals").notNull().default(""),
    thicknessMinMm: doublePrecision("thickness_min_mm"),
    thicknessMaxMm: doublePrecision("thickness_max_mm"),
    fillerClassification: text("filler_classification").notNull().default(""),
    fillerDiameterMm: doublePrecision("filler_diameter_mm"),
    shieldingGas: text("shielding_gas").notNull().default(""),
    gasFlowLPerMin: doublePrecision("gas_flow_l_per_min"),
    currentType: text("current_type").$type<"DC" | "AC">(),
    polarity: text("polarity").$type<"EP" | "EN">(),
    voltsMin: doublePrecision("volts_min"),
    voltsMax: doublePrecision("volts_max"),
    ampsMin: doublePrecision("amps_min"),
    ampsMax: doublePrecision("amps_max"),
    travelSpeedMinMmPerMin: doublePrecision("travel_speed_min_mm_per_min"),
    travelSpeedMaxMmPerMin: doublePrecision("travel_speed_max_mm_per_min"),
    heatInputMaxKJPerMm: doublePrecision("heat_input_max_kj_per_mm"),
    heatInputBasis: text("heat_input_basis").$type<"arc-energy" | "iso-q">(),
    preheatMinC: doublePrecision("preheat_min_c"),
    interpassMaxC: doublePrecision("interpass_max_c"),
    positions: text("positions").array().$type<WpsPosition[]>().notNull().default(sql`'{}'::text[]`),
    notes: text("notes").notNull().default(""),
    changeNote: text("change_note"),
    authorId: text("author_id").notNull().references(() => user.id),
    publisherId: text("publisher_id").references(() => user.id),
    publishedAt: timestamp("published_at", { withTimezone: true }),
    retiredBy: text("retired_by").references(() => user.id),
    retiredAt: timestamp("retired_at", { withTimezone: true }),
    retireNote: text("retire_note"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("wps_revision_number_idx").on(t.wpsId, t.number),
    index("wps_revision_shop_idx").on(t.shopId, t.status),
    // One draft at a time (a new revision starts as a copy of the latest) and one revision in use.
    uniqueIndex("wps_revision_one_draft_idx").on(t.wpsId).where(sql`status = 'draft'`),
    uniqueIndex("wps_revision_one_published_idx").on(t.wpsId).where(sql`status = 'published'`),
    check("wps_revision_status", sql`${t.status} in ('draft','published','retired')`),
    check("wps_revision_number_positive", sql`${t.number} >= 1`),
    check("wps_revision_process", sql`${t.process} is null or ${t.process} in ${PROCESS_CHECK}`),
    check("wps_revision_current", sql`${t.currentType} is null or ${t.currentType} in ('DC','AC')`),
    check("wps_revision_polarity", sql`${t.polarity} is null or (${t.polarity} in ('EP','EN') and ${t.currentType} is distinct from 'AC')`),
    check("wps_revision_basis", sql`${t.heatInputBasis} is null or ${t.heatInputBasis} in ('arc-energy','iso-q')`),
    check(
      "wps_revision_ranges",
      sql`(${t.thicknessMinMm} is null or ${t.thicknessMaxMm} is null or ${t.thicknessMinMm} <= ${t.thicknessMaxMm})
        and (${t.voltsMin} is null or ${t.voltsMax} is null or ${t.voltsMin} <= ${t.voltsMax})
        and (${t.ampsMin} is null or ${t.ampsMax} is null or ${t.ampsMin} <= ${t.ampsMax})
        and (${t.travelSpeedMinMmPerMin} is null or ${t.travelSpeedMaxMmPerMin} is null or ${t.travelSpeedMinMmPerMin} <= ${t.travelSpeedMaxMmPerMin})`,
    ),
    // What a welder works to must be all there before it is published (the app says which field is missing).
    check(
      "wps_revision_complete",
      sql`${t.status} = 'draft' or (length(${t.title}) >= 3 and ${t.process} is not null and ${t.iso4063} is not null
        and ${t.baseMetals} <> '' and ${t.thicknessMinMm} is not null and ${t.thicknessMaxMm} is not null
        and ${t.fillerClassification} <> '' and ${t.fillerDiameterMm} is not null and ${t.currentType} is not null
        and ${t.voltsMin} is not null and ${t.voltsMax} is not null and ${t.ampsMin} is not null and ${t.ampsMax} is not null
        and ${t.travelSpeedMinMmPerMin} is not null and ${t.travelSpeedMaxMmPerMin} is not null and ${t.preheatMinC} is not null
        and cardinality(${t.positions}) > 0 and ${t.changeNote} is not null and ${t.publishedAt} is not null)`,
    ),
    check("wps_revision_retired", sql`${t.status} <> 'retired' or ${t.retiredAt} is not null`),
  ],
);

export const welderQualification = pgTable(
  "welder_qualification",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    welderUserId: text("welder_user_id").notNull().references(() => user.id),
    process: text("process").$type<WpsProcess>().notNull(),
    positions: text("positions").array().$type<WpsPosition[]>().notNull(),
    thicknessMinMm: doublePrecision("thickness_min_mm").notNull(),
    // Null: unlimited.
    thicknessMaxMm: doublePrecision("thickness_max_mm"),
    // Null minimum: plate, or any pipe; null maximum: unlimited.
    diameterMinMm: doublePrecision("diameter_min_mm"),
    diameterMaxMm: doublePrecision("diameter_max_mm"),
    fillerFNumber: integer("filler_f_number").notNull(),
    testDate: date("test_date", { mode: "string" }).notNull(),
    // The WPS followed on the test coupon, when it is in the library.
    wpsId: uuid("wps_id").references(() => wps.id),
    notes: text("notes").notNull().default(""),
    certificateKey: text("certificate_key"),
    certificateType: text("certificate_type"),
    certificateName: text("certificate_name"),
    certificateSize: integer("certificate_size"),
    certificateSha256: text("certificate_sha256"),
    certificateUploadedAt: timestamp("certificate_uploaded_at", { withTimezone: true }),
    certificateUploadedBy: text("certificate_uploaded_by").references(() => user.id),
    createdBy: text("created_by").notNull().references(() => user.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("welder_qualification_shop_idx").on(t.shopId, t.welderUserId, t.process),
    check("welder_qualification_process", sql`${t.process} in ${PROCESS_CHECK}`),
    check("welder_qualification_positions", sql`cardinality(${t.positions}) > 0`),
    check("welder_qualification_f_number", sql`${t.fillerFNumber} between 1 and 99`),
    check(
      "welder_qualification_ranges",
      sql`${t.thicknessMinMm} > 0 and (${t.thicknessMaxMm} is null or ${t.thicknessMinMm} <= ${t.thicknessMaxMm})
        and (${t.diameterMinMm} is null or ${t.diameterMaxMm} is null or ${t.diameterMinMm} <= ${t.diameterMaxMm})`,
    ),
  ],
);

// Continuity is per welder and process, whatever the qualification, code or base metal
// (AWS D1.1 interpretation D1.1-06-I08b; ASME IX QW-322.1 speaks of "the process" too).
export const welderProcessUse = pgTable(
  "welder_process_use",
  {
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    welderUserId: text("welder_user_id").notNull().references(() => user.id),
    process: text("process").$type<WpsProcess>().notNull(),
    lastUsedOn: date("last_used_on", { mode: "string" }).notNull(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.shopId, t.welderUserId, t.process] }), check("welder_process_use_process", sql`${t.process} in ${PROCESS_CHECK}`)],
);

// One row per lapsing notice mailed: at most one per qualification, lead and day, and one per reminder
// stage (30, 14, 7, 1 days ahead) of a given expiry date, so a second run of the daily job sends nothing.
export const qualificationNotice = pgTable(
  "qualification_notice",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    qualificationId: uuid("qualification_id").notNull().references(() => welderQualification.id),
    recipientUserId: text("recipient_user_id").notNull().references(() => user.id),
    noticeOn: date("notice_on", { mode: "string" }).notNull(),
    expiresOn: date("expires_on", { mode: "string" }).notNull(),
    stage: integer("stage").notNull(),
    mailId: uuid("mail_id").references(() => mailOutbox.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("qualification_notice_day_idx").on(t.qualificationId, t.recipientUserId, t.noticeOn),
    uniqueIndex("qualification_notice_stage_idx").on(t.qualificationId, t.recipientUserId, t.expiresOn, t.stage),
    index("qualification_notice_shop_idx").on(t.shopId, t.noticeOn),
  ],
);
