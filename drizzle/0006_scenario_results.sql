CREATE TABLE `scenario_results` (
	`scenario_id` int unsigned NOT NULL,
	`version` int unsigned NOT NULL,
	`engine_key` varchar(40) NOT NULL,
	`name` varchar(120) NOT NULL,
	`document` longtext NOT NULL,
	`summary` longtext NOT NULL,
	`detail` longtext NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `scenario_results_pk` PRIMARY KEY(`scenario_id`,`version`,`engine_key`)
);
--> statement-breakpoint
ALTER TABLE `scenario_results` ADD CONSTRAINT `scenario_results_scenario_id_scenarios_id_fk` FOREIGN KEY (`scenario_id`) REFERENCES `scenarios`(`id`) ON DELETE cascade ON UPDATE no action;