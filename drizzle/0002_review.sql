CREATE TABLE `audit_event` (
	`id` text PRIMARY KEY NOT NULL,
	`campaign_id` text NOT NULL,
	`actor_id` text,
	`actor_name` text NOT NULL,
	`action` text NOT NULL,
	`from_state` text NOT NULL,
	`to_state` text NOT NULL,
	`revision_number` integer,
	`notes` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`actor_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `audit_event_campaign` ON `audit_event` (`campaign_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `campaign_revision` (
	`id` text PRIMARY KEY NOT NULL,
	`campaign_id` text NOT NULL,
	`number` integer NOT NULL,
	`snapshot` text NOT NULL,
	`submitted_by` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`campaign_id`) REFERENCES `campaign`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`submitted_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE UNIQUE INDEX `campaign_revision_number` ON `campaign_revision` (`campaign_id`,`number`);--> statement-breakpoint
CREATE TABLE `caught_mail` (
	`id` text PRIMARY KEY NOT NULL,
	`from` text NOT NULL,
	`to` text NOT NULL,
	`subject` text NOT NULL,
	`text` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `mail_outbox` (
	`id` text PRIMARY KEY NOT NULL,
	`kind` text NOT NULL,
	`to` text NOT NULL,
	`subject` text NOT NULL,
	`text` text NOT NULL,
	`state` text DEFAULT 'pending' NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`next_attempt_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`last_error` text,
	`sent_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE INDEX `mail_outbox_due` ON `mail_outbox` (`state`,`next_attempt_at`);--> statement-breakpoint
CREATE TABLE `review_decision` (
	`id` text PRIMARY KEY NOT NULL,
	`revision_id` text NOT NULL,
	`reviewer_id` text NOT NULL,
	`verdict` text NOT NULL,
	`summary` text NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`revision_id`) REFERENCES `campaign_revision`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`reviewer_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE UNIQUE INDEX `review_decision_revision_id_unique` ON `review_decision` (`revision_id`);--> statement-breakpoint
CREATE TABLE `review_note` (
	`id` text PRIMARY KEY NOT NULL,
	`decision_id` text NOT NULL,
	`anchor` text NOT NULL,
	`text` text NOT NULL,
	FOREIGN KEY (`decision_id`) REFERENCES `review_decision`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `review_note_decision` ON `review_note` (`decision_id`);--> statement-breakpoint
ALTER TABLE `campaign` ADD `approved_revision_id` text;--> statement-breakpoint
ALTER TABLE `campaign` ADD `last_revision` integer DEFAULT 0 NOT NULL;