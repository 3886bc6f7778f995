CREATE TABLE `audit_log` (
	`id` int unsigned AUTO_INCREMENT NOT NULL,
	`farm_id` int unsigned NOT NULL,
	`actor_id` int unsigned,
	`actor_name` varchar(120) NOT NULL,
	`action` varchar(40) NOT NULL,
	`subject` varchar(240) NOT NULL,
	`detail` json NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `audit_log_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `lender_shares` (
	`id` int unsigned AUTO_INCREMENT NOT NULL,
	`farm_id` int unsigned NOT NULL,
	`scenario_id` int unsigned NOT NULL,
	`version` int unsigned NOT NULL,
	`lender_email` varchar(254) NOT NULL,
	`lender_user_id` int unsigned,
	`token_hash` char(64) NOT NULL,
	`token_used_at` datetime(3),
	`expires_on` date NOT NULL,
	`revoked_at` datetime(3),
	`review_status` enum('open','questions','supported','not-supported') NOT NULL DEFAULT 'open',
	`review_status_at` datetime(3),
	`review_status_by` int unsigned,
	`created_by` int unsigned,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `lender_shares_id` PRIMARY KEY(`id`),
	CONSTRAINT `lender_shares_token_hash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `review_notes` (
	`id` int unsigned AUTO_INCREMENT NOT NULL,
	`farm_id` int unsigned NOT NULL,
	`scenario_id` int unsigned NOT NULL,
	`share_id` int unsigned NOT NULL,
	`author_id` int unsigned,
	`author_role` enum('owner','partner','consultant','lender') NOT NULL,
	`option_id` varchar(60),
	`line_ref` varchar(120),
	`parent_id` int unsigned,
	`body` varchar(4000) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `review_notes_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `audit_log` ADD CONSTRAINT `audit_log_farm_id_farms_id_fk` FOREIGN KEY (`farm_id`) REFERENCES `farms`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `audit_log` ADD CONSTRAINT `audit_log_actor_id_users_id_fk` FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `lender_shares` ADD CONSTRAINT `lender_shares_farm_id_farms_id_fk` FOREIGN KEY (`farm_id`) REFERENCES `farms`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `lender_shares` ADD CONSTRAINT `lender_shares_lender_user_id_users_id_fk` FOREIGN KEY (`lender_user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `lender_shares` ADD CONSTRAINT `lender_shares_review_status_by_users_id_fk` FOREIGN KEY (`review_status_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `lender_shares` ADD CONSTRAINT `lender_shares_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `lender_shares` ADD CONSTRAINT `lender_shares_version_fk` FOREIGN KEY (`scenario_id`,`version`) REFERENCES `scenario_versions`(`scenario_id`,`version`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `lender_shares` ADD CONSTRAINT `lender_shares_scenario_fk` FOREIGN KEY (`scenario_id`) REFERENCES `scenarios`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `review_notes` ADD CONSTRAINT `review_notes_farm_id_farms_id_fk` FOREIGN KEY (`farm_id`) REFERENCES `farms`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `review_notes` ADD CONSTRAINT `review_notes_scenario_id_scenarios_id_fk` FOREIGN KEY (`scenario_id`) REFERENCES `scenarios`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `review_notes` ADD CONSTRAINT `review_notes_share_id_lender_shares_id_fk` FOREIGN KEY (`share_id`) REFERENCES `lender_shares`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `review_notes` ADD CONSTRAINT `review_notes_author_id_users_id_fk` FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `review_notes` ADD CONSTRAINT `review_notes_parent_id_review_notes_id_fk` FOREIGN KEY (`parent_id`) REFERENCES `review_notes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `audit_log_farm_created_idx` ON `audit_log` (`farm_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `lender_shares_farm_idx` ON `lender_shares` (`farm_id`);--> statement-breakpoint
CREATE INDEX `lender_shares_lender_idx` ON `lender_shares` (`lender_user_id`);--> statement-breakpoint
CREATE INDEX `review_notes_share_idx` ON `review_notes` (`share_id`);