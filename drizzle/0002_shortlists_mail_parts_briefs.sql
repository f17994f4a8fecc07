CREATE TABLE "ballots" (
	"id" text PRIMARY KEY NOT NULL,
	"shortlist_id" text NOT NULL,
	"voter_id" text NOT NULL,
	"ranking" jsonb NOT NULL,
	"concerns" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"comment" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "brief_share_views" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"share_id" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"address" text DEFAULT '' NOT NULL,
	"user_agent" text DEFAULT '' NOT NULL
);
--> statement-breakpoint
CREATE TABLE "brief_shares" (
	"id" text PRIMARY KEY NOT NULL,
	"brief_version_id" text NOT NULL,
	"token_hash" text NOT NULL,
	"created_by_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"revoked_at" timestamp with time zone,
	CONSTRAINT "brief_shares_token_hash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
CREATE TABLE "brief_versions" (
	"id" text PRIMARY KEY NOT NULL,
	"brief_id" text NOT NULL,
	"version" integer NOT NULL,
	"content" jsonb NOT NULL,
	"sent_to" text DEFAULT '' NOT NULL,
	"sent_by_id" text,
	"sent_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "briefs" (
	"id" text PRIMARY KEY NOT NULL,
	"spec_id" text NOT NULL,
	"shortlist_id" text,
	"title" text NOT NULL,
	"customer_name" text NOT NULL,
	"customer_contact" text DEFAULT '' NOT NULL,
	"draft" jsonb NOT NULL,
	"created_by_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "candidate_snapshots" (
	"id" text PRIMARY KEY NOT NULL,
	"candidate_id" text NOT NULL,
	"result" jsonb NOT NULL,
	"input" jsonb NOT NULL,
	"engine_version" text NOT NULL,
	"spec_version" integer NOT NULL,
	"parts_library_version" text,
	"created_by_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "candidates" (
	"id" text PRIMARY KEY NOT NULL,
	"shortlist_id" text NOT NULL,
	"scheme" text NOT NULL,
	"overrides" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_by_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"removed_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "outbox" (
	"id" text PRIMARY KEY NOT NULL,
	"kind" text NOT NULL,
	"to_addresses" text NOT NULL,
	"cc_addresses" text DEFAULT '' NOT NULL,
	"subject" text NOT NULL,
	"text_body" text NOT NULL,
	"html_body" text NOT NULL,
	"related_type" text,
	"related_id" text,
	"status" text NOT NULL,
	"error" text,
	"message_id" text,
	"raw" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "parts_library_versions" (
	"version" integer PRIMARY KEY NOT NULL,
	"library" jsonb NOT NULL,
	"summary" text NOT NULL,
	"changes" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"actor_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "shortlist_voters" (
	"shortlist_id" text NOT NULL,
	"user_id" text NOT NULL,
	CONSTRAINT "shortlist_voters_shortlist_id_user_id_pk" PRIMARY KEY("shortlist_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "shortlists" (
	"id" text PRIMARY KEY NOT NULL,
	"spec_id" text NOT NULL,
	"title" text NOT NULL,
	"owner_id" text NOT NULL,
	"status" text DEFAULT 'draft' NOT NULL,
	"deadline" timestamp with time zone,
	"opened_at" timestamp with time zone,
	"closed_at" timestamp with time zone,
	"reminder_sent_at" timestamp with time zone,
	"decided_candidate_id" text,
	"rationale" text,
	"decided_by_id" text,
	"decided_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "shortlists_status_check" CHECK ("shortlists"."status" in ('draft', 'voting', 'closed', 'decided', 'withdrawn'))
);
--> statement-breakpoint
CREATE TABLE "uploads" (
	"id" text PRIMARY KEY NOT NULL,
	"filename" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"mime_type" text NOT NULL,
	"sha256" text NOT NULL,
	"stored_name" text NOT NULL,
	"uploader_id" text NOT NULL,
	"related_type" text,
	"related_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "uploads_stored_name_unique" UNIQUE("stored_name")
);
--> statement-breakpoint
ALTER TABLE "ballots" ADD CONSTRAINT "ballots_shortlist_id_shortlists_id_fk" FOREIGN KEY ("shortlist_id") REFERENCES "public"."shortlists"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "ballots" ADD CONSTRAINT "ballots_voter_id_users_id_fk" FOREIGN KEY ("voter_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "brief_share_views" ADD CONSTRAINT "brief_share_views_share_id_brief_shares_id_fk" FOREIGN KEY ("share_id") REFERENCES "public"."brief_shares"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "brief_shares" ADD CONSTRAINT "brief_shares_brief_version_id_brief_versions_id_fk" FOREIGN KEY ("brief_version_id") REFERENCES "public"."brief_versions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "brief_shares" ADD CONSTRAINT "brief_shares_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "brief_versions" ADD CONSTRAINT "brief_versions_brief_id_briefs_id_fk" FOREIGN KEY ("brief_id") REFERENCES "public"."briefs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "brief_versions" ADD CONSTRAINT "brief_versions_sent_by_id_users_id_fk" FOREIGN KEY ("sent_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "briefs" ADD CONSTRAINT "briefs_spec_id_specs_id_fk" FOREIGN KEY ("spec_id") REFERENCES "public"."specs"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "briefs" ADD CONSTRAINT "briefs_shortlist_id_shortlists_id_fk" FOREIGN KEY ("shortlist_id") REFERENCES "public"."shortlists"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "briefs" ADD CONSTRAINT "briefs_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "candidate_snapshots" ADD CONSTRAINT "candidate_snapshots_candidate_id_candidates_id_fk" FOREIGN KEY ("candidate_id") REFERENCES "public"."candidates"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "candidate_snapshots" ADD CONSTRAINT "candidate_snapshots_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "candidates" ADD CONSTRAINT "candidates_shortlist_id_shortlists_id_fk" FOREIGN KEY ("shortlist_id") REFERENCES "public"."shortlists"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "candidates" ADD CONSTRAINT "candidates_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "parts_library_versions" ADD CONSTRAINT "parts_library_versions_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shortlist_voters" ADD CONSTRAINT "shortlist_voters_shortlist_id_shortlists_id_fk" FOREIGN KEY ("shortlist_id") REFERENCES "public"."shortlists"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shortlist_voters" ADD CONSTRAINT "shortlist_voters_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shortlists" ADD CONSTRAINT "shortlists_spec_id_specs_id_fk" FOREIGN KEY ("spec_id") REFERENCES "public"."specs"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shortlists" ADD CONSTRAINT "shortlists_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shortlists" ADD CONSTRAINT "shortlists_decided_by_id_users_id_fk" FOREIGN KEY ("decided_by_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_uploader_id_users_id_fk" FOREIGN KEY ("uploader_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "ballots_one_per_voter" ON "ballots" USING btree ("shortlist_id","voter_id");--> statement-breakpoint
CREATE INDEX "brief_share_views_share_idx" ON "brief_share_views" USING btree ("share_id");--> statement-breakpoint
CREATE INDEX "brief_shares_version_idx" ON "brief_shares" USING btree ("brief_version_id");--> statement-breakpoint
CREATE UNIQUE INDEX "brief_versions_unique" ON "brief_versions" USING btree ("brief_id","version");--> statement-breakpoint
CREATE INDEX "briefs_spec_idx" ON "briefs" USING btree ("spec_id");--> statement-breakpoint
CREATE INDEX "candidate_snapshots_candidate_idx" ON "candidate_snapshots" USING btree ("candidate_id","created_at");--> statement-breakpoint
CREATE INDEX "candidates_shortlist_idx" ON "candidates" USING btree ("shortlist_id");--> statement-breakpoint
CREATE INDEX "outbox_related_idx" ON "outbox" USING btree ("related_type","related_id");--> statement-breakpoint
CREATE INDEX "outbox_created_idx" ON "outbox" USING btree ("created_at");--> statement-breakpoint
CREATE INDEX "shortlists_spec_idx" ON "shortlists" USING btree ("spec_id");--> statement-breakpoint
CREATE INDEX "uploads_related_idx" ON "uploads" USING btree ("related_type","related_id");