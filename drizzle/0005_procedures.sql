CREATE TABLE `procedure_gates` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`version` bigint unsigned NOT NULL,
	`field_stamps` json NOT NULL,
	`created_by` varchar(36) NOT NULL,
	`updated_by` varchar(36),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`deleted_at` datetime(3),
	`run_id` varchar(36) NOT NULL,
	`procedure_id` varchar(64) NOT NULL,
	`job_id` varchar(36),
	`items` json NOT NULL,
	`acknowledged_at` varchar(40) NOT NULL,
	CONSTRAINT `procedure_gates_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `procedure_runs` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`version` bigint unsigned NOT NULL,
	`field_stamps` json NOT NULL,
	`created_by` varchar(36) NOT NULL,
	`updated_by` varchar(36),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`deleted_at` datetime(3),
	`procedure_id` varchar(64) NOT NULL,
	`gate_id` varchar(36) NOT NULL,
	`variant` varchar(40) NOT NULL DEFAULT '',
	`job_id` varchar(36),
	`tube_count` int NOT NULL DEFAULT 2,
	`cap_count` int NOT NULL DEFAULT 3,
	`status` enum('running','done','stopped') NOT NULL DEFAULT 'running',
	`step_index` int NOT NULL DEFAULT 0,
	`readings` json NOT NULL,
	`warnings` json NOT NULL,
	`ended_at` varchar(40) NOT NULL DEFAULT '',
	`end_reason` varchar(500) NOT NULL DEFAULT '',
	CONSTRAINT `procedure_runs_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE INDEX `procedure_gates_shop_version_idx` ON `procedure_gates` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `procedure_gates_run_idx` ON `procedure_gates` (`run_id`);--> statement-breakpoint
CREATE INDEX `procedure_runs_shop_version_idx` ON `procedure_runs` (`shop_id`,`version`);--> statement-breakpoint
CREATE INDEX `procedure_runs_job_idx` ON `procedure_runs` (`job_id`);