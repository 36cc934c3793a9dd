CREATE TABLE `blobs` (
	`sha256` varchar(64) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`type` varchar(32) NOT NULL,
	`size` bigint unsigned NOT NULL,
	`created_by` varchar(36) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `blobs_sha256_shop_id_pk` PRIMARY KEY(`sha256`,`shop_id`)
);
--> statement-breakpoint
CREATE INDEX `blobs_shop_idx` ON `blobs` (`shop_id`,`created_at`);