CREATE TABLE "job_token" (
	"job_id" uuid PRIMARY KEY NOT NULL,
	"shop_id" uuid NOT NULL,
	"token" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "job_token_token_unique" UNIQUE("token")
);
--> statement-breakpoint
CREATE TABLE "record_entry" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"seq" integer NOT NULL,
	"sign_off_id" uuid NOT NULL,
	"prev_hash" text NOT NULL,
	"hash" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "job_token" ADD CONSTRAINT "job_token_job_id_job_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."job"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_token" ADD CONSTRAINT "job_token_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "record_entry" ADD CONSTRAINT "record_entry_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "record_entry" ADD CONSTRAINT "record_entry_job_id_job_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."job"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "record_entry" ADD CONSTRAINT "record_entry_sign_off_id_sign_off_id_fk" FOREIGN KEY ("sign_off_id") REFERENCES "public"."sign_off"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "record_entry_seq_idx" ON "record_entry" USING btree ("job_id","seq");--> statement-breakpoint
CREATE UNIQUE INDEX "record_entry_sign_off_idx" ON "record_entry" USING btree ("sign_off_id");--> statement-breakpoint
CREATE INDEX "record_entry_shop_idx" ON "record_entry" USING btree ("shop_id");