CREATE TABLE `lab_settings` (
	`key` varchar(64) NOT NULL,
	`value` varchar(255) NOT NULL,
	`updated_by` bigint unsigned,
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `lab_settings_key` PRIMARY KEY(`key`)
);
--> statement-breakpoint
ALTER TABLE `lab_settings` ADD CONSTRAINT `lab_settings_updated_by_users_id_fk` FOREIGN KEY (`updated_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;