// The job's record chain: one entry per sign-off (performed, inspected, dispositioned, released, and
// amendments), each hashed with the one before it. The head hash is the job's seal, printed on the
// traveller. Entries are derived from the sign-off rows themselves, so a changed sign-off no longer
// matches its entry and verification names it. db/sql/040-records.sql refuses UPDATE and DELETE.
import { index, integer, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { job, signOff } from "./jobs";
import { shop } from "./shops";

export const recordEntry = pgTable(
  "record_entry",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    shopId: uuid("shop_id").notNull().references(() => shop.id),
    jobId: uuid("job_id").notNull().references(() => job.id),
    seq: integer("seq").notNull(),
    signOffId: uuid("sign_off_id").notNull().references(() => signOff.id),
    prevHash: text("prev_hash").notNull(),
    hash: text("hash").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("record_entry_seq_idx").on(t.jobId, t.seq),
    uniqueIndex("record_entry_sign_off_idx").on(t.signOffId),
    index("record_entry_shop_idx").on(t.shopId),
  ],
);

// The random token in the traveller's QR code (not the job id): 160 bits, base64url.
export const jobToken = pgTable("job_token", {
  jobId: uuid("job_id").primaryKey().references(() => job.id),
  shopId: uuid("shop_id").notNull().references(() => shop.id),
  token: text("token").notNull().unique(),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});
