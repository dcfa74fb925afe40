CREATE TABLE `link_tokens` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`kind` enum('invitation','password_reset') NOT NULL,
	`token_hash` char(64) NOT NULL,
	`email` varchar(254) NOT NULL,
	`role` enum('viewer','engineer','lab_lead','admin'),
	`user_id` bigint unsigned,
	`created_by` bigint unsigned,
	`expires_at` timestamp(3) NOT NULL,
	`used_at` timestamp(3),
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `link_tokens_id` PRIMARY KEY(`id`),
	CONSTRAINT `link_tokens_token_hash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `sign_in_attempts` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`ip_address` varchar(64) NOT NULL,
	`succeeded` boolean NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `sign_in_attempts_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `link_tokens` ADD CONSTRAINT `link_tokens_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `link_tokens` ADD CONSTRAINT `link_tokens_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `link_tokens_email_idx` ON `link_tokens` (`email`);--> statement-breakpoint
CREATE INDEX `sign_in_attempts_email_created_at_idx` ON `sign_in_attempts` (`email`,`created_at`);--> statement-breakpoint
CREATE INDEX `sign_in_attempts_ip_address_created_at_idx` ON `sign_in_attempts` (`ip_address`,`created_at`);