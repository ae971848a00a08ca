CREATE TABLE "job" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"number" text NOT NULL,
	"year" integer NOT NULL,
	"seq" integer NOT NULL,
	"status" text DEFAULT 'planned' NOT NULL,
	"customer_name" text NOT NULL,
	"customer_phone" text DEFAULT '' NOT NULL,
	"customer_email" text DEFAULT '' NOT NULL,
	"vehicle_year" integer,
	"vehicle_make_model" text DEFAULT '' NOT NULL,
	"vin" text DEFAULT '' NOT NULL,
	"vin_warning" text,
	"axle_description" text DEFAULT '' NOT NULL,
	"axle_tag" text DEFAULT '' NOT NULL,
	"procedure_id" uuid NOT NULL,
	"procedure_version_id" uuid NOT NULL,
	"procedure_version_number" integer NOT NULL,
	"procedure_title" text NOT NULL,
	"due_date" date,
	"notes" text DEFAULT '' NOT NULL,
	"steps_total" integer DEFAULT 0 NOT NULL,
	"steps_signed" integer DEFAULT 0 NOT NULL,
	"open_nonconformances" integer DEFAULT 0 NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"released_at" timestamp with time zone,
	"released_by" text,
	"voided_at" timestamp with time zone,
	"voided_by" text,
	"void_reason" text,
	"search_text" text GENERATED ALWAYS AS (lower("job"."number" || ' ' || "job"."vin" || ' ' || "job"."axle_tag" || ' ' || "job"."customer_name")) STORED,
	CONSTRAINT "job_void_reason" CHECK ("job"."status" <> 'void' or "job"."void_reason" is not null)
);
--> statement-breakpoint
CREATE TABLE "job_activity" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"actor_id" text,
	"action" text NOT NULL,
	"step_id" uuid,
	"detail" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "job_assignment" (
	"job_id" uuid NOT NULL,
	"shop_id" uuid NOT NULL,
	"user_id" text NOT NULL,
	"role" text NOT NULL,
	"assigned_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "job_assignment_job_id_user_id_role_pk" PRIMARY KEY("job_id","user_id","role")
);
--> statement-breakpoint
CREATE TABLE "job_counter" (
	"shop_id" uuid NOT NULL,
	"year" integer NOT NULL,
	"last" integer DEFAULT 0 NOT NULL,
	CONSTRAINT "job_counter_shop_id_year_pk" PRIMARY KEY("shop_id","year")
);
--> statement-breakpoint
CREATE TABLE "job_step" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"section_key" text NOT NULL,
	"section_title" text NOT NULL,
	"section_position" integer NOT NULL,
	"step_key" text NOT NULL,
	"kind" text NOT NULL,
	"title" text NOT NULL,
	"spec" jsonb NOT NULL,
	"value" jsonb,
	"version" integer DEFAULT 0 NOT NULL,
	"updated_by" text,
	"updated_at" timestamp with time zone,
	"signed_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "nonconformance" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"step_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"description" text NOT NULL,
	"proposed_disposition" text NOT NULL,
	"observed" jsonb,
	"raised_by" text NOT NULL,
	"raised_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "nonconformance_disposition" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"nonconformance_id" uuid NOT NULL,
	"disposition" text NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"decided_by" text NOT NULL,
	"sign_off_id" uuid NOT NULL,
	"decided_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "photo" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"step_id" uuid,
	"nonconformance_id" uuid,
	"key" text NOT NULL,
	"thumb_key" text NOT NULL,
	"sha256" text NOT NULL,
	"content_type" text NOT NULL,
	"size" integer NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"original_type" text NOT NULL,
	"original_size" integer NOT NULL,
	"idempotency_key" text NOT NULL,
	"caption" text DEFAULT '' NOT NULL,
	"uploaded_by" text NOT NULL,
	"uploaded_at" timestamp with time zone DEFAULT now() NOT NULL,
	"removed_at" timestamp with time zone,
	"removed_by" text
);
--> statement-breakpoint
CREATE TABLE "sign_off" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"step_id" uuid,
	"nonconformance_id" uuid,
	"user_id" text NOT NULL,
	"printed_name" text NOT NULL,
	"role" text NOT NULL,
	"meaning" text NOT NULL,
	"signed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"content" jsonb NOT NULL,
	"content_hash" text NOT NULL,
	"amends_sign_off_id" uuid,
	"reason" text,
	CONSTRAINT "sign_off_amendment_reason" CHECK ("sign_off"."amends_sign_off_id" is null or length(trim("sign_off"."reason")) > 0),
	CONSTRAINT "sign_off_hash" CHECK ("sign_off"."content_hash" ~ '^[0-9a-f]{64}$')
);
--> statement-breakpoint
CREATE TABLE "weld_pass" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"step_id" uuid NOT NULL,
	"pass_number" integer NOT NULL,
	"welder_id" text NOT NULL,
	"process" text NOT NULL,
	"volts" double precision NOT NULL,
	"amps" double precision NOT NULL,
	"travel_speed_mm_per_min" double precision NOT NULL,
	"travel_speed_unit" text NOT NULL,
	"preheat_c" double precision NOT NULL,
	"interpass_c" double precision,
	"filler_lot" text NOT NULL,
	"arc_energy_kj_per_mm" double precision NOT NULL,
	"heat_input_kj_per_mm" double precision NOT NULL,
	"client_key" text NOT NULL,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	"removed_at" timestamp with time zone,
	"removed_by" text
);
--> statement-breakpoint
ALTER TABLE "job" ADD CONSTRAINT "job_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job" ADD CONSTRAINT "job_procedure_id_procedure_id_fk" FOREIGN KEY ("procedure_id") REFERENCES "public"."procedure"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job" ADD CONSTRAINT "job_procedure_version_id_procedure_version_id_fk" FOREIGN KEY ("procedure_version_id") REFERENCES "public"."procedure_version"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job" ADD CONSTRAINT "job_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job" ADD CONSTRAINT "job_released_by_user_id_fk" FOREIGN KEY ("released_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job" ADD CONSTRAINT "job_voided_by_user_id_fk" FOREIGN KEY ("voided_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_activity" ADD CONSTRAINT "job_activity_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_activity" ADD CONSTRAINT "job_activity_job_id_job_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."job"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_activity" ADD CONSTRAINT "job_activity_actor_id_user_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_assignment" ADD CONSTRAINT "job_assignment_job_id_job_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."job"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_assignment" ADD CONSTRAINT "job_assignment_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_assignment" ADD CONSTRAINT "job_assignment_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_counter" ADD CONSTRAINT "job_counter_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_step" ADD CONSTRAINT "job_step_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_step" ADD CONSTRAINT "job_step_job_id_job_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."job"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_step" ADD CONSTRAINT "job_step_updated_by_user_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "nonconformance" ADD CONSTRAINT "nonconformance_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "nonconformance" ADD CONSTRAINT "nonconformance_job_id_job_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."job"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "nonconformance" ADD CONSTRAINT "nonconformance_step_id_job_step_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."job_step"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "nonconformance" ADD CONSTRAINT "nonconformance_raised_by_user_id_fk" FOREIGN KEY ("raised_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "nonconformance_disposition" ADD CONSTRAINT "nonconformance_disposition_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "nonconformance_disposition" ADD CONSTRAINT "nonconformance_disposition_job_id_job_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."job"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "nonconformance_disposition" ADD CONSTRAINT "nonconformance_disposition_nonconformance_id_nonconformance_id_fk" FOREIGN KEY ("nonconformance_id") REFERENCES "public"."nonconformance"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "nonconformance_disposition" ADD CONSTRAINT "nonconformance_disposition_decided_by_user_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "nonconformance_disposition" ADD CONSTRAINT "nonconformance_disposition_sign_off_id_sign_off_id_fk" FOREIGN KEY ("sign_off_id") REFERENCES "public"."sign_off"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photo" ADD CONSTRAINT "photo_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photo" ADD CONSTRAINT "photo_job_id_job_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."job"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photo" ADD CONSTRAINT "photo_step_id_job_step_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."job_step"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photo" ADD CONSTRAINT "photo_nonconformance_id_nonconformance_id_fk" FOREIGN KEY ("nonconformance_id") REFERENCES "public"."nonconformance"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photo" ADD CONSTRAINT "photo_uploaded_by_user_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photo" ADD CONSTRAINT "photo_removed_by_user_id_fk" FOREIGN KEY ("removed_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_off" ADD CONSTRAINT "sign_off_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_off" ADD CONSTRAINT "sign_off_job_id_job_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."job"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_off" ADD CONSTRAINT "sign_off_step_id_job_step_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."job_step"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_off" ADD CONSTRAINT "sign_off_nonconformance_id_nonconformance_id_fk" FOREIGN KEY ("nonconformance_id") REFERENCES "public"."nonconformance"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_off" ADD CONSTRAINT "sign_off_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_off" ADD CONSTRAINT "sign_off_amends_sign_off_id_sign_off_id_fk" FOREIGN KEY ("amends_sign_off_id") REFERENCES "public"."sign_off"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD CONSTRAINT "weld_pass_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD CONSTRAINT "weld_pass_job_id_job_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."job"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD CONSTRAINT "weld_pass_step_id_job_step_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."job_step"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD CONSTRAINT "weld_pass_welder_id_user_id_fk" FOREIGN KEY ("welder_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_pass" ADD CONSTRAINT "weld_pass_removed_by_user_id_fk" FOREIGN KEY ("removed_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "job_shop_number_idx" ON "job" USING btree ("shop_id","number");--> statement-breakpoint
CREATE INDEX "job_shop_seq_idx" ON "job" USING btree ("shop_id","year","seq");--> statement-breakpoint
CREATE INDEX "job_shop_status_idx" ON "job" USING btree ("shop_id","status","due_date");--> statement-breakpoint
CREATE INDEX "job_shop_due_idx" ON "job" USING btree ("shop_id","due_date");--> statement-breakpoint
CREATE INDEX "job_shop_created_idx" ON "job" USING btree ("shop_id","created_at");--> statement-breakpoint
CREATE INDEX "job_shop_customer_idx" ON "job" USING btree ("shop_id",lower("customer_name"));--> statement-breakpoint
CREATE INDEX "job_activity_job_idx" ON "job_activity" USING btree ("job_id","at");--> statement-breakpoint
CREATE INDEX "job_assignment_user_idx" ON "job_assignment" USING btree ("shop_id","user_id","role");--> statement-breakpoint
CREATE UNIQUE INDEX "job_step_key_idx" ON "job_step" USING btree ("job_id","step_key");--> statement-breakpoint
CREATE UNIQUE INDEX "job_step_position_idx" ON "job_step" USING btree ("job_id","position");--> statement-breakpoint
CREATE INDEX "job_step_shop_idx" ON "job_step" USING btree ("shop_id","job_id");--> statement-breakpoint
CREATE UNIQUE INDEX "nonconformance_number_idx" ON "nonconformance" USING btree ("job_id","number");--> statement-breakpoint
CREATE INDEX "nonconformance_step_idx" ON "nonconformance" USING btree ("step_id");--> statement-breakpoint
CREATE UNIQUE INDEX "nonconformance_disposition_nc_idx" ON "nonconformance_disposition" USING btree ("nonconformance_id");--> statement-breakpoint
CREATE INDEX "nonconformance_disposition_job_idx" ON "nonconformance_disposition" USING btree ("job_id");--> statement-breakpoint
CREATE UNIQUE INDEX "photo_idempotency_idx" ON "photo" USING btree ("shop_id","idempotency_key");--> statement-breakpoint
CREATE INDEX "photo_job_idx" ON "photo" USING btree ("job_id","uploaded_at");--> statement-breakpoint
CREATE INDEX "photo_step_idx" ON "photo" USING btree ("step_id");--> statement-breakpoint
CREATE INDEX "sign_off_job_idx" ON "sign_off" USING btree ("job_id","signed_at");--> statement-breakpoint
CREATE INDEX "sign_off_user_idx" ON "sign_off" USING btree ("shop_id","user_id");--> statement-breakpoint
CREATE UNIQUE INDEX "sign_off_step_original_idx" ON "sign_off" USING btree ("step_id","meaning") WHERE "sign_off"."amends_sign_off_id" is null and "sign_off"."step_id" is not null;--> statement-breakpoint
CREATE UNIQUE INDEX "sign_off_release_idx" ON "sign_off" USING btree ("job_id") WHERE "sign_off"."meaning" = 'released';--> statement-breakpoint
CREATE UNIQUE INDEX "sign_off_nc_idx" ON "sign_off" USING btree ("nonconformance_id") WHERE "sign_off"."nonconformance_id" is not null;--> statement-breakpoint
CREATE UNIQUE INDEX "weld_pass_number_idx" ON "weld_pass" USING btree ("step_id","pass_number");--> statement-breakpoint
CREATE UNIQUE INDEX "weld_pass_client_key_idx" ON "weld_pass" USING btree ("shop_id","client_key");--> statement-breakpoint
CREATE INDEX "weld_pass_job_idx" ON "weld_pass" USING btree ("job_id","step_id");--> statement-breakpoint
CREATE INDEX "weld_pass_welder_idx" ON "weld_pass" USING btree ("shop_id","welder_id");