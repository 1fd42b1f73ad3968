CREATE TYPE "public"."analysis_status" AS ENUM('queued', 'running', 'done', 'failed');--> statement-breakpoint
CREATE TYPE "public"."capture_kind" AS ENUM('waveform', 'heat_up_log');--> statement-breakpoint
CREATE TYPE "public"."capture_status" AS ENUM('awaiting_upload', 'uploaded', 'abandoned');--> statement-breakpoint
CREATE TYPE "public"."instrument_kind" AS ENUM('current_clamp', 'oscilloscope', 'power_meter', 'thermocouple_meter', 'anemometer', 'resistance_meter', 'multimeter');--> statement-breakpoint
CREATE TYPE "public"."measurement_kind" AS ENUM('power_input_full_demand', 'power_input_at_setpoint', 'standby_power', 'inrush_peak_current', 'current', 'airflow', 'heat_up_time', 'temperature_vs_setpoint', 'temperature_vs_display', 'temperature_stability', 'recovery_under_load', 'tip_to_ground_resistance', 'leakage_voltage');--> statement-breakpoint
CREATE TYPE "public"."measurement_source" AS ENUM('analysis', 'manual');--> statement-breakpoint
CREATE TYPE "public"."report_status" AS ENUM('draft', 'submitted', 'changes_requested', 'published', 'retracted');--> statement-breakpoint
CREATE TABLE "analyses" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"capture_id" uuid NOT NULL,
	"options" jsonb NOT NULL,
	"instrument_snapshots" jsonb NOT NULL,
	"status" "analysis_status" DEFAULT 'queued' NOT NULL,
	"analysis_version" text,
	"result" jsonb,
	"display_series" jsonb,
	"error" jsonb,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone,
	"requested_by_id" uuid
);
--> statement-breakpoint
CREATE TABLE "captures" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"run_id" uuid NOT NULL,
	"kind" "capture_kind" NOT NULL,
	"object_key" text NOT NULL,
	"file_name" text NOT NULL,
	"declared_bytes" integer NOT NULL,
	"status" "capture_status" DEFAULT 'awaiting_upload' NOT NULL,
	"uploaded_at" timestamp with time zone,
	"created_by_id" uuid
);
--> statement-breakpoint
CREATE TABLE "instruments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"lab_id" uuid,
	"kind" "instrument_kind" NOT NULL,
	"maker" text NOT NULL,
	"model" text NOT NULL,
	"serial_number" text NOT NULL,
	"accuracy" jsonb NOT NULL,
	"calibrated_on" date NOT NULL,
	"calibration_due_on" date NOT NULL,
	"created_by_id" uuid
);
--> statement-breakpoint
CREATE TABLE "manual_readings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"run_id" uuid NOT NULL,
	"kind" "measurement_kind" NOT NULL,
	"values" real[] NOT NULL,
	"unit" text NOT NULL,
	"instrument_id" uuid,
	"note" text DEFAULT '' NOT NULL
);
--> statement-breakpoint
CREATE TABLE "measurements" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"run_id" uuid NOT NULL,
	"analysis_id" uuid,
	"manual_reading_id" uuid,
	"kind" "measurement_kind" NOT NULL,
	"source" "measurement_source" NOT NULL,
	"value" real NOT NULL,
	"unit" text NOT NULL,
	"expanded_uncertainty" real,
	"verdict" jsonb
);
--> statement-breakpoint
CREATE TABLE "protocol_versions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"protocol_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"summary" text NOT NULL,
	"conditions" jsonb NOT NULL,
	"required_measurements" "measurement_kind"[] NOT NULL,
	"repeats" integer NOT NULL,
	"tolerances" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"steps_mdx" text NOT NULL,
	"safety_cautions" text NOT NULL,
	"created_by_id" uuid
);
--> statement-breakpoint
CREATE TABLE "protocols" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"slug" text NOT NULL,
	"name" text NOT NULL,
	"created_by_id" uuid
);
--> statement-breakpoint
CREATE TABLE "run_instruments" (
	"run_id" uuid NOT NULL,
	"instrument_id" uuid NOT NULL,
	"snapshot" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "run_instruments_run_id_instrument_id_pk" PRIMARY KEY("run_id","instrument_id")
);
--> statement-breakpoint
CREATE TABLE "test_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"tool_id" uuid NOT NULL,
	"protocol_version_id" uuid NOT NULL,
	"lab_id" uuid NOT NULL,
	"reviewer_id" uuid NOT NULL,
	"tested_on" date NOT NULL,
	"unit" jsonb NOT NULL,
	"conditions" jsonb NOT NULL,
	"notes" text DEFAULT '' NOT NULL
);
--> statement-breakpoint
CREATE TABLE "tool_photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"tool_id" uuid NOT NULL,
	"object_key_prefix" text NOT NULL,
	"widths" integer[] NOT NULL,
	"alt_text" text NOT NULL,
	"uploaded_by_id" uuid
);
--> statement-breakpoint
CREATE TABLE "report_analyses" (
	"report_id" uuid NOT NULL,
	"analysis_id" uuid NOT NULL,
	"label" text NOT NULL,
	CONSTRAINT "report_analyses_report_id_analysis_id_pk" PRIMARY KEY("report_id","analysis_id")
);
--> statement-breakpoint
CREATE TABLE "report_images" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"report_id" uuid NOT NULL,
	"object_key" text NOT NULL,
	"alt_text" text NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE "report_tools" (
	"report_id" uuid NOT NULL,
	"tool_id" uuid NOT NULL,
	"position" integer NOT NULL,
	CONSTRAINT "report_tools_report_id_tool_id_pk" PRIMARY KEY("report_id","tool_id")
);
--> statement-breakpoint
CREATE TABLE "reports" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"slug" text NOT NULL,
	"title" text NOT NULL,
	"author_id" uuid NOT NULL,
	"status" "report_status" DEFAULT 'draft' NOT NULL,
	"body_mdx" text DEFAULT '' NOT NULL,
	"disclosure" text DEFAULT '' NOT NULL,
	"submitted_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "analyses" ADD CONSTRAINT "analyses_capture_id_captures_id_fk" FOREIGN KEY ("capture_id") REFERENCES "public"."captures"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analyses" ADD CONSTRAINT "analyses_requested_by_id_users_id_fk" FOREIGN KEY ("requested_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "captures" ADD CONSTRAINT "captures_run_id_test_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."test_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "captures" ADD CONSTRAINT "captures_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "instruments" ADD CONSTRAINT "instruments_lab_id_labs_id_fk" FOREIGN KEY ("lab_id") REFERENCES "public"."labs"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "instruments" ADD CONSTRAINT "instruments_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "manual_readings" ADD CONSTRAINT "manual_readings_run_id_test_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."test_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "manual_readings" ADD CONSTRAINT "manual_readings_instrument_id_instruments_id_fk" FOREIGN KEY ("instrument_id") REFERENCES "public"."instruments"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurements" ADD CONSTRAINT "measurements_run_id_test_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."test_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurements" ADD CONSTRAINT "measurements_analysis_id_analyses_id_fk" FOREIGN KEY ("analysis_id") REFERENCES "public"."analyses"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurements" ADD CONSTRAINT "measurements_manual_reading_id_manual_readings_id_fk" FOREIGN KEY ("manual_reading_id") REFERENCES "public"."manual_readings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "protocol_versions" ADD CONSTRAINT "protocol_versions_protocol_id_protocols_id_fk" FOREIGN KEY ("protocol_id") REFERENCES "public"."protocols"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "protocol_versions" ADD CONSTRAINT "protocol_versions_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "protocols" ADD CONSTRAINT "protocols_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_instruments" ADD CONSTRAINT "run_instruments_run_id_test_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."test_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_instruments" ADD CONSTRAINT "run_instruments_instrument_id_instruments_id_fk" FOREIGN KEY ("instrument_id") REFERENCES "public"."instruments"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_runs" ADD CONSTRAINT "test_runs_tool_id_tools_id_fk" FOREIGN KEY ("tool_id") REFERENCES "public"."tools"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_runs" ADD CONSTRAINT "test_runs_protocol_version_id_protocol_versions_id_fk" FOREIGN KEY ("protocol_version_id") REFERENCES "public"."protocol_versions"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_runs" ADD CONSTRAINT "test_runs_lab_id_labs_id_fk" FOREIGN KEY ("lab_id") REFERENCES "public"."labs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_runs" ADD CONSTRAINT "test_runs_reviewer_id_users_id_fk" FOREIGN KEY ("reviewer_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tool_photos" ADD CONSTRAINT "tool_photos_tool_id_tools_id_fk" FOREIGN KEY ("tool_id") REFERENCES "public"."tools"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tool_photos" ADD CONSTRAINT "tool_photos_uploaded_by_id_users_id_fk" FOREIGN KEY ("uploaded_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "report_analyses" ADD CONSTRAINT "report_analyses_report_id_reports_id_fk" FOREIGN KEY ("report_id") REFERENCES "public"."reports"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "report_analyses" ADD CONSTRAINT "report_analyses_analysis_id_analyses_id_fk" FOREIGN KEY ("analysis_id") REFERENCES "public"."analyses"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "report_images" ADD CONSTRAINT "report_images_report_id_reports_id_fk" FOREIGN KEY ("report_id") REFERENCES "public"."reports"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "report_tools" ADD CONSTRAINT "report_tools_report_id_reports_id_fk" FOREIGN KEY ("report_id") REFERENCES "public"."reports"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "report_tools" ADD CONSTRAINT "report_tools_tool_id_tools_id_fk" FOREIGN KEY ("tool_id") REFERENCES "public"."tools"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reports" ADD CONSTRAINT "reports_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "analyses_capture_idx" ON "analyses" USING btree ("capture_id");--> statement-breakpoint
CREATE UNIQUE INDEX "captures_object_key_unique" ON "captures" USING btree ("object_key");--> statement-breakpoint
CREATE INDEX "captures_run_idx" ON "captures" USING btree ("run_id");--> statement-breakpoint
CREATE UNIQUE INDEX "instruments_serial_unique" ON "instruments" USING btree ("maker","model","serial_number");--> statement-breakpoint
CREATE INDEX "manual_readings_run_idx" ON "manual_readings" USING btree ("run_id");--> statement-breakpoint
CREATE INDEX "measurements_run_idx" ON "measurements" USING btree ("run_id");--> statement-breakpoint
CREATE INDEX "measurements_analysis_idx" ON "measurements" USING btree ("analysis_id");--> statement-breakpoint
CREATE UNIQUE INDEX "protocol_versions_number_unique" ON "protocol_versions" USING btree ("protocol_id","version");--> statement-breakpoint
CREATE UNIQUE INDEX "protocols_slug_unique" ON "protocols" USING btree ("slug");--> statement-breakpoint
CREATE INDEX "test_runs_tool_idx" ON "test_runs" USING btree ("tool_id");--> statement-breakpoint
CREATE INDEX "test_runs_reviewer_idx" ON "test_runs" USING btree ("reviewer_id");--> statement-breakpoint
CREATE INDEX "tool_photos_tool_idx" ON "tool_photos" USING btree ("tool_id");--> statement-breakpoint
CREATE UNIQUE INDEX "report_analyses_label_unique" ON "report_analyses" USING btree ("report_id","label");--> statement-breakpoint
CREATE UNIQUE INDEX "report_images_object_key_unique" ON "report_images" USING btree ("object_key");--> statement-breakpoint
CREATE UNIQUE INDEX "reports_slug_unique" ON "reports" USING btree ("slug");--> statement-breakpoint
CREATE INDEX "reports_author_idx" ON "reports" USING btree ("author_id");