import { sql } from "drizzle-orm";
import { boolean, check, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { user } from "./auth";

export const ROLES = ["lead", "welder", "inspector", "auditor"] as const;
export type Role = (typeof ROLES)[number];

export const shop = pgTable("shop", {
  id: uuid("id").primaryKey().defaultRandom(),
  name: text("name").notNull(),
  slug: text("slug").notNull().unique(),
  // Which code's continuity rule keeps welder qualifications alive (ASME IX QW-322.1 or AWS D1.1).
  continuityCode: text("continuity_code", { enum: ["asme-ix", "aws-d1.1"] }).notNull().default("aws-d1.1"),
  // Where each release's seal is mailed, so a copy of it lives outside the database; null = the shop's leads.
  archiveEmail: text("archive_email"),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});

export const membership = pgTable(
  "membership",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    userId: text("user_id").notNull().references(() => user.id),
    roles: text("roles").array().$type<Role[]>().notNull(),
    // The name printed on this person's sign-offs in this shop. Set by a lead (logged), never by the person's
    // own account settings; a change applies to later sign-offs only.
    legalName: text("legal_name").notNull(),
    active: boolean("active").notNull().default(true),
    unitSystem: text("unit_system", { enum: ["metric", "imperial"] }).notNull().default("metric"),
    // Signing PIN: scrypt hash, never the digits. Failures count towards a lock.
    pinHash: text("pin_hash"),
    pinSetAt: timestamp("pin_set_at", { withTimezone: true }),
    pinFailures: integer("pin_failures").notNull().default(0),
    pinLockedAt: timestamp("pin_locked_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    deactivatedAt: timestamp("deactivated_at", { withTimezone: true }),
  },
  (t) => [
    uniqueIndex("membership_shop_user_idx").on(t.shopId, t.userId),
    index("membership_user_idx").on(t.userId),
    check("membership_roles_nonempty", sql`cardinality(${t.roles}) > 0`),
  ],
);

export const invitation = pgTable(
  "invitation",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    email: text("email").notNull(),
    roles: text("roles").array().$type<Role[]>().notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    invitedBy: text("invited_by").notNull().references(() => user.id),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("invitation_shop_idx").on(t.shopId, t.createdAt)],
);

// Who did what in a shop, outside any job (people changes, PIN resets).
export const shopActivity = pgTable(
  "shop_activity",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    actorId: text("actor_id").references(() => user.id),
    action: text("action").notNull(),
    detail: jsonb("detail").$type<Record<string, unknown>>().notNull().default({}),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("shop_activity_shop_idx").on(t.shopId, t.at)],
);

// Filled by the local mail catcher only; the lead's Local mailbox page lists it.
export const caughtMail = pgTable(
  "caught_mail",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    messageId: text("message_id"),
    fromAddress: text("from_address").notNull(),
    toAddress: text("to_address").notNull(),
    subject: text("subject").notNull(),
    textBody: text("text_body").notNull(),
    htmlBody: text("html_body"),
    attachments: jsonb("attachments").$type<{ filename: string | null; contentType: string; size: number }[]>().notNull().default([]),
    raw: text("raw").notNull(),
    // The shop a mail was sent for (the app's X-Gusset-Shop header), so a lead's mailbox shows only their shop's.
    shopId: uuid("shop_id"),
    receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("caught_mail_received_idx").on(t.receivedAt), index("caught_mail_shop_idx").on(t.shopId, t.receivedAt)],
);

// Mails the app means to send; a failed send stays here and is retried, so no record waits on SMTP.
export const mailOutbox = pgTable(
  "mail_outbox",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").references(() => shop.id),
    toAddress: text("to_address").notNull(),
    subject: text("subject").notNull(),
    textBody: text("text_body").notNull(),
    htmlBody: text("html_body").notNull(),
    // Kept with the mail so that a retry sends the same files (the traveller PDF on release).
    attachments: jsonb("attachments").$type<{ filename: string; contentType: string; base64: string }[]>().notNull().default([]),
    attempts: integer("attempts").notNull().default(0),
    lastError: text("last_error"),
    sentAt: timestamp("sent_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("mail_outbox_pending_idx").on(t.sentAt, t.createdAt)],
);
