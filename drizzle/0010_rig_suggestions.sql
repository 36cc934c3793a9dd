CREATE TABLE `rig_suggestions` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`version` bigint unsigned NOT NULL,
	`field_stamps` json NOT NULL,
	`created_by` varchar(36) NOT NULL,
	`updated_by` varchar(36),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`deleted_at` datetime(3),
	`rig_id` varchar(36) NOT NULL,
	`retube_hours` double,
	`retube_months` double,
	`note` varchar(200) NOT NULL DEFAULT '',
	`suggested_by` varchar(120) NOT NULL DEFAULT '',
	CONSTRAINT `rig_suggestions_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE INDEX `rig_suggestions_shop_version_idx` ON `rig_suggestions` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `rig_suggestions_rig_idx` ON `rig_suggestions` (`rig_id`);