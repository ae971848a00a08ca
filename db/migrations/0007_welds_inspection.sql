CREATE TABLE "job_material" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"description" text NOT NULL,
	"specification" text DEFAULT '' NOT NULL,
	"heat_number" text NOT NULL,
	"certificate" text DEFAULT '' NOT NULL,
	"corrects_id" uuid,
	"withdrawn" boolean DEFAULT false NOT NULL,
	"reason" text,
	"recorded_by" text NOT NULL,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "job_material_correction_reason" CHECK ("job_material"."corrects_id" is null or length(trim("job_material"."reason")) > 0)
);
--> statement-breakpoint
CREATE TABLE "weld_inspection" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"step_id" uuid NOT NULL,
	"round" integer NOT NULL,
	"criteria" text NOT NULL,
	"observations" jsonb NOT NULL,
	"items" jsonb NOT NULL,
	"judged" text NOT NULL,
	"decision" text NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"photo_ids" uuid[] NOT NULL,
	"inspector_id" text NOT NULL,
	"sign_off_id" uuid NOT NULL,
	"inspected_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "weld_inspection_photos" CHECK (cardinality("weld_inspection"."photo_ids") >= 1),
	CONSTRAINT "weld_inspection_accept" CHECK ("weld_inspection"."decision" = 'rejected' or "weld_inspection"."judged" = 'accept')
);
--> statement-breakpoint
CREATE TABLE "weld_pass_override" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"step_id" uuid NOT NULL,
	"pass_id" uuid NOT NULL,
	"reason" text NOT NULL,
	"lead_id" text NOT NULL,
	"printed_name" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "weld_pass_override_reason" CHECK (length(trim("weld_pass_override"."reason")) >= 5)
);
--> statement-breakpoint
DROP INDEX "sign_off_step_original_idx";--> statement-breakpoint
ALTER TABLE "sign_off" ADD COLUMN "round" integer;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD COLUMN "round" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD COLUMN "position" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD COLUMN "filler_classification" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD COLUMN "wps_revision_id" uuid;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD COLUMN "wps_reference" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD COLUMN "wps_revision_number" integer;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD COLUMN "heat_input_method" text DEFAULT 'voltage-current' NOT NULL;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD COLUMN "bead_length_mm" double precision;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD COLUMN "arc_time_s" double precision;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD COLUMN "machine_energy_kj" double precision;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD COLUMN "machine_power_w" double precision;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD COLUMN "j_per_in" double precision;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD COLUMN "wps_findings" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD COLUMN "out_of_range" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "job_material" ADD CONSTRAINT "job_material_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_material" ADD CONSTRAINT "job_material_job_id_job_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."job"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_material" ADD CONSTRAINT "job_material_corrects_id_job_material_id_fk" FOREIGN KEY ("corrects_id") REFERENCES "public"."job_material"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_material" ADD CONSTRAINT "job_material_recorded_by_user_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_inspection" ADD CONSTRAINT "weld_inspection_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_inspection" ADD CONSTRAINT "weld_inspection_job_id_job_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."job"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_inspection" ADD CONSTRAINT "weld_inspection_step_id_job_step_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."job_step"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_inspection" ADD CONSTRAINT "weld_inspection_inspector_id_user_id_fk" FOREIGN KEY ("inspector_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_inspection" ADD CONSTRAINT "weld_inspection_sign_off_id_sign_off_id_fk" FOREIGN KEY ("sign_off_id") REFERENCES "public"."sign_off"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_pass_override" ADD CONSTRAINT "weld_pass_override_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_pass_override" ADD CONSTRAINT "weld_pass_override_job_id_job_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."job"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_pass_override" ADD CONSTRAINT "weld_pass_override_step_id_job_step_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."job_step"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_pass_override" ADD CONSTRAINT "weld_pass_override_pass_id_weld_pass_id_fk" FOREIGN KEY ("pass_id") REFERENCES "public"."weld_pass"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_pass_override" ADD CONSTRAINT "weld_pass_override_lead_id_user_id_fk" FOREIGN KEY ("lead_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "job_material_job_idx" ON "job_material" USING btree ("job_id","recorded_at");--> statement-breakpoint
CREATE UNIQUE INDEX "job_material_corrects_idx" ON "job_material" USING btree ("corrects_id") WHERE "job_material"."corrects_id" is not null;--> statement-breakpoint
CREATE UNIQUE INDEX "weld_inspection_round_idx" ON "weld_inspection" USING btree ("step_id","round");--> statement-breakpoint
CREATE UNIQUE INDEX "weld_inspection_sign_off_idx" ON "weld_inspection" USING btree ("sign_off_id");--> statement-breakpoint
CREATE INDEX "weld_inspection_job_idx" ON "weld_inspection" USING btree ("job_id","inspected_at");--> statement-breakpoint
CREATE UNIQUE INDEX "weld_pass_override_pass_idx" ON "weld_pass_override" USING btree ("pass_id");--> statement-breakpoint
ALTER TABLE "weld_pass" ADD CONSTRAINT "weld_pass_wps_revision_id_wps_revision_id_fk" FOREIGN KEY ("wps_revision_id") REFERENCES "public"."wps_revision"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "sign_off_step_round_idx" ON "sign_off" USING btree ("step_id","meaning",coalesce("round", 1)) WHERE "sign_off"."amends_sign_off_id" is null and "sign_off"."step_id" is not null;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD CONSTRAINT "weld_pass_round" CHECK ("weld_pass"."round" >= 1);