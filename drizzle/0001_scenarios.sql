CREATE TABLE `scenario_versions` (
	`id` int unsigned AUTO_INCREMENT NOT NULL,
	`scenario_id` int unsigned NOT NULL,
	`version` int unsigned NOT NULL,
	`document` json NOT NULL,
	`author_id` int unsigned,
	`note` varchar(200) NOT NULL DEFAULT '',
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `scenario_versions_id` PRIMARY KEY(`id`),
	CONSTRAINT `scenario_versions_scenario_version_unique` UNIQUE(`scenario_id`,`version`)
);
--> statement-breakpoint
CREATE TABLE `scenarios` (
	`id` int unsigned AUTO_INCREMENT NOT NULL,
	`farm_id` int unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`status` enum('draft','decided','archived') NOT NULL DEFAULT 'draft',
	`version` int unsigned NOT NULL,
	`document` json NOT NULL,
	`summary` json NOT NULL,
	`created_by` int unsigned,
	`updated_by` int unsigned,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `scenarios_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `scenario_versions` ADD CONSTRAINT `scenario_versions_scenario_id_scenarios_id_fk` FOREIGN KEY (`scenario_id`) REFERENCES `scenarios`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `scenario_versions` ADD CONSTRAINT `scenario_versions_author_id_users_id_fk` FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `scenarios` ADD CONSTRAINT `scenarios_farm_id_farms_id_fk` FOREIGN KEY (`farm_id`) REFERENCES `farms`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `scenarios` ADD CONSTRAINT `scenarios_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `scenarios` ADD CONSTRAINT `scenarios_updated_by_users_id_fk` FOREIGN KEY (`updated_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `scenarios_farm_idx` ON `scenarios` (`farm_id`);