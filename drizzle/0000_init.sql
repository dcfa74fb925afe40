CREATE TABLE `api_tokens` (
	`id` char(36) NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`scopes` json NOT NULL,
	`restriction` json,
	`expires_at` timestamp(3) NOT NULL,
	`last_used_at` timestamp(3),
	`revoked_at` timestamp(3),
	`revoked_by` bigint unsigned,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `api_tokens_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `audit_log` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`user_id` bigint unsigned,
	`api_token_id` char(36),
	`action` varchar(64) NOT NULL,
	`entity_type` varchar(40),
	`entity_id` varchar(64),
	`details` json,
	`ip_address` varchar(64),
	CONSTRAINT `audit_log_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `sessions` (
	`id` char(64) NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`expires_at` timestamp(3) NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`ip_address` varchar(64),
	`user_agent` varchar(255),
	CONSTRAINT `sessions_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`name` varchar(120) NOT NULL,
	`role` enum('viewer','engineer','lab_lead','admin') NOT NULL DEFAULT 'viewer',
	`password_hash` varchar(255),
	`unit_system` enum('field','metric') NOT NULL DEFAULT 'field',
	`disabled_at` timestamp(3),
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `users_id` PRIMARY KEY(`id`),
	CONSTRAINT `users_email_unique` UNIQUE(`email`)
);
--> statement-breakpoint
CREATE TABLE `fields` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`name` varchar(120) NOT NULL,
	`region` varchar(120),
	`description` text,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `fields_id` PRIMARY KEY(`id`),
	CONSTRAINT `fields_name_unique` UNIQUE(`name`)
);
--> statement-breakpoint
CREATE TABLE `grid_points` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`grid_id` bigint unsigned NOT NULL,
	`pressure_psia` double NOT NULL,
	`temperature_f` double NOT NULL,
	`value` double NOT NULL,
	CONSTRAINT `grid_points_id` PRIMARY KEY(`id`),
	CONSTRAINT `grid_points_grid_id_pressure_psia_temperature_f_unique` UNIQUE(`grid_id`,`pressure_psia`,`temperature_f`)
);
--> statement-breakpoint
CREATE TABLE `property_grids` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`revision_id` bigint unsigned NOT NULL,
	`property` enum('oil_fvf','solution_gor','oil_viscosity','oil_density','gas_fvf','gas_viscosity','z_factor') NOT NULL,
	`unit` varchar(32) NOT NULL,
	`source_unit` varchar(32),
	`meta` json,
	CONSTRAINT `property_grids_id` PRIMARY KEY(`id`),
	CONSTRAINT `property_grids_revision_id_property_unique` UNIQUE(`revision_id`,`property`)
);
--> statement-breakpoint
CREATE TABLE `revision_bubble_points` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`revision_id` bigint unsigned NOT NULL,
	`temperature_f` double NOT NULL,
	`bubble_point_psia` double NOT NULL,
	CONSTRAINT `revision_bubble_points_id` PRIMARY KEY(`id`),
	CONSTRAINT `revision_bubble_points_revision_id_temperature_f_unique` UNIQUE(`revision_id`,`temperature_f`)
);
--> statement-breakpoint
CREATE TABLE `sample_revisions` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`sample_id` bigint unsigned NOT NULL,
	`number` int unsigned NOT NULL,
	`status` enum('draft','approved','rejected','superseded') NOT NULL DEFAULT 'draft',
	`comment` text,
	`source_filename` varchar(255),
	`source_sha256` char(64),
	`qc_report` json,
	`created_by` bigint unsigned,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`reviewed_by` bigint unsigned,
	`reviewed_at` timestamp(3),
	`review_comment` text,
	CONSTRAINT `sample_revisions_id` PRIMARY KEY(`id`),
	CONSTRAINT `sample_revisions_sample_id_number_unique` UNIQUE(`sample_id`,`number`)
);
--> statement-breakpoint
CREATE TABLE `samples` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`well_id` bigint unsigned NOT NULL,
	`label` varchar(120) NOT NULL,
	`sample_type` enum('bottomhole','separator_recombined','wellhead','formation_tester') NOT NULL,
	`sampling_date` date,
	`sampling_depth_ft` double,
	`reservoir_pressure_psia` double,
	`reservoir_temperature_f` double,
	`stock_tank_api` double,
	`gas_specific_gravity` double,
	`standard_pressure_psia` double NOT NULL DEFAULT 14.696,
	`standard_temperature_f` double NOT NULL DEFAULT 60,
	`laboratory` varchar(160),
	`report_reference` varchar(160),
	`notes` text,
	`created_by` bigint unsigned,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `samples_id` PRIMARY KEY(`id`),
	CONSTRAINT `samples_well_id_label_unique` UNIQUE(`well_id`,`label`)
);
--> statement-breakpoint
CREATE TABLE `wells` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`field_id` bigint unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `wells_id` PRIMARY KEY(`id`),
	CONSTRAINT `wells_field_id_name_unique` UNIQUE(`field_id`,`name`)
);
--> statement-breakpoint
ALTER TABLE `api_tokens` ADD CONSTRAINT `api_tokens_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `api_tokens` ADD CONSTRAINT `api_tokens_revoked_by_users_id_fk` FOREIGN KEY (`revoked_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `audit_log` ADD CONSTRAINT `audit_log_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sessions` ADD CONSTRAINT `sessions_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `grid_points` ADD CONSTRAINT `grid_points_grid_id_property_grids_id_fk` FOREIGN KEY (`grid_id`) REFERENCES `property_grids`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `property_grids` ADD CONSTRAINT `property_grids_revision_id_sample_revisions_id_fk` FOREIGN KEY (`revision_id`) REFERENCES `sample_revisions`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `revision_bubble_points` ADD CONSTRAINT `revision_bubble_points_revision_id_sample_revisions_id_fk` FOREIGN KEY (`revision_id`) REFERENCES `sample_revisions`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sample_revisions` ADD CONSTRAINT `sample_revisions_sample_id_samples_id_fk` FOREIGN KEY (`sample_id`) REFERENCES `samples`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sample_revisions` ADD CONSTRAINT `sample_revisions_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sample_revisions` ADD CONSTRAINT `sample_revisions_reviewed_by_users_id_fk` FOREIGN KEY (`reviewed_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `samples` ADD CONSTRAINT `samples_well_id_wells_id_fk` FOREIGN KEY (`well_id`) REFERENCES `wells`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `samples` ADD CONSTRAINT `samples_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `wells` ADD CONSTRAINT `wells_field_id_fields_id_fk` FOREIGN KEY (`field_id`) REFERENCES `fields`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `api_tokens_user_id_idx` ON `api_tokens` (`user_id`);--> statement-breakpoint
CREATE INDEX `audit_log_created_at_idx` ON `audit_log` (`created_at`);--> statement-breakpoint
CREATE INDEX `audit_log_user_id_idx` ON `audit_log` (`user_id`);--> statement-breakpoint
CREATE INDEX `sessions_user_id_idx` ON `sessions` (`user_id`);--> statement-breakpoint
CREATE INDEX `sessions_expires_at_idx` ON `sessions` (`expires_at`);--> statement-breakpoint
CREATE INDEX `sample_revisions_status_idx` ON `sample_revisions` (`status`);