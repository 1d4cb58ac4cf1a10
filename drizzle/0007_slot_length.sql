ALTER TABLE `facility` ADD `minimum_slot_s` real DEFAULT 3600 NOT NULL;--> statement-breakpoint
ALTER TABLE `facility` ADD `slot_step_s` real DEFAULT 900 NOT NULL;