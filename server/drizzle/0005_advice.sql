CREATE TABLE "advice_rules" (
	"id" serial PRIMARY KEY NOT NULL,
	"crop" text,
	"stage" text,
	"condition" jsonb NOT NULL,
	"priority" integer NOT NULL,
	"text" text NOT NULL,
	"source" text NOT NULL,
	"active" boolean DEFAULT true NOT NULL,
	"origin" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" integer
);
--> statement-breakpoint
CREATE TABLE "crop_calendar_entries" (
	"id" serial PRIMARY KEY NOT NULL,
	"district_id" integer NOT NULL,
	"crop" text NOT NULL,
	"stage" text NOT NULL,
	"from_week" integer NOT NULL,
	"to_week" integer NOT NULL,
	"position" integer NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "advice_rules" ADD CONSTRAINT "advice_rules_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "crop_calendar_entries" ADD CONSTRAINT "crop_calendar_entries_district_id_districts_id_fk" FOREIGN KEY ("district_id") REFERENCES "public"."districts"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "crop_calendar_district_idx" ON "crop_calendar_entries" USING btree ("district_id");