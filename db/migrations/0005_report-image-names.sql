ALTER TABLE "report_images" ADD COLUMN "name" text NOT NULL;--> statement-breakpoint
CREATE UNIQUE INDEX "report_images_name_unique" ON "report_images" USING btree ("report_id","name");