CREATE TABLE `rig_gigs` (
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
	`played_on` varchar(10) NOT NULL,
	`hours` double NOT NULL,
	`note` varchar(200) NOT NULL DEFAULT '',
	CONSTRAINT `rig_gigs_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `rig_reminders` (
	`set_id` varchar(36) NOT NULL,
	`threshold` enum('hours','months') NOT NULL,
	`rig_id` varchar(36) NOT NULL,
	`user_id` varchar(36) NOT NULL,
	`sent_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `rig_reminders_set_threshold_uq` UNIQUE(`set_id`,`threshold`)
);
--> statement-breakpoint
CREATE TABLE `rig_shares` (
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
	`shared_shop_id` varchar(36) NOT NULL,
	CONSTRAINT `rig_shares_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `rig_tube_sets` (
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
	`fitted_on` varchar(10) NOT NULL DEFAULT '',
	`fitted_by` varchar(120) NOT NULL DEFAULT '',
	`tubes` json NOT NULL,
	`readings` json NOT NULL,
	`spare` boolean NOT NULL DEFAULT false,
	`retired_on` varchar(10) NOT NULL DEFAULT '',
	CONSTRAINT `rig_tube_sets_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `rigs` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`version` bigint unsigned NOT NULL,
	`field_stamps` json NOT NULL,
	`created_by` varchar(36) NOT NULL,
	`updated_by` varchar(36),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`deleted_at` datetime(3),
	`description` varchar(200) NOT NULL,
	`serial` varchar(80) NOT NULL DEFAULT '',
	`tubes` json NOT NULL,
	`bias_mode` enum('fixed','cathode') NOT NULL DEFAULT 'fixed',
	`speaker_load_ohms` double,
	`output_tap_ohms` double,
	`retube_hours` double,
	`retube_months` double,
	`notes` text NOT NULL,
	CONSTRAINT `rigs_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `shops` ADD `kind` enum('shop','personal') DEFAULT 'shop' NOT NULL;--> statement-breakpoint
ALTER TABLE `shops` ADD `personal_of` varchar(36);--> statement-breakpoint
ALTER TABLE `amps` ADD `rig_id` varchar(36);--> statement-breakpoint
ALTER TABLE `shops` ADD CONSTRAINT `shops_personal_of_uq` UNIQUE(`personal_of`);--> statement-breakpoint
CREATE INDEX `rig_gigs_shop_version_idx` ON `rig_gigs` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `rig_gigs_rig_idx` ON `rig_gigs` (`rig_id`);--> statement-breakpoint
CREATE INDEX `rig_shares_shop_version_idx` ON `rig_shares` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `rig_shares_rig_idx` ON `rig_shares` (`rig_id`);--> statement-breakpoint
CREATE INDEX `rig_shares_shared_idx` ON `rig_shares` (`shared_shop_id`);--> statement-breakpoint
CREATE INDEX `rig_tube_sets_shop_version_idx` ON `rig_tube_sets` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `rig_tube_sets_rig_idx` ON `rig_tube_sets` (`rig_id`);--> statement-breakpoint
CREATE INDEX `rigs_shop_version_idx` ON `rigs` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `amps_rig_idx` ON `amps` (`rig_id`);