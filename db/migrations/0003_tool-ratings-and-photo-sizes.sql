ALTER TABLE "tools" ADD COLUMN "motor_share_above_half" boolean;--> statement-breakpoint
ALTER TABLE "tool_photos" ADD COLUMN "heights" integer[] DEFAULT '{}' NOT NULL;