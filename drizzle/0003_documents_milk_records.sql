CREATE TABLE `documents` (
	`id` int unsigned AUTO_INCREMENT NOT NULL,
	`farm_id` int unsigned NOT NULL,
	`scenario_id` int unsigned,
	`capital_line_id` varchar(60),
	`file_name` varchar(255) NOT NULL,
	`media_type` varchar(100) NOT NULL,
	`size_bytes` int unsigned NOT NULL,
	`sha256` char(64) NOT NULL,
	`storage_key` varchar(64) NOT NULL,
	`quote_amount` decimal(14,2),
	`uploaded_by` int unsigned,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `documents_id` PRIMARY KEY(`id`),
	CONSTRAINT `documents_storage_key_unique` UNIQUE(`storage_key`)
);
--> statement-breakpoint
CREATE TABLE `milk_record_imports` (
	`id` int unsigned AUTO_INCREMENT NOT NULL,
	`farm_id` int unsigned NOT NULL,
	`status` enum('preview','confirmed') NOT NULL,
	`token` char(32),
	`file_name` varchar(255) NOT NULL,
	`rows_read` int unsigned NOT NULL,
	`rows_accepted` int unsigned NOT NULL,
	`rows_refused` int unsigned NOT NULL,
	`first_date` date,
	`last_date` date,
	`herd_size` int unsigned NOT NULL,
	`average_yield_kg_per_cow_day` decimal(6,2),
	`summary` json NOT NULL,
	`previous_herd_size` int unsigned,
	`previous_yield_kg_per_cow_day` decimal(6,2),
	`created_by` int unsigned,
	`confirmed_by` int unsigned,
	`confirmed_at` datetime(3),
	`expires_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `milk_record_imports_id` PRIMARY KEY(`id`),
	CONSTRAINT `milk_record_imports_token_unique` UNIQUE(`token`)
);
--> statement-breakpoint
ALTER TABLE `documents` ADD CONSTRAINT `documents_farm_id_farms_id_fk` FOREIGN KEY (`farm_id`) REFERENCES `farms`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `documents` ADD CONSTRAINT `documents_scenario_id_scenarios_id_fk` FOREIGN KEY (`scenario_id`) REFERENCES `scenarios`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `documents` ADD CONSTRAINT `documents_uploaded_by_users_id_fk` FOREIGN KEY (`uploaded_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `milk_record_imports` ADD CONSTRAINT `milk_record_imports_farm_id_farms_id_fk` FOREIGN KEY (`farm_id`) REFERENCES `farms`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `milk_record_imports` ADD CONSTRAINT `milk_record_imports_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `milk_record_imports` ADD CONSTRAINT `milk_record_imports_confirmed_by_users_id_fk` FOREIGN KEY (`confirmed_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `documents_farm_scenario_idx` ON `documents` (`farm_id`,`scenario_id`);--> statement-breakpoint
CREATE INDEX `milk_record_imports_farm_idx` ON `milk_record_imports` (`farm_id`,`status`);