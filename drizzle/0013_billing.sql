CREATE TABLE `fake_checkout_session` (
	`id` text PRIMARY KEY NOT NULL,
	`amount_minor` integer NOT NULL,
	`currency` text NOT NULL,
	`description` text NOT NULL,
	`metadata` text NOT NULL,
	`client_reference_id` text,
	`success_url` text NOT NULL,
	`cancel_url` text NOT NULL,
	`status` text DEFAULT 'open' NOT NULL,
	`payment_status` text DEFAULT 'unpaid' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `invoice` (
	`id` text PRIMARY KEY NOT NULL,
	`facility_id` text NOT NULL,
	`number` integer NOT NULL,
	`kind` text NOT NULL,
	`campaign_id` text NOT NULL,
	`team_id` text NOT NULL,
	`quote_id` text,
	`credits_invoice_id` text,
	`rates` text NOT NULL,
	`occupied_s` real NOT NULL,
	`lines` text NOT NULL,
	`subtotal` text NOT NULL,
	`tax` text NOT NULL,
	`total` text NOT NULL,
	`reason` text DEFAULT '' NOT NULL,
	`issued_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`credited_by` text,
	`checkout_session_id` text,
	`paid_at` integer,
	`payment_event_id` text,
	FOREIGN KEY (`facility_id`) REFERENCES `facility`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`campaign_id`) REFERENCES `campaign`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`team_id`) REFERENCES `team`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`quote_id`) REFERENCES `quote`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`issued_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `invoice_facility_number` ON `invoice` (`facility_id`,`number`);--> statement-breakpoint
CREATE INDEX `invoice_team` ON `invoice` (`team_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `invoice_campaign` ON `invoice` (`campaign_id`);--> statement-breakpoint
CREATE TABLE `invoice_slot` (
	`invoice_id` text NOT NULL,
	`booking_id` text NOT NULL,
	`start_ms` integer NOT NULL,
	`end_ms` integer NOT NULL,
	PRIMARY KEY(`invoice_id`, `booking_id`),
	FOREIGN KEY (`invoice_id`) REFERENCES `invoice`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`booking_id`) REFERENCES `booking`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `invoice_slot_booking` ON `invoice_slot` (`booking_id`);--> statement-breakpoint
CREATE TABLE `payment_event` (
	`event_id` text PRIMARY KEY NOT NULL,
	`type` text NOT NULL,
	`invoice_id` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `quote` (
	`id` text PRIMARY KEY NOT NULL,
	`campaign_id` text NOT NULL,
	`revision_id` text NOT NULL,
	`revision_number` integer NOT NULL,
	`facility_id` text NOT NULL,
	`team_id` text NOT NULL,
	`facility_version` integer NOT NULL,
	`rates` text NOT NULL,
	`state` text DEFAULT 'issued' NOT NULL,
	`occupied_s` real NOT NULL,
	`lines` text NOT NULL,
	`subtotal` text NOT NULL,
	`tax` text NOT NULL,
	`total` text NOT NULL,
	`valid_until` integer NOT NULL,
	`issued_by` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`decided_by` text,
	`decided_at` integer,
	`decision_note` text DEFAULT '' NOT NULL,
	FOREIGN KEY (`campaign_id`) REFERENCES `campaign`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`revision_id`) REFERENCES `campaign_revision`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`facility_id`) REFERENCES `facility`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`team_id`) REFERENCES `team`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`issued_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`decided_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `quote_campaign` ON `quote` (`campaign_id`,`created_at`);--> statement-breakpoint
ALTER TABLE `facility` ADD `set_up_fee` text DEFAULT '0.00' NOT NULL;--> statement-breakpoint
ALTER TABLE `facility` ADD `tear_down_fee` text DEFAULT '0.00' NOT NULL;--> statement-breakpoint
ALTER TABLE `facility` ADD `minimum_charge` text DEFAULT '0.00' NOT NULL;--> statement-breakpoint
ALTER TABLE `facility` ADD `tax_rate_percent` text DEFAULT '0' NOT NULL;--> statement-breakpoint
ALTER TABLE `facility` ADD `quote_validity_days` integer DEFAULT 30 NOT NULL;--> statement-breakpoint
ALTER TABLE `facility` ADD `quote_required_for_booking` integer DEFAULT false NOT NULL;