CREATE TABLE `edit_history` (
	`id` text PRIMARY KEY NOT NULL,
	`kind` text NOT NULL,
	`record_id` text NOT NULL,
	`version` integer NOT NULL,
	`values` text NOT NULL,
	`made_by` text,
	`made_at` integer NOT NULL,
	FOREIGN KEY (`made_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `edit_history_record_version` ON `edit_history` (`kind`,`record_id`,`version`);--> statement-breakpoint
ALTER TABLE `campaign` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `campaign` ADD `updated_by` text REFERENCES user(id) ON DELETE SET NULL;--> statement-breakpoint
ALTER TABLE `facility` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `facility` ADD `updated_by` text REFERENCES user(id) ON DELETE SET NULL;--> statement-breakpoint
-- SQLite adds a column only with a constant default; existing rows take their creation time.
ALTER TABLE `facility` ADD `updated_at` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
UPDATE `facility` SET `updated_at` = `created_at`;--> statement-breakpoint
ALTER TABLE `scale_model` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `scale_model` ADD `updated_by` text REFERENCES user(id) ON DELETE SET NULL;--> statement-breakpoint
-- SQLite adds a column only with a constant default; existing rows take their creation time.
ALTER TABLE `scale_model` ADD `updated_at` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
UPDATE `scale_model` SET `updated_at` = `created_at`;