CREATE TABLE `matched_sets` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`version` bigint unsigned NOT NULL,
	`field_stamps` json NOT NULL,
	`created_by` varchar(36) NOT NULL,
	`updated_by` varchar(36),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`deleted_at` datetime(3),
	`tube_type` varchar(64) NOT NULL,
	`label` varchar(20) NOT NULL,
	`tube_ids` json NOT NULL,
	`size` tinyint NOT NULL,
	`spread_fraction` double NOT NULL,
	`sorter_result_id` varchar(36),
	`status` enum('in-stock','fitted') NOT NULL DEFAULT 'in-stock',
	`fitted_job_id` varchar(36),
	`fitted_at` varchar(40) NOT NULL DEFAULT '',
	`price_cents` int,
	CONSTRAINT `matched_sets_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `stock_tubes` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`version` bigint unsigned NOT NULL,
	`field_stamps` json NOT NULL,
	`created_by` varchar(36) NOT NULL,
	`updated_by` varchar(36),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`deleted_at` datetime(3),
	`lot_id` varchar(36) NOT NULL,
	`label` varchar(20) NOT NULL,
	`plate_volts` double NOT NULL,
	`grid_volts` double NOT NULL,
	`amps` double NOT NULL,
	`transconductance` double,
	`tested_on` varchar(10) NOT NULL,
	`tested_by` varchar(120) NOT NULL DEFAULT '',
	`set_id` varchar(36),
	CONSTRAINT `stock_tubes_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `tube_lots` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`version` bigint unsigned NOT NULL,
	`field_stamps` json NOT NULL,
	`created_by` varchar(36) NOT NULL,
	`updated_by` varchar(36),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`deleted_at` datetime(3),
	`tube_type` varchar(64) NOT NULL,
	`maker` varchar(120) NOT NULL DEFAULT '',
	`received_on` varchar(10) NOT NULL DEFAULT '',
	`cost_cents` int NOT NULL DEFAULT 0,
	`notes` text NOT NULL,
	CONSTRAINT `tube_lots_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE INDEX `matched_sets_shop_version_idx` ON `matched_sets` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `matched_sets_shop_status_idx` ON `matched_sets` (`shop_id`,`status`);--> statement-breakpoint
CREATE INDEX `matched_sets_job_idx` ON `matched_sets` (`fitted_job_id`);--> statement-breakpoint
CREATE INDEX `stock_tubes_shop_version_idx` ON `stock_tubes` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `stock_tubes_lot_idx` ON `stock_tubes` (`lot_id`);--> statement-breakpoint
CREATE INDEX `stock_tubes_set_idx` ON `stock_tubes` (`set_id`);--> statement-breakpoint
CREATE INDEX `tube_lots_shop_version_idx` ON `tube_lots` (`shop_id`,`version`);