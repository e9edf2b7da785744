ALTER TABLE "case_fixes" ADD COLUMN "verification_comment" text;--> statement-breakpoint
ALTER TABLE "case_fixes" ADD COLUMN "verified_without_improvement" boolean DEFAULT false NOT NULL;