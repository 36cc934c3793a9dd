CREATE INDEX `jobs_list_updated_idx` ON `jobs` (`shop_id`,`deleted_at`,`updated_at`);--> statement-breakpoint
CREATE INDEX `jobs_list_promised_idx` ON `jobs` (`shop_id`,`deleted_at`,`promised_for`,`updated_at`);--> statement-breakpoint
CREATE INDEX `jobs_list_status_idx` ON `jobs` (`shop_id`,`deleted_at`,`status`,`updated_at`);--> statement-breakpoint
CREATE INDEX `jobs_list_priority_idx` ON `jobs` (`shop_id`,`deleted_at`,`priority`,`updated_at`);--> statement-breakpoint
CREATE INDEX `jobs_assigned_idx` ON `jobs` (`shop_id`,`assigned_to`,`updated_at`);