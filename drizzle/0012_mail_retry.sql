ALTER TABLE `sent_mail` ADD `reply_to` varchar(254);--> statement-breakpoint
ALTER TABLE `sent_mail` ADD `attempts` int DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `sent_mail` ADD `next_attempt_at` datetime(3);--> statement-breakpoint
ALTER TABLE `sent_mail` ADD `claimed_until` datetime(3);--> statement-breakpoint
CREATE INDEX `sent_mail_due_idx` ON `sent_mail` (`delivered`,`next_attempt_at`);