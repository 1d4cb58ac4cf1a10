CREATE TABLE `campaign` (
	`id` text PRIMARY KEY NOT NULL,
	`team_id` text NOT NULL,
	`owner_id` text NOT NULL,
	`model_id` text NOT NULL,
	`facility_id` text NOT NULL,
	`state` text DEFAULT 'draft' NOT NULL,
	`name` text NOT NULL,
	`objective` text NOT NULL,
	`definition` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `team`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`owner_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`model_id`) REFERENCES `scale_model`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`facility_id`) REFERENCES `facility`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `campaign_team` ON `campaign` (`team_id`);--> statement-breakpoint
CREATE INDEX `campaign_facility` ON `campaign` (`facility_id`);--> statement-breakpoint
CREATE TABLE `model_attachment` (
	`id` text PRIMARY KEY NOT NULL,
	`model_id` text NOT NULL,
	`file_name` text NOT NULL,
	`media_type` text NOT NULL,
	`size_bytes` integer NOT NULL,
	`storage_key` text NOT NULL,
	`uploaded_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`model_id`) REFERENCES `scale_model`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`uploaded_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `model_attachment_storage_key_unique` ON `model_attachment` (`storage_key`);--> statement-breakpoint
CREATE INDEX `model_attachment_model` ON `model_attachment` (`model_id`);