CREATE TABLE `users` (
	`id` int AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`email_verified_at` datetime,
	`handle` varchar(32) NOT NULL,
	`display_name` varchar(80) NOT NULL,
	`password_hash` varchar(255) NOT NULL,
	`role` enum('member','moderator','admin') NOT NULL DEFAULT 'member',
	`units` enum('metric','us') NOT NULL DEFAULT 'metric',
	`reminders_enabled` boolean NOT NULL DEFAULT true,
	`bio` text,
	`disabled_at` datetime,
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	`updated_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `users_id` PRIMARY KEY(`id`),
	CONSTRAINT `users_email_unique` UNIQUE(`email`),
	CONSTRAINT `users_handle_unique` UNIQUE(`handle`)
);
--> statement-breakpoint
CREATE TABLE `sessions` (
	`session_id` varchar(128) NOT NULL,
	`expires` int unsigned NOT NULL,
	`data` mediumtext,
	CONSTRAINT `sessions_session_id` PRIMARY KEY(`session_id`)
);
--> statement-breakpoint
CREATE TABLE `styles` (
	`id` int AUTO_INCREMENT NOT NULL,
	`slug` varchar(64) NOT NULL,
	`name` varchar(120) NOT NULL,
	`family` enum('fresh','soft-ripened','washed-rind','semi-hard','hard','blue','pasta-filata','brined','whey') NOT NULL,
	`description` text NOT NULL,
	`typical_aging_days_min` int NOT NULL,
	`typical_aging_days_max` int NOT NULL,
	`sort_order` int NOT NULL DEFAULT 0,
	CONSTRAINT `styles_id` PRIMARY KEY(`id`),
	CONSTRAINT `styles_slug_unique` UNIQUE(`slug`)
);
--> statement-breakpoint
CREATE TABLE `email_tokens` (
	`id` int AUTO_INCREMENT NOT NULL,
	`user_id` int NOT NULL,
	`kind` enum('verify','reset','email-change') NOT NULL,
	`token_hash` char(64) NOT NULL,
	`new_email` varchar(254),
	`expires_at` datetime NOT NULL,
	`used_at` datetime,
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `email_tokens_id` PRIMARY KEY(`id`),
	CONSTRAINT `email_tokens_hash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `rate_limits` (
	`key` varchar(255) NOT NULL,
	`points` int NOT NULL DEFAULT 0,
	`expire` bigint unsigned,
	CONSTRAINT `rate_limits_key` PRIMARY KEY(`key`)
);
--> statement-breakpoint
ALTER TABLE `email_tokens` ADD CONSTRAINT `email_tokens_user_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `users_role_idx` ON `users` (`role`);--> statement-breakpoint
CREATE INDEX `sessions_expires_idx` ON `sessions` (`expires`);--> statement-breakpoint
CREATE INDEX `styles_family_idx` ON `styles` (`family`);--> statement-breakpoint
CREATE INDEX `email_tokens_user_kind_idx` ON `email_tokens` (`user_id`,`kind`);