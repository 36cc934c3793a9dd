CREATE TABLE `amps` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`version` bigint unsigned NOT NULL,
	`field_stamps` json NOT NULL,
	`created_by` varchar(36) NOT NULL,
	`updated_by` varchar(36),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`deleted_at` datetime(3),
	`customer_id` varchar(36) NOT NULL,
	`description` varchar(200) NOT NULL,
	`serial` varchar(80) NOT NULL DEFAULT '',
	`tube_complement` varchar(120) NOT NULL DEFAULT '',
	`power_tube_count` int NOT NULL DEFAULT 2,
	`bias_mode` enum('fixed','cathode') NOT NULL DEFAULT 'fixed',
	`rectifier` varchar(60) NOT NULL DEFAULT '',
	`notes` text NOT NULL,
	CONSTRAINT `amps_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `customers` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`version` bigint unsigned NOT NULL,
	`field_stamps` json NOT NULL,
	`created_by` varchar(36) NOT NULL,
	`updated_by` varchar(36),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`deleted_at` datetime(3),
	`name` varchar(120) NOT NULL,
	`email` varchar(254) NOT NULL DEFAULT '',
	`phone` varchar(40) NOT NULL DEFAULT '',
	`notes` text NOT NULL,
	`player_user_id` varchar(36),
	CONSTRAINT `customers_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `invoice_counters` (
	`shop_id` varchar(36) NOT NULL,
	`kind` enum('estimate','invoice') NOT NULL,
	`last` int NOT NULL DEFAULT 0,
	CONSTRAINT `invoice_counters_shop_id_kind_pk` PRIMARY KEY(`shop_id`,`kind`)
);
--> statement-breakpoint
CREATE TABLE `invoices` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`job_id` varchar(36) NOT NULL,
	`number` int NOT NULL,
	`kind` enum('estimate','invoice') NOT NULL DEFAULT 'invoice',
	`state` enum('draft','sent','paid','void') NOT NULL DEFAULT 'draft',
	`lines` json NOT NULL,
	`parts_cents` int NOT NULL,
	`labour_cents` int NOT NULL,
	`subtotal_cents` int NOT NULL,
	`tax_rate_bp` int NOT NULL,
	`tax_cents` int NOT NULL,
	`total_cents` int NOT NULL,
	`currency` varchar(3) NOT NULL DEFAULT 'usd',
	`issued_at` datetime(3),
	`paid_at` datetime(3),
	`version` bigint unsigned NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `invoices_id` PRIMARY KEY(`id`),
	CONSTRAINT `invoices_shop_number_uq` UNIQUE(`shop_id`,`kind`,`number`)
);
--> statement-breakpoint
CREATE TABLE `job_events` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`job_id` varchar(36) NOT NULL,
	`from_status` enum('checked-in','on-bench','waiting-parts','soak','ready','handed-back','closed','cancelled'),
	`to_status` enum('checked-in','on-bench','waiting-parts','soak','ready','handed-back','closed','cancelled') NOT NULL,
	`by_user` varchar(36) NOT NULL,
	`at` datetime(3) NOT NULL,
	`version` bigint unsigned NOT NULL,
	CONSTRAINT `job_events_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `job_labour` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`version` bigint unsigned NOT NULL,
	`field_stamps` json NOT NULL,
	`created_by` varchar(36) NOT NULL,
	`updated_by` varchar(36),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`deleted_at` datetime(3),
	`job_id` varchar(36) NOT NULL,
	`description` varchar(200) NOT NULL DEFAULT '',
	`minutes` int NOT NULL,
	`rate_cents` int NOT NULL,
	`tech_id` varchar(36),
	CONSTRAINT `job_labour_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `job_parts` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`version` bigint unsigned NOT NULL,
	`field_stamps` json NOT NULL,
	`created_by` varchar(36) NOT NULL,
	`updated_by` varchar(36),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`deleted_at` datetime(3),
	`job_id` varchar(36) NOT NULL,
	`description` varchar(200) NOT NULL,
	`quantity` double NOT NULL,
	`unit_cost_cents` int NOT NULL DEFAULT 0,
	`unit_price_cents` int NOT NULL,
	CONSTRAINT `job_parts_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `jobs` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`version` bigint unsigned NOT NULL,
	`field_stamps` json NOT NULL,
	`created_by` varchar(36) NOT NULL,
	`updated_by` varchar(36),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`deleted_at` datetime(3),
	`customer_id` varchar(36) NOT NULL,
	`amp_id` varchar(36) NOT NULL,
	`complaint` text NOT NULL,
	`accessories` varchar(500) NOT NULL DEFAULT '',
	`photos` json NOT NULL,
	`promised_for` varchar(10) NOT NULL DEFAULT '',
	`assigned_to` varchar(36),
	`priority` enum('low','normal','rush') NOT NULL DEFAULT 'normal',
	`status` enum('checked-in','on-bench','waiting-parts','soak','ready','handed-back','closed','cancelled') NOT NULL DEFAULT 'checked-in',
	CONSTRAINT `jobs_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `payments` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`invoice_id` varchar(36) NOT NULL,
	`provider_intent_id` varchar(255) NOT NULL,
	`amount_cents` int NOT NULL,
	`status` enum('pending','succeeded','failed') NOT NULL DEFAULT 'pending',
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `payments_id` PRIMARY KEY(`id`),
	CONSTRAINT `payments_intent_uq` UNIQUE(`provider_intent_id`)
);
--> statement-breakpoint
CREATE TABLE `sent_mail` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36),
	`to_address` varchar(254) NOT NULL,
	`subject` varchar(300) NOT NULL,
	`body` text NOT NULL,
	`delivered` boolean NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `sent_mail_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `shop_settings` (
	`shop_id` varchar(36) NOT NULL,
	`labour_rate_cents` int NOT NULL DEFAULT 9000,
	`tax_rate_bp` int NOT NULL DEFAULT 0,
	`currency` varchar(3) NOT NULL DEFAULT 'usd',
	`ready_email` boolean NOT NULL DEFAULT true,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `shop_settings_shop_id` PRIMARY KEY(`shop_id`)
);
--> statement-breakpoint
CREATE TABLE `webhook_events` (
	`id` varchar(255) NOT NULL,
	`type` varchar(100) NOT NULL,
	`received_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `webhook_events_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `notes` ADD `visibility` enum('internal','customer') DEFAULT 'internal' NOT NULL;--> statement-breakpoint
CREATE INDEX `amps_shop_version_idx` ON `amps` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `amps_customer_idx` ON `amps` (`customer_id`);--> statement-breakpoint
CREATE INDEX `customers_shop_version_idx` ON `customers` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `customers_player_idx` ON `customers` (`player_user_id`);--> statement-breakpoint
CREATE INDEX `invoices_shop_version_idx` ON `invoices` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `invoices_job_idx` ON `invoices` (`job_id`);--> statement-breakpoint
CREATE INDEX `job_events_shop_version_idx` ON `job_events` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `job_events_job_idx` ON `job_events` (`job_id`);--> statement-breakpoint
CREATE INDEX `job_labour_shop_version_idx` ON `job_labour` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `job_labour_job_idx` ON `job_labour` (`job_id`);--> statement-breakpoint
CREATE INDEX `job_parts_shop_version_idx` ON `job_parts` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `job_parts_job_idx` ON `job_parts` (`job_id`);--> statement-breakpoint
CREATE INDEX `jobs_shop_version_idx` ON `jobs` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `jobs_customer_idx` ON `jobs` (`customer_id`);--> statement-breakpoint
CREATE INDEX `jobs_shop_status_idx` ON `jobs` (`shop_id`,`status`);--> statement-breakpoint
CREATE INDEX `sent_mail_shop_idx` ON `sent_mail` (`shop_id`,`created_at`);