CREATE TABLE "qualification_notice" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"qualification_id" uuid NOT NULL,
	"recipient_user_id" text NOT NULL,
	"notice_on" date NOT NULL,
	"expires_on" date NOT NULL,
	"stage" integer NOT NULL,
	"mail_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "welder_process_use" (
	"shop_id" uuid NOT NULL,
	"welder_user_id" text NOT NULL,
	"process" text NOT NULL,
	"last_used_on" date NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "welder_process_use_shop_id_welder_user_id_process_pk" PRIMARY KEY("shop_id","welder_user_id","process"),
	CONSTRAINT "welder_process_use_process" CHECK ("welder_process_use"."process" in ('SMAW','GMAW','FCAW','GTAW','SAW'))
);
--> statement-breakpoint
CREATE TABLE "welder_qualification" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"welder_user_id" text NOT NULL,
	"process" text NOT NULL,
	"positions" text[] NOT NULL,
	"thickness_min_mm" double precision NOT NULL,
	"thickness_max_mm" double precision,
	"diameter_min_mm" double precision,
	"diameter_max_mm" double precision,
	"filler_f_number" integer NOT NULL,
	"test_date" date NOT NULL,
	"wps_id" uuid,
	"notes" text DEFAULT '' NOT NULL,
	"certificate_key" text,
	"certificate_type" text,
	"certificate_name" text,
	"certificate_size" integer,
	"certificate_sha256" text,
	"certificate_uploaded_at" timestamp with time zone,
	"certificate_uploaded_by" text,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "welder_qualification_process" CHECK ("welder_qualification"."process" in ('SMAW','GMAW','FCAW','GTAW','SAW')),
	CONSTRAINT "welder_qualification_positions" CHECK (cardinality("welder_qualification"."positions") > 0),
	CONSTRAINT "welder_qualification_f_number" CHECK ("welder_qualification"."filler_f_number" between 1 and 99),
	CONSTRAINT "welder_qualification_ranges" CHECK ("welder_qualification"."thickness_min_mm" > 0 and ("welder_qualification"."thickness_max_mm" is null or "welder_qualification"."thickness_min_mm" <= "welder_qualification"."thickness_max_mm")
        and ("welder_qualification"."diameter_min_mm" is null or "welder_qualification"."diameter_max_mm" is null or "welder_qualification"."diameter_min_mm" <= "welder_qualification"."diameter_max_mm"))
);
--> statement-breakpoint
CREATE TABLE "wps" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"reference" text NOT NULL,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "wps_revision" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"wps_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"status" text DEFAULT 'draft' NOT NULL,
	"title" text DEFAULT '' NOT NULL,
	"process" text,
	"iso4063" integer,
	"base_metals" text DEFAULT '' NOT NULL,
	"thickness_min_mm" double precision,
	"thickness_max_mm" double precision,
	"filler_classification" text DEFAULT '' NOT NULL,
	"filler_diameter_mm" double precision,
	"shielding_gas" text DEFAULT '' NOT NULL,
	"gas_flow_l_per_min" double precision,
	"current_type" text,
	"polarity" text,
	"volts_min" double precision,
	"volts_max" double precision,
	"amps_min" double precision,
	"amps_max" double precision,
	"travel_speed_min_mm_per_min" double precision,
	"travel_speed_max_mm_per_min" double precision,
	"heat_input_max_kj_per_mm" double precision,
	"heat_input_basis" text,
	"preheat_min_c" double precision,
	"interpass_max_c" double precision,
	"positions" text[] DEFAULT '{}'::text[] NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"change_note" text,
	"author_id" text NOT NULL,
	"publisher_id" text,
	"published_at" timestamp with time zone,
	"retired_by" text,
	"retired_at" timestamp with time zone,
	"retire_note" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "wps_revision_status" CHECK ("wps_revision"."status" in ('draft','published','retired')),
	CONSTRAINT "wps_revision_number_positive" CHECK ("wps_revision"."number" >= 1),
	CONSTRAINT "wps_revision_process" CHECK ("wps_revision"."process" is null or "wps_revision"."process" in ('SMAW','GMAW','FCAW','GTAW','SAW')),
	CONSTRAINT "wps_revision_current" CHECK ("wps_revision"."current_type" is null or "wps_revision"."current_type" in ('DC','AC')),
	CONSTRAINT "wps_revision_polarity" CHECK ("wps_revision"."polarity" is null or ("wps_revision"."polarity" in ('EP','EN') and "wps_revision"."current_type" is distinct from 'AC')),
	CONSTRAINT "wps_revision_basis" CHECK ("wps_revision"."heat_input_basis" is null or "wps_revision"."heat_input_basis" in ('arc-energy','iso-q')),
	CONSTRAINT "wps_revision_ranges" CHECK (("wps_revision"."thickness_min_mm" is null or "wps_revision"."thickness_max_mm" is null or "wps_revision"."thickness_min_mm" <= "wps_revision"."thickness_max_mm")
        and ("wps_revision"."volts_min" is null or "wps_revision"."volts_max" is null or "wps_revision"."volts_min" <= "wps_revision"."volts_max")
        and ("wps_revision"."amps_min" is null or "wps_revision"."amps_max" is null or "wps_revision"."amps_min" <= "wps_revision"."amps_max")
        and ("wps_revision"."travel_speed_min_mm_per_min" is null or "wps_revision"."travel_speed_max_mm_per_min" is null or "wps_revision"."travel_speed_min_mm_per_min" <= "wps_revision"."travel_speed_max_mm_per_min")),
	CONSTRAINT "wps_revision_complete" CHECK ("wps_revision"."status" = 'draft' or (length("wps_revision"."title") >= 3 and "wps_revision"."process" is not null and "wps_revision"."iso4063" is not null
        and "wps_revision"."base_metals" <> '' and "wps_revision"."thickness_min_mm" is not null and "wps_revision"."thickness_max_mm" is not null
        and "wps_revision"."filler_classification" <> '' and "wps_revision"."filler_diameter_mm" is not null and "wps_revision"."current_type" is not null
        and "wps_revision"."volts_min" is not null and "wps_revision"."volts_max" is not null and "wps_revision"."amps_min" is not null and "wps_revision"."amps_max" is not null
        and "wps_revision"."travel_speed_min_mm_per_min" is not null and "wps_revision"."travel_speed_max_mm_per_min" is not null and "wps_revision"."preheat_min_c" is not null
        and cardinality("wps_revision"."positions") > 0 and "wps_revision"."change_note" is not null and "wps_revision"."published_at" is not null)),
	CONSTRAINT "wps_revision_retired" CHECK ("wps_revision"."status" <> 'retired' or "wps_revision"."retired_at" is not null)
);
--> statement-breakpoint
ALTER TABLE "qualification_notice" ADD CONSTRAINT "qualification_notice_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "qualification_notice" ADD CONSTRAINT "qualification_notice_qualification_id_welder_qualification_id_fk" FOREIGN KEY ("qualification_id") REFERENCES "public"."welder_qualification"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "qualification_notice" ADD CONSTRAINT "qualification_notice_recipient_user_id_user_id_fk" FOREIGN KEY ("recipient_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "qualification_notice" ADD CONSTRAINT "qualification_notice_mail_id_mail_outbox_id_fk" FOREIGN KEY ("mail_id") REFERENCES "public"."mail_outbox"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "welder_process_use" ADD CONSTRAINT "welder_process_use_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "welder_process_use" ADD CONSTRAINT "welder_process_use_welder_user_id_user_id_fk" FOREIGN KEY ("welder_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "welder_qualification" ADD CONSTRAINT "welder_qualification_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "welder_qualification" ADD CONSTRAINT "welder_qualification_welder_user_id_user_id_fk" FOREIGN KEY ("welder_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "welder_qualification" ADD CONSTRAINT "welder_qualification_wps_id_wps_id_fk" FOREIGN KEY ("wps_id") REFERENCES "public"."wps"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "welder_qualification" ADD CONSTRAINT "welder_qualification_certificate_uploaded_by_user_id_fk" FOREIGN KEY ("certificate_uploaded_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "welder_qualification" ADD CONSTRAINT "welder_qualification_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wps" ADD CONSTRAINT "wps_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wps" ADD CONSTRAINT "wps_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wps_revision" ADD CONSTRAINT "wps_revision_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wps_revision" ADD CONSTRAINT "wps_revision_wps_id_wps_id_fk" FOREIGN KEY ("wps_id") REFERENCES "public"."wps"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wps_revision" ADD CONSTRAINT "wps_revision_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wps_revision" ADD CONSTRAINT "wps_revision_publisher_id_user_id_fk" FOREIGN KEY ("publisher_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "wps_revision" ADD CONSTRAINT "wps_revision_retired_by_user_id_fk" FOREIGN KEY ("retired_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "qualification_notice_day_idx" ON "qualification_notice" USING btree ("qualification_id","recipient_user_id","notice_on");--> statement-breakpoint
CREATE UNIQUE INDEX "qualification_notice_stage_idx" ON "qualification_notice" USING btree ("qualification_id","recipient_user_id","expires_on","stage");--> statement-breakpoint
CREATE INDEX "qualification_notice_shop_idx" ON "qualification_notice" USING btree ("shop_id","notice_on");--> statement-breakpoint
CREATE INDEX "welder_qualification_shop_idx" ON "welder_qualification" USING btree ("shop_id","welder_user_id","process");--> statement-breakpoint
CREATE UNIQUE INDEX "wps_shop_reference_idx" ON "wps" USING btree ("shop_id","reference");--> statement-breakpoint
CREATE UNIQUE INDEX "wps_revision_number_idx" ON "wps_revision" USING btree ("wps_id","number");--> statement-breakpoint
CREATE INDEX "wps_revision_shop_idx" ON "wps_revision" USING btree ("shop_id","status");--> statement-breakpoint
CREATE UNIQUE INDEX "wps_revision_one_draft_idx" ON "wps_revision" USING btree ("wps_id") WHERE status = 'draft';--> statement-breakpoint
CREATE UNIQUE INDEX "wps_revision_one_published_idx" ON "wps_revision" USING btree ("wps_id") WHERE status = 'published';