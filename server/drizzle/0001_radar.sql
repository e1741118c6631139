CREATE TABLE "cells" (
	"id" serial PRIMARY KEY NOT NULL,
	"site_id" integer NOT NULL,
	"source" text NOT NULL,
	"scan_time" timestamp with time zone NOT NULL,
	"upload_id" integer,
	"settings_version" integer NOT NULL,
	"track_id" integer,
	"external_track_id" text,
	"lat" double precision NOT NULL,
	"lon" double precision NOT NULL,
	"x_km" double precision NOT NULL,
	"y_km" double precision NOT NULL,
	"area_km2" double precision NOT NULL,
	"volume_km3" double precision,
	"max_dbz" double precision,
	"max_dbz_height_km" double precision,
	"top35_km" double precision,
	"echo_top_km" double precision,
	"core_volume_km3" double precision,
	"vil_max_kg_m2" double precision,
	"vil_mass_kg" double precision,
	"rain_rate_max_mm_h" double precision,
	"precip_flux_m3_s" double precision,
	"semi_major_km" double precision,
	"semi_minor_km" double precision,
	"orientation_deg" double precision,
	"cell_type" text,
	"block_id" integer,
	"parent_external_track_id" text
);
--> statement-breakpoint
CREATE TABLE "jobs" (
	"id" serial PRIMARY KEY NOT NULL,
	"kind" text NOT NULL,
	"state" text DEFAULT 'queued' NOT NULL,
	"progress" double precision DEFAULT 0 NOT NULL,
	"stage" text,
	"params" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"result" jsonb,
	"problems" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"files" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"error" text,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "radar_sites" (
	"id" serial PRIMARY KEY NOT NULL,
	"code" text NOT NULL,
	"name" text NOT NULL,
	"lat" double precision NOT NULL,
	"lon" double precision NOT NULL,
	"altitude_m" double precision NOT NULL,
	"range_km" double precision NOT NULL,
	"interval_min" double precision NOT NULL,
	"utc_offset_minutes" integer NOT NULL,
	"blocked_sectors" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "radar_sites_code_unique" UNIQUE("code")
);
--> statement-breakpoint
CREATE TABLE "scans" (
	"id" serial PRIMARY KEY NOT NULL,
	"site_id" integer NOT NULL,
	"source" text NOT NULL,
	"time" timestamp with time zone NOT NULL,
	"upload_id" integer
);
--> statement-breakpoint
CREATE TABLE "site_settings" (
	"id" serial PRIMARY KEY NOT NULL,
	"site_id" integer NOT NULL,
	"version" integer NOT NULL,
	"settings" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"created_by" integer
);
--> statement-breakpoint
CREATE TABLE "tracks" (
	"id" serial PRIMARY KEY NOT NULL,
	"site_id" integer NOT NULL,
	"source" text NOT NULL,
	"settings_version" integer NOT NULL,
	"external_id" text,
	"first_time" timestamp with time zone NOT NULL,
	"last_time" timestamp with time zone NOT NULL,
	"scan_count" integer NOT NULL,
	"duration_min" double precision NOT NULL,
	"speed_ms" double precision,
	"direction_to_deg" double precision,
	"is_storm" boolean NOT NULL,
	"onset" boolean NOT NULL,
	"not_onset_reason" text,
	"parent_track_id" integer,
	"merged_into_track_id" integer,
	"start_lat" double precision NOT NULL,
	"start_lon" double precision NOT NULL,
	"start_block_id" integer,
	"max_volume_km3" double precision,
	"max_area_km2" double precision NOT NULL,
	"max_echo_top_km" double precision,
	"cell_type" text
);
--> statement-breakpoint
CREATE TABLE "uploads" (
	"id" serial PRIMARY KEY NOT NULL,
	"site_id" integer,
	"kind" text NOT NULL,
	"file_name" text NOT NULL,
	"sha256" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"job_id" integer,
	"imported_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "cells" ADD CONSTRAINT "cells_site_id_radar_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."radar_sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cells" ADD CONSTRAINT "cells_upload_id_uploads_id_fk" FOREIGN KEY ("upload_id") REFERENCES "public"."uploads"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cells" ADD CONSTRAINT "cells_track_id_tracks_id_fk" FOREIGN KEY ("track_id") REFERENCES "public"."tracks"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cells" ADD CONSTRAINT "cells_block_id_blocks_id_fk" FOREIGN KEY ("block_id") REFERENCES "public"."blocks"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "jobs" ADD CONSTRAINT "jobs_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scans" ADD CONSTRAINT "scans_site_id_radar_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."radar_sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scans" ADD CONSTRAINT "scans_upload_id_uploads_id_fk" FOREIGN KEY ("upload_id") REFERENCES "public"."uploads"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "site_settings" ADD CONSTRAINT "site_settings_site_id_radar_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."radar_sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "site_settings" ADD CONSTRAINT "site_settings_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tracks" ADD CONSTRAINT "tracks_site_id_radar_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."radar_sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tracks" ADD CONSTRAINT "tracks_start_block_id_blocks_id_fk" FOREIGN KEY ("start_block_id") REFERENCES "public"."blocks"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_site_id_radar_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."radar_sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "cells_site_scan_idx" ON "cells" USING btree ("site_id","scan_time");--> statement-breakpoint
CREATE INDEX "cells_track_idx" ON "cells" USING btree ("track_id");--> statement-breakpoint
CREATE INDEX "cells_upload_idx" ON "cells" USING btree ("upload_id");--> statement-breakpoint
CREATE INDEX "jobs_created_idx" ON "jobs" USING btree ("created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "scans_site_source_time_idx" ON "scans" USING btree ("site_id","source","time");--> statement-breakpoint
CREATE INDEX "scans_site_time_idx" ON "scans" USING btree ("site_id","time");--> statement-breakpoint
CREATE UNIQUE INDEX "site_settings_version_idx" ON "site_settings" USING btree ("site_id","version");--> statement-breakpoint
CREATE INDEX "tracks_site_time_idx" ON "tracks" USING btree ("site_id","first_time");--> statement-breakpoint
CREATE INDEX "tracks_start_block_idx" ON "tracks" USING btree ("start_block_id");--> statement-breakpoint
CREATE UNIQUE INDEX "uploads_content_idx" ON "uploads" USING btree ("site_id","kind","sha256");