CREATE TABLE `password_reset_requests` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`ip_address` varchar(64) NOT NULL,
	`sent` boolean NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `password_reset_requests_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `users` ADD `sign_in_alert_at` timestamp(3);--> statement-breakpoint
CREATE INDEX `password_reset_requests_email_created_at_idx` ON `password_reset_requests` (`email`,`created_at`);--> statement-breakpoint
CREATE INDEX `password_reset_requests_ip_address_created_at_idx` ON `password_reset_requests` (`ip_address`,`created_at`);--> statement-breakpoint
CREATE INDEX `sign_in_attempts_email_ip_address_created_at_idx` ON `sign_in_attempts` (`email`,`ip_address`,`created_at`);