CREATE TABLE "anomaly_climatologies" (
	"id" serial PRIMARY KEY NOT NULL,
	"upload_id" integer,
	"variable" text NOT NULL,
	"level_hpa" integer NOT NULL,
	"key" text NOT NULL,
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
DROP INDEX "anomaly_fields_key_idx";--> statement-breakpoint
ALTER TABLE "anomaly_fields" ADD COLUMN "product" text DEFAULT 'analysis' NOT NULL;--> statement-breakpoint
ALTER TABLE "anomaly_fields" ADD COLUMN "derivation" text DEFAULT 'anomaly' NOT NULL;--> statement-breakpoint
ALTER TABLE "anomaly_fields" ADD COLUMN "climatology_file" text;--> statement-breakpoint
ALTER TABLE "anomaly_climatologies" ADD CONSTRAINT "anomaly_climatologies_upload_id_uploads_id_fk" FOREIGN KEY ("upload_id") REFERENCES "public"."uploads"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "anomaly_climatologies_key_idx" ON "anomaly_climatologies" USING btree ("variable","level_hpa","key");--> statement-breakpoint
CREATE UNIQUE INDEX "anomaly_fields_key_idx" ON "anomaly_fields" USING btree ("product","variable","level_hpa","date");