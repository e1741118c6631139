CREATE TABLE "scan_hours" (
	"site_id" integer NOT NULL,
	"source" text NOT NULL,
	"local_day" integer NOT NULL,
	"scans" integer[] NOT NULL,
	CONSTRAINT "scan_hours_site_id_source_local_day_pk" PRIMARY KEY("site_id","source","local_day")
);
--> statement-breakpoint
ALTER TABLE "scan_hours" ADD CONSTRAINT "scan_hours_site_id_radar_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."radar_sites"("id") ON DELETE cascade ON UPDATE no action;