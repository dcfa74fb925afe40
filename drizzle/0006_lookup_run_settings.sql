ALTER TABLE `lookup_runs` ADD `degree` json;--> statement-breakpoint
ALTER TABLE `lookup_runs` ADD `extrapolate` boolean DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE `lookup_runs` ADD `units` enum('field','metric') DEFAULT 'field' NOT NULL;--> statement-breakpoint
ALTER TABLE `lookup_runs` ADD `value_units` json;--> statement-breakpoint
ALTER TABLE `lookup_sets` ADD `units` enum('field','metric') DEFAULT 'field' NOT NULL;--> statement-breakpoint
ALTER TABLE `lookup_sets` ADD `extrapolate` boolean DEFAULT false NOT NULL;--> statement-breakpoint
-- Runs recorded before this migration used their set's degree (and field units with extrapolation on, the defaults above).
UPDATE `lookup_runs` `r` JOIN `lookup_sets` `s` ON `s`.`id` = `r`.`set_id` SET `r`.`degree` = `s`.`degree`;