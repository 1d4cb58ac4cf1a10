DROP TABLE `account`;--> statement-breakpoint
ALTER TABLE `user` DROP COLUMN `email_verified`;--> statement-breakpoint
ALTER TABLE `user` DROP COLUMN `image`;