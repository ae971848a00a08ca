ALTER TABLE "membership" ADD COLUMN "legal_name" text;--> statement-breakpoint
UPDATE "membership" m SET "legal_name" = u."name" FROM "user" u WHERE u."id" = m."user_id";--> statement-breakpoint
ALTER TABLE "membership" ALTER COLUMN "legal_name" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "shop" ADD COLUMN "archive_email" text;
