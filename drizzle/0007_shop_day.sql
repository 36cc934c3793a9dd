CREATE TABLE `pay_links` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`invoice_id` varchar(36) NOT NULL,
	`token_hash` varchar(64) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`revoked_at` datetime(3),
	`revoked_by` varchar(36),
	`created_by` varchar(36),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `pay_links_id` PRIMARY KEY(`id`),
	CONSTRAINT `pay_links_token_uq` UNIQUE(`token_hash`)
);
--> statement-breakpoint
ALTER TABLE `payments` MODIFY COLUMN `provider_intent_id` varchar(255);--> statement-breakpoint
ALTER TABLE `invoices` ADD `paid_with` enum('online','cash','card');--> statement-breakpoint
ALTER TABLE `payments` ADD `method` enum('online','cash','card') DEFAULT 'online' NOT NULL;--> statement-breakpoint
ALTER TABLE `payments` ADD `recorded_by` varchar(36);--> statement-breakpoint
ALTER TABLE `shop_settings` ADD `invoice_email` boolean DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE `shop_settings` ADD `payment_email` boolean DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE `shop_settings` ADD `address` varchar(300) DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `shop_settings` ADD `phone` varchar(40) DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `shop_settings` ADD `email` varchar(254) DEFAULT '' NOT NULL;--> statement-breakpoint
CREATE INDEX `pay_links_invoice_idx` ON `pay_links` (`invoice_id`);--> statement-breakpoint
CREATE INDEX `payments_invoice_idx` ON `payments` (`invoice_id`);