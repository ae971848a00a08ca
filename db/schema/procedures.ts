import { sql } from "drizzle-orm";
import { index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import type { VersionContent } from "@/lib/procedures/schema";
import { user } from "./auth";
import { shop } from "./shops";

export const procedure = pgTable(
  "procedure",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    title: text("title").notNull(),
    scope: text("scope").notNull().default(""),
    code: text("code").notNull().default(""),
    ownerId: text("owner_id").notNull().references(() => user.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("procedure_shop_idx").on(t.shopId, t.title)],
);

// A published or retired version never changes: the database refuses it (db/sql triggers).
export const procedureVersion = pgTable(
  "procedure_version",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    procedureId: uuid("procedure_id").notNull().references(() => procedure.id),
    number: integer("number").notNull(),
    status: text("status", { enum: ["draft", "published", "retired"] }).notNull().default("draft"),
    // What the procedure was called and what it followed when this version was written: a job pinned to it
    // reads these years later, whatever the procedure is called by then. Part of the hashed content.
    title: text("title").notNull().default(""),
    scope: text("scope").notNull().default(""),
    code: text("code").notNull().default(""),
    content: jsonb("content").$type<VersionContent>().notNull(),
    contentHash: text("content_hash"),
    changeNote: text("change_note"),
    authorId: text("author_id").notNull().references(() => user.id),
    publisherId: text("publisher_id").references(() => user.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
    publishedAt: timestamp("published_at", { withTimezone: true }),
    retiredAt: timestamp("retired_at", { withTimezone: true }),
  },
  (t) => [
    uniqueIndex("procedure_version_number_idx").on(t.procedureId, t.number),
    index("procedure_version_shop_idx").on(t.shopId, t.status),
    // One draft at a time per procedure: a new version starts as a copy of the latest.
    uniqueIndex("procedure_version_one_draft_idx").on(t.procedureId).where(sql`status = 'draft'`),
  ],
);

// An image a procedure's weld map marks joints on: an uploaded photo or drawing (re-encoded, metadata-free),
// the first page of a PDF, or a drawing made in Gusset. Never changed: versions name it by id and SHA-256.
export const procedureImage = pgTable(
  "procedure_image",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    procedureId: uuid("procedure_id").notNull().references(() => procedure.id),
    key: text("key").notNull(),
    thumbKey: text("thumb_key").notNull(),
    sha256: text("sha256").notNull(),
    contentType: text("content_type").notNull(),
    size: integer("size").notNull(),
    width: integer("width").notNull(),
    height: integer("height").notNull(),
    source: text("source", { enum: ["upload", "pdf", "drawing"] }).notNull(),
    originalType: text("original_type").notNull(),
    uploadedBy: text("uploaded_by").notNull().references(() => user.id),
    uploadedAt: timestamp("uploaded_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("procedure_image_procedure_idx").on(t.shopId, t.procedureId)],
);
