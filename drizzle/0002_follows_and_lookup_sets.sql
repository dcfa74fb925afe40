CREATE TABLE `lookup_runs` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`set_id` bigint unsigned NOT NULL,
	`revision_id` bigint unsigned,
	`revision_number` int unsigned NOT NULL,
	`method` varchar(16) NOT NULL,
	`results` json NOT NULL,
	`created_by` bigint unsigned,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `lookup_runs_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `lookup_sets` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`sample_id` bigint unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`properties` json NOT NULL,
	`conditions` json NOT NULL,
	`method` varchar(16) NOT NULL,
	`degree` json,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `lookup_sets_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `sample_follows` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`sample_id` bigint unsigned NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `sample_follows_id` PRIMARY KEY(`id`),
	CONSTRAINT `sample_follows_sample_id_user_id_unique` UNIQUE(`sample_id`,`user_id`)
);
--> statement-breakpoint
ALTER TABLE `lookup_runs` ADD CONSTRAINT `lookup_runs_set_id_lookup_sets_id_fk` FOREIGN KEY (`set_id`) REFERENCES `lookup_sets`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `lookup_runs` ADD CONSTRAINT `lookup_runs_revision_id_sample_revisions_id_fk` FOREIGN KEY (`revision_id`) REFERENCES `sample_revisions`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `lookup_runs` ADD CONSTRAINT `lookup_runs_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `lookup_sets` ADD CONSTRAINT `lookup_sets_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `lookup_sets` ADD CONSTRAINT `lookup_sets_sample_id_samples_id_fk` FOREIGN KEY (`sample_id`) REFERENCES `samples`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sample_follows` ADD CONSTRAINT `sample_follows_sample_id_samples_id_fk` FOREIGN KEY (`sample_id`) REFERENCES `samples`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sample_follows` ADD CONSTRAINT `sample_follows_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `lookup_runs_set_id_idx` ON `lookup_runs` (`set_id`);--> statement-breakpoint
CREATE INDEX `lookup_sets_user_id_idx` ON `lookup_sets` (`user_id`);