ALTER TABLE "caught_mail" ADD COLUMN "shop_id" uuid;--> statement-breakpoint
CREATE INDEX "caught_mail_shop_idx" ON "caught_mail" USING btree ("shop_id","received_at");