ALTER TABLE `booking` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `booking` ADD `updated_by` text REFERENCES user(id) ON DELETE SET NULL;