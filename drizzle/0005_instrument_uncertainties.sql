ALTER TABLE `facility` ADD `reading_uncertainty_pa` real DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `facility` ADD `reference_q_uncertainty` real DEFAULT 0.01 NOT NULL;--> statement-breakpoint
ALTER TABLE `facility` ADD `temperature_uncertainty_k` real DEFAULT 0.2 NOT NULL;--> statement-breakpoint
ALTER TABLE `facility` ADD `barometric_uncertainty_pa` real DEFAULT 50 NOT NULL;--> statement-breakpoint
ALTER TABLE `facility` ADD `humidity_uncertainty` real DEFAULT 0.03 NOT NULL;