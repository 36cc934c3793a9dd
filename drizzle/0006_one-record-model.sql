ALTER TABLE `measurements` RENAME COLUMN `author_id` TO `created_by`;--> statement-breakpoint
ALTER TABLE `notes` RENAME COLUMN `author_id` TO `created_by`;--> statement-breakpoint
ALTER TABLE `measurements` ADD `field_stamps` json DEFAULT ('{}') NOT NULL;--> statement-breakpoint
ALTER TABLE `measurements` ADD `updated_by` varchar(36);