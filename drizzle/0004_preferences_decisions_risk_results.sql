CREATE TABLE `risk_results` (
	`scenario_id` int unsigned NOT NULL,
	`inputs_hash` varchar(64) NOT NULL,
	`scenario_version` int unsigned NOT NULL,
	`result` json NOT NULL,
	`saved_by` int unsigned,
	`saved_at` datetime(3) NOT NULL,
	CONSTRAINT `risk_results_scenario_id` PRIMARY KEY(`scenario_id`)
);
--> statement-breakpoint
CREATE TABLE `scenario_decisions` (
	`id` int unsigned AUTO_INCREMENT NOT NULL,
	`scenario_id` int unsigned NOT NULL,
	`option_id` varchar(60) NOT NULL,
	`option_name` varchar(120) NOT NULL,
	`decided_by` int unsigned,
	`decided_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`note` varchar(500) NOT NULL DEFAULT '',
	`scenario_version` int unsigned NOT NULL,
	CONSTRAINT `scenario_decisions_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `scenario_preferences` (
	`scenario_id` int unsigned NOT NULL,
	`user_id` int unsigned NOT NULL,
	`option_id` varchar(60) NOT NULL,
	`reason` varchar(500) NOT NULL DEFAULT '',
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `scenario_preferences_scenario_id_user_id_pk` PRIMARY KEY(`scenario_id`,`user_id`)
);
--> statement-breakpoint
ALTER TABLE `risk_results` ADD CONSTRAINT `risk_results_scenario_id_scenarios_id_fk` FOREIGN KEY (`scenario_id`) REFERENCES `scenarios`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `risk_results` ADD CONSTRAINT `risk_results_saved_by_users_id_fk` FOREIGN KEY (`saved_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `scenario_decisions` ADD CONSTRAINT `scenario_decisions_scenario_id_scenarios_id_fk` FOREIGN KEY (`scenario_id`) REFERENCES `scenarios`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `scenario_decisions` ADD CONSTRAINT `scenario_decisions_decided_by_users_id_fk` FOREIGN KEY (`decided_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `scenario_preferences` ADD CONSTRAINT `scenario_preferences_scenario_id_scenarios_id_fk` FOREIGN KEY (`scenario_id`) REFERENCES `scenarios`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `scenario_preferences` ADD CONSTRAINT `scenario_preferences_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `scenario_decisions_scenario_idx` ON `scenario_decisions` (`scenario_id`);