CREATE TABLE `booking` (
	`id` text PRIMARY KEY NOT NULL,
	`facility_id` text NOT NULL,
	`campaign_id` text NOT NULL,
	`revision_id` text NOT NULL,
	`state` text DEFAULT 'pencilled' NOT NULL,
	`start_ms` integer NOT NULL,
	`end_ms` integer NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`facility_id`) REFERENCES `facility`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`campaign_id`) REFERENCES `campaign`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`revision_id`) REFERENCES `campaign_revision`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `booking_active_start` ON `booking` (`facility_id`,`start_ms`) WHERE state in ('pencilled', 'confirmed');--> statement-breakpoint
CREATE INDEX `booking_campaign` ON `booking` (`campaign_id`);--> statement-breakpoint
CREATE TABLE `calendar_feed` (
	`user_id` text PRIMARY KEY NOT NULL,
	`token_hash` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `calendar_feed_token_hash_unique` ON `calendar_feed` (`token_hash`);--> statement-breakpoint
CREATE TABLE `closure` (
	`id` text PRIMARY KEY NOT NULL,
	`facility_id` text NOT NULL,
	`kind` text NOT NULL,
	`reason` text NOT NULL,
	`start_ms` integer NOT NULL,
	`end_ms` integer NOT NULL,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`facility_id`) REFERENCES `facility`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `closure_facility_start` ON `closure` (`facility_id`,`start_ms`);