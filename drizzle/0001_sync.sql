CREATE TABLE `measurements` (
	`id` varchar(36) NOT NULL,
	`job_id` varchar(36),
	`rig_id` varchar(36),
	`tool` varchar(32) NOT NULL,
	`inputs` json NOT NULL,
	`outputs` json NOT NULL,
	`engine_version` varchar(20) NOT NULL,
	`label` varchar(200),
	`shop_id` varchar(36) NOT NULL,
	`author_id` varchar(36) NOT NULL,
	`version` bigint unsigned NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`deleted_at` datetime(3),
	CONSTRAINT `measurements_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `notes` (
	`id` varchar(36) NOT NULL,
	`job_id` varchar(36),
	`title` varchar(200) NOT NULL DEFAULT '',
	`body` text NOT NULL,
	`field_stamps` json NOT NULL,
	`updated_by` varchar(36),
	`shop_id` varchar(36) NOT NULL,
	`author_id` varchar(36) NOT NULL,
	`version` bigint unsigned NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`deleted_at` datetime(3),
	CONSTRAINT `notes_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `shop_versions` (
	`shop_id` varchar(36) NOT NULL,
	`version` bigint unsigned NOT NULL DEFAULT 0,
	`horizon` bigint unsigned NOT NULL DEFAULT 0,
	CONSTRAINT `shop_versions_shop_id` PRIMARY KEY(`shop_id`)
);
--> statement-breakpoint
CREATE TABLE `sync_clients` (
	`id` varchar(36) NOT NULL,
	`user_id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`lmid` bigint unsigned NOT NULL DEFAULT 0,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`last_seen_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `sync_clients_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `sync_conflicts` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`table_name` varchar(32) NOT NULL,
	`row_id` varchar(36) NOT NULL,
	`field` varchar(32) NOT NULL,
	`server_value` json,
	`client_value` json,
	`server_author` varchar(36),
	`client_author` varchar(36) NOT NULL,
	`server_changed_at` datetime(3),
	`client_changed_at` datetime(3) NOT NULL,
	`mutation_uuid` varchar(36) NOT NULL,
	`status` enum('open','resolved') NOT NULL DEFAULT 'open',
	`resolution` json,
	`resolved_by` varchar(36),
	`resolved_at` datetime(3),
	`version` bigint unsigned NOT NULL,
	`note` text,
	CONSTRAINT `sync_conflicts_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `sync_mutations` (
	`client_id` varchar(36) NOT NULL,
	`mutation_id` bigint unsigned NOT NULL,
	`uuid` varchar(36) NOT NULL,
	`name` varchar(64) NOT NULL,
	`payload_hash` varchar(64) NOT NULL,
	`status` enum('applied','rejected','conflict') NOT NULL,
	`reason` varchar(500),
	`version` bigint unsigned,
	`user_id` varchar(36) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `sync_mutations_client_id_mutation_id_pk` PRIMARY KEY(`client_id`,`mutation_id`),
	CONSTRAINT `sync_mutations_uuid_uq` UNIQUE(`uuid`)
);
--> statement-breakpoint
CREATE INDEX `measurements_shop_version_idx` ON `measurements` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `measurements_job_idx` ON `measurements` (`job_id`);--> statement-breakpoint
CREATE INDEX `notes_shop_version_idx` ON `notes` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `notes_job_idx` ON `notes` (`job_id`);--> statement-breakpoint
CREATE INDEX `sync_clients_user_idx` ON `sync_clients` (`user_id`);--> statement-breakpoint
CREATE INDEX `sync_conflicts_shop_version_idx` ON `sync_conflicts` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `sync_conflicts_row_idx` ON `sync_conflicts` (`row_id`);