CREATE TABLE `account` (
	`user_id` text NOT NULL,
	`type` text NOT NULL,
	`provider` text NOT NULL,
	`provider_account_id` text NOT NULL,
	`refresh_token` text,
	`access_token` text,
	`expires_at` integer,
	`token_type` text,
	`scope` text,
	`id_token` text,
	`session_state` text,
	PRIMARY KEY(`provider`, `provider_account_id`),
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `app_setting` (
	`key` text PRIMARY KEY NOT NULL,
	`value` text NOT NULL
);
--> statement-breakpoint
CREATE TABLE `facility` (
	`id` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`section_kind` text NOT NULL,
	`section_width_m` real NOT NULL,
	`section_height_m` real NOT NULL,
	`corner_fillet_m` real DEFAULT 0 NOT NULL,
	`section_length_m` real NOT NULL,
	`min_speed_mps` real NOT NULL,
	`max_speed_mps` real NOT NULL,
	`max_dynamic_pressure_pa` real NOT NULL,
	`yaw_min_deg` real NOT NULL,
	`yaw_max_deg` real NOT NULL,
	`blockage_caution` real NOT NULL,
	`blockage_limit` real NOT NULL,
	`settling_s` real NOT NULL,
	`traverse_move_s` real NOT NULL,
	`yaw_change_s` real NOT NULL,
	`model_change_s` real NOT NULL,
	`set_up_s` real NOT NULL,
	`tear_down_s` real NOT NULL,
	`opening_hours` text NOT NULL,
	`time_zone` text NOT NULL,
	`hourly_rate` text NOT NULL,
	`currency` text NOT NULL,
	`site_altitude_m` real NOT NULL,
	`typical_temperature_k` real NOT NULL,
	`typical_relative_humidity` real NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `facility_name_unique` ON `facility` (`name`);--> statement-breakpoint
CREATE TABLE `invitation` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`token_hash` text NOT NULL,
	`created_by` text,
	`expires_at` integer NOT NULL,
	`used_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `invitation_token` ON `invitation` (`token_hash`);--> statement-breakpoint
CREATE TABLE `scale_model` (
	`id` text PRIMARY KEY NOT NULL,
	`team_id` text NOT NULL,
	`name` text NOT NULL,
	`kind` text NOT NULL,
	`scale_denominator` real NOT NULL,
	`full_scale_length_m` real NOT NULL,
	`full_scale_width_m` real NOT NULL,
	`full_scale_height_m` real NOT NULL,
	`full_scale_frontal_area_m2` real NOT NULL,
	`reference_length_m` real NOT NULL,
	`drag_coefficient` real,
	`model_volume_m3` real,
	`created_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `team`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`created_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `scale_model_team_name` ON `scale_model` (`team_id`,`name`);--> statement-breakpoint
CREATE TABLE `sign_in_throttle` (
	`key` text PRIMARY KEY NOT NULL,
	`failures` integer NOT NULL,
	`window_started_at` integer NOT NULL,
	`locked_until` integer
);
--> statement-breakpoint
CREATE TABLE `team` (
	`id` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`kind` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `team_name_unique` ON `team` (`name`);--> statement-breakpoint
CREATE TABLE `team_member` (
	`team_id` text NOT NULL,
	`user_id` text NOT NULL,
	PRIMARY KEY(`team_id`, `user_id`),
	FOREIGN KEY (`team_id`) REFERENCES `team`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `team_member_user` ON `team_member` (`user_id`);--> statement-breakpoint
CREATE TABLE `user` (
	`id` text PRIMARY KEY NOT NULL,
	`name` text,
	`email` text NOT NULL,
	`email_verified` integer,
	`image` text,
	`password_hash` text,
	`active` integer DEFAULT true NOT NULL,
	`session_version` integer DEFAULT 1 NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `user_email_unique` ON `user` (`email`);--> statement-breakpoint
CREATE TABLE `user_role` (
	`user_id` text NOT NULL,
	`role` text NOT NULL,
	PRIMARY KEY(`user_id`, `role`),
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade
);
