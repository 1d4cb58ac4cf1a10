CREATE TABLE `api_token` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`name` text NOT NULL,
	`token_hash` text NOT NULL,
	`scopes` text NOT NULL,
	`expires_at` integer,
	`last_used_at` integer,
	`revoked_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `api_token_hash` ON `api_token` (`token_hash`);--> statement-breakpoint
CREATE INDEX `api_token_user` ON `api_token` (`user_id`);--> statement-breakpoint
CREATE TABLE `reading` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`revision_id` text NOT NULL,
	`upload_id` text NOT NULL,
	`point` integer NOT NULL,
	`run` integer NOT NULL,
	`kind` text NOT NULL,
	`pressure_pa` real NOT NULL,
	`value` real NOT NULL,
	`unit` text NOT NULL,
	`inclination_deg` real,
	`fluid_density_kgm3` real,
	`measured_at` integer,
	`note` text,
	`superseded_by` text,
	FOREIGN KEY (`revision_id`) REFERENCES `campaign_revision`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`upload_id`) REFERENCES `readings_upload`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`superseded_by`) REFERENCES `readings_upload`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE UNIQUE INDEX `reading_current` ON `reading` (`revision_id`,`point`,`kind`) WHERE superseded_by is null;--> statement-breakpoint
CREATE TABLE `readings_upload` (
	`id` text PRIMARY KEY NOT NULL,
	`campaign_id` text NOT NULL,
	`revision_id` text NOT NULL,
	`uploaded_by` text,
	`uploader_name` text NOT NULL,
	`channel` text NOT NULL,
	`file_name` text NOT NULL,
	`media_type` text NOT NULL,
	`size_bytes` integer NOT NULL,
	`sha256` text NOT NULL,
	`storage_key` text NOT NULL,
	`reading_count` integer NOT NULL,
	`run_count` integer NOT NULL,
	`replaced_count` integer DEFAULT 0 NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`campaign_id`) REFERENCES `campaign`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`revision_id`) REFERENCES `campaign_revision`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`uploaded_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `readings_upload_storage_key_unique` ON `readings_upload` (`storage_key`);--> statement-breakpoint
CREATE INDEX `readings_upload_campaign` ON `readings_upload` (`campaign_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `run_condition` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`revision_id` text NOT NULL,
	`upload_id` text NOT NULL,
	`run` integer NOT NULL,
	`reference_dynamic_pressure_pa` real NOT NULL,
	`air_temperature_k` real NOT NULL,
	`barometric_pressure_pa` real NOT NULL,
	`relative_humidity` real,
	`superseded_by` text,
	FOREIGN KEY (`revision_id`) REFERENCES `campaign_revision`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`upload_id`) REFERENCES `readings_upload`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`superseded_by`) REFERENCES `readings_upload`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE UNIQUE INDEX `run_condition_current` ON `run_condition` (`revision_id`,`run`) WHERE superseded_by is null;