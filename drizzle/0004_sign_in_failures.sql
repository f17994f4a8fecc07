CREATE TABLE "sign_in_failures" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"account_key" text NOT NULL,
	"address" text NOT NULL,
	"failed_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
CREATE INDEX "sign_in_failures_account_idx" ON "sign_in_failures" USING btree ("account_key","failed_at");--> statement-breakpoint
CREATE INDEX "sign_in_failures_address_idx" ON "sign_in_failures" USING btree ("address","failed_at");--> statement-breakpoint
CREATE INDEX "sign_in_failures_at_idx" ON "sign_in_failures" USING btree ("failed_at");