CREATE TABLE "anomaly_fields" (
	"id" serial PRIMARY KEY NOT NULL,
	"upload_id" integer,
	"variable" text NOT NULL,
	"level_hpa" integer NOT NULL,
	"date" text NOT NULL,
	"nx" integer NOT NULL,
	"ny" integer NOT NULL,
	"lon0" double precision NOT NULL,
	"lat0" double precision NOT NULL,
	"d_lon" double precision NOT NULL,
	"d_lat" double precision NOT NULL,
	"values" "bytea" NOT NULL,
	"source_file" text NOT NULL
);
--> statement-breakpoint
CREATE TABLE "regime_settings" (
	"id" serial PRIMARY KEY NOT NULL,
	"site_id" integer NOT NULL,
	"version" integer NOT NULL,
	"settings" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"created_by" integer
);
--> statement-breakpoint
ALTER TABLE "anomaly_fields" ADD CONSTRAINT "anomaly_fields_upload_id_uploads_id_fk" FOREIGN KEY ("upload_id") REFERENCES "public"."uploads"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "regime_settings" ADD CONSTRAINT "regime_settings_site_id_radar_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."radar_sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "regime_settings" ADD CONSTRAINT "regime_settings_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "anomaly_fields_key_idx" ON "anomaly_fields" USING btree ("variable","level_hpa","date");--> statement-breakpoint
CREATE UNIQUE INDEX "regime_settings_version_idx" ON "regime_settings" USING btree ("site_id","version");