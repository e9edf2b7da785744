CREATE TABLE "finding_drafts" (
	"case_id" uuid PRIMARY KEY NOT NULL,
	"content" jsonb NOT NULL,
	"updated_by" uuid NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "finding_reviews" (
	"id" uuid PRIMARY KEY NOT NULL,
	"case_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"kind" text NOT NULL,
	"reviewer_id" uuid NOT NULL,
	"at" text NOT NULL,
	"comment" text,
	"jws" text,
	"kid" text,
	"meta" jsonb DEFAULT '{}'::jsonb NOT NULL
);
--> statement-breakpoint
CREATE TABLE "finding_versions" (
	"id" uuid PRIMARY KEY NOT NULL,
	"case_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"canonical" text NOT NULL,
	"sha256" text NOT NULL,
	"author_id" uuid NOT NULL,
	"submitted_at" text NOT NULL,
	CONSTRAINT "finding_versions_case_version_unique" UNIQUE("case_id","version")
);
--> statement-breakpoint
CREATE TABLE "case_fixes" (
	"id" uuid PRIMARY KEY NOT NULL,
	"case_id" uuid NOT NULL,
	"url" text,
	"commit_id" text,
	"description" text NOT NULL,
	"changed_settings" text,
	"software_version" text,
	"verification_replay_id" uuid,
	"linked_by" uuid NOT NULL,
	"linked_at" timestamp with time zone DEFAULT now() NOT NULL,
	"verified_by" uuid,
	"verified_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "audit_entries" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"chain" text NOT NULL,
	"chain_seq" integer NOT NULL,
	"actor_id" uuid,
	"actor_email" text,
	"actor_role" text,
	"action" text NOT NULL,
	"target_type" text NOT NULL,
	"target_id" text,
	"case_id" uuid,
	"at" text NOT NULL,
	"payload_sha256" text NOT NULL,
	"details" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"prev_hash" text NOT NULL,
	"entry_hash" text NOT NULL,
	CONSTRAINT "audit_entries_chain_seq_unique" UNIQUE("chain","chain_seq")
);
--> statement-breakpoint
CREATE TABLE "mail_queue" (
	"id" uuid PRIMARY KEY NOT NULL,
	"to" jsonb NOT NULL,
	"subject" text NOT NULL,
	"text" text NOT NULL,
	"html" text NOT NULL,
	"status" text DEFAULT 'pending' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"next_attempt_at" timestamp with time zone DEFAULT now() NOT NULL,
	"attempt_log" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "outbox_messages" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"from" text NOT NULL,
	"to" jsonb NOT NULL,
	"subject" text NOT NULL,
	"text" text NOT NULL,
	"html" text NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "case_holds" (
	"id" uuid PRIMARY KEY NOT NULL,
	"case_id" uuid NOT NULL,
	"reason" text NOT NULL,
	"placed_by" uuid NOT NULL,
	"placed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"released_by" uuid,
	"released_at" timestamp with time zone,
	"release_reason" text
);
--> statement-breakpoint
ALTER TABLE "finding_drafts" ADD CONSTRAINT "finding_drafts_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_drafts" ADD CONSTRAINT "finding_drafts_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_reviews" ADD CONSTRAINT "finding_reviews_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_reviews" ADD CONSTRAINT "finding_reviews_reviewer_id_users_id_fk" FOREIGN KEY ("reviewer_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_versions" ADD CONSTRAINT "finding_versions_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_versions" ADD CONSTRAINT "finding_versions_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_fixes" ADD CONSTRAINT "case_fixes_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_fixes" ADD CONSTRAINT "case_fixes_linked_by_users_id_fk" FOREIGN KEY ("linked_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_fixes" ADD CONSTRAINT "case_fixes_verified_by_users_id_fk" FOREIGN KEY ("verified_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_holds" ADD CONSTRAINT "case_holds_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_holds" ADD CONSTRAINT "case_holds_placed_by_users_id_fk" FOREIGN KEY ("placed_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_holds" ADD CONSTRAINT "case_holds_released_by_users_id_fk" FOREIGN KEY ("released_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "finding_reviews_case_idx" ON "finding_reviews" USING btree ("case_id","version");--> statement-breakpoint
CREATE INDEX "case_fixes_case_idx" ON "case_fixes" USING btree ("case_id");--> statement-breakpoint
CREATE INDEX "audit_entries_case_idx" ON "audit_entries" USING btree ("case_id");--> statement-breakpoint
CREATE INDEX "mail_queue_due_idx" ON "mail_queue" USING btree ("status","next_attempt_at");--> statement-breakpoint
CREATE INDEX "case_holds_case_idx" ON "case_holds" USING btree ("case_id");