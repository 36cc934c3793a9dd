CREATE TABLE `tubes` (
	`id` varchar(36) NOT NULL,
	`shop_id` varchar(36) NOT NULL,
	`name` varchar(80) NOT NULL,
	`max_plate_watts` double NOT NULL,
	`max_screen_watts` double,
	`max_plate_volts` double NOT NULL,
	`heater` varchar(60) NOT NULL,
	`rating_system` enum('design-centre','design-maximum','absolute-maximum') NOT NULL,
	`source` text NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`deleted_at` datetime(3),
	CONSTRAINT `tubes_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `tubes` ADD CONSTRAINT `tubes_shop_id_shops_id_fk` FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `tubes_shop_idx` ON `tubes` (`shop_id`,`deleted_at`);