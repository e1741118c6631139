CREATE TABLE "bulletin_events" (
	"id" serial PRIMARY KEY NOT NULL,
	"bulletin_id" integer NOT NULL,
	"transition" text NOT NULL,
	"from_state" text,
	"to_state" text NOT NULL,
	"actor_id" integer NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"comment" text
);
--> statement-breakpoint
CREATE TABLE "bulletin_reads" (
	"id" serial PRIMARY KEY NOT NULL,
	"bulletin_id" integer NOT NULL,
	"officer_id" integer NOT NULL,
	"read_at" timestamp with time zone DEFAULT now() NOT NULL,
	"acknowledged_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "bulletin_versions" (
	"id" serial PRIMARY KEY NOT NULL,
	"bulletin_id" integer NOT NULL,
	"version" integer NOT NULL,
	"content" jsonb NOT NULL,
	"saved_by" integer NOT NULL,
	"saved_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "bulletins" (
	"id" serial PRIMARY KEY NOT NULL,
	"district_id" integer NOT NULL,
	"week_start" text NOT NULL,
	"number" text NOT NULL,
	"state" text NOT NULL,
	"author_id" integer NOT NULL,
	"current_version" integer NOT NULL,
	"approved_version" integer,
	"utc_offset_minutes" integer NOT NULL,
	"drafted_from" jsonb NOT NULL,
	"approved_from" jsonb,
	"withdrawal_reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"approved_at" timestamp with time zone,
	"sent_at" timestamp with time zone,
	"withdrawn_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "field_reports" (
	"id" serial PRIMARY KEY NOT NULL,
	"bulletin_id" integer NOT NULL,
	"block_id" integer NOT NULL,
	"officer_id" integer NOT NULL,
	"storm_seen" boolean NOT NULL,
	"start_local" text,
	"start_time" timestamp with time zone,
	"hail" boolean NOT NULL,
	"wind_damage" boolean NOT NULL,
	"crop_damage" boolean NOT NULL,
	"action_taken" text NOT NULL,
	"usefulness" integer NOT NULL,
	"notes" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "bulletin_events" ADD CONSTRAINT "bulletin_events_bulletin_id_bulletins_id_fk" FOREIGN KEY ("bulletin_id") REFERENCES "public"."bulletins"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bulletin_events" ADD CONSTRAINT "bulletin_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bulletin_reads" ADD CONSTRAINT "bulletin_reads_bulletin_id_bulletins_id_fk" FOREIGN KEY ("bulletin_id") REFERENCES "public"."bulletins"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bulletin_reads" ADD CONSTRAINT "bulletin_reads_officer_id_users_id_fk" FOREIGN KEY ("officer_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bulletin_versions" ADD CONSTRAINT "bulletin_versions_bulletin_id_bulletins_id_fk" FOREIGN KEY ("bulletin_id") REFERENCES "public"."bulletins"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bulletin_versions" ADD CONSTRAINT "bulletin_versions_saved_by_users_id_fk" FOREIGN KEY ("saved_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bulletins" ADD CONSTRAINT "bulletins_district_id_districts_id_fk" FOREIGN KEY ("district_id") REFERENCES "public"."districts"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bulletins" ADD CONSTRAINT "bulletins_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_reports" ADD CONSTRAINT "field_reports_bulletin_id_bulletins_id_fk" FOREIGN KEY ("bulletin_id") REFERENCES "public"."bulletins"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_reports" ADD CONSTRAINT "field_reports_block_id_blocks_id_fk" FOREIGN KEY ("block_id") REFERENCES "public"."blocks"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_reports" ADD CONSTRAINT "field_reports_officer_id_users_id_fk" FOREIGN KEY ("officer_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "bulletin_events_bulletin_idx" ON "bulletin_events" USING btree ("bulletin_id");--> statement-breakpoint
CREATE UNIQUE INDEX "bulletin_reads_idx" ON "bulletin_reads" USING btree ("bulletin_id","officer_id");--> statement-breakpoint
CREATE UNIQUE INDEX "bulletin_versions_idx" ON "bulletin_versions" USING btree ("bulletin_id","version");--> statement-breakpoint
CREATE UNIQUE INDEX "bulletins_live_week_idx" ON "bulletins" USING btree ("district_id","week_start") WHERE "bulletins"."state" <> 'withdrawn';--> statement-breakpoint
CREATE INDEX "bulletins_district_idx" ON "bulletins" USING btree ("district_id","week_start");--> statement-breakpoint
CREATE INDEX "field_reports_bulletin_idx" ON "field_reports" USING btree ("bulletin_id","block_id");