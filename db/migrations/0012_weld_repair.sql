CREATE TABLE "weld_repair" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"shop_id" uuid NOT NULL,
	"job_id" uuid NOT NULL,
	"step_id" uuid NOT NULL,
	"round" integer NOT NULL,
	"method" text NOT NULL,
	"method_note" text DEFAULT '' NOT NULL,
	"depth_mm" double precision NOT NULL,
	"length_mm" double precision NOT NULL,
	"photo_id" uuid NOT NULL,
	"recorded_by" text NOT NULL,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "weld_repair_round" CHECK ("weld_repair"."round" >= 2),
	CONSTRAINT "weld_repair_sizes" CHECK ("weld_repair"."depth_mm" > 0 and "weld_repair"."length_mm" > 0)
);
--> statement-breakpoint
ALTER TABLE "weld_repair" ADD CONSTRAINT "weld_repair_shop_id_shop_id_fk" FOREIGN KEY ("shop_id") REFERENCES "public"."shop"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_repair" ADD CONSTRAINT "weld_repair_job_id_job_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."job"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_repair" ADD CONSTRAINT "weld_repair_step_id_job_step_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."job_step"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_repair" ADD CONSTRAINT "weld_repair_photo_id_photo_id_fk" FOREIGN KEY ("photo_id") REFERENCES "public"."photo"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weld_repair" ADD CONSTRAINT "weld_repair_recorded_by_user_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "weld_repair_round_idx" ON "weld_repair" USING btree ("step_id","round");--> statement-breakpoint
CREATE INDEX "weld_repair_job_idx" ON "weld_repair" USING btree ("job_id");