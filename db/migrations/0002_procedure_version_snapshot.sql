ALTER TABLE "procedure_version" ADD COLUMN "title" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "procedure_version" ADD COLUMN "scope" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "procedure_version" ADD COLUMN "code" text DEFAULT '' NOT NULL;--> statement-breakpoint
CREATE UNIQUE INDEX "procedure_version_one_draft_idx" ON "procedure_version" USING btree ("procedure_id") WHERE status = 'draft';