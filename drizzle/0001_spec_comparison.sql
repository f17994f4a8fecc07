ALTER TABLE "specs" ADD COLUMN "comparison" jsonb;--> statement-breakpoint
ALTER TABLE "specs" ADD COLUMN "engine_version" text;--> statement-breakpoint
ALTER TABLE "specs" ADD COLUMN "evaluated_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "specs" ADD COLUMN "updated_by_id" text;--> statement-breakpoint
ALTER TABLE "specs" ADD COLUMN "archived_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "specs" ADD CONSTRAINT "specs_updated_by_id_users_id_fk" FOREIGN KEY ("updated_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;