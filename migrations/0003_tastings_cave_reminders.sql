CREATE TABLE `journal_reminders` (
	`id` int AUTO_INCREMENT NOT NULL,
	`journal_id` int NOT NULL,
	`kind` enum('ready','check') NOT NULL,
	`due_on` date NOT NULL,
	`sent_at` datetime,
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `journal_reminders_id` PRIMARY KEY(`id`),
	CONSTRAINT `journal_reminders_unique` UNIQUE(`journal_id`,`kind`,`due_on`)
);
--> statement-breakpoint
CREATE TABLE `tasting_invites` (
	`id` int AUTO_INCREMENT NOT NULL,
	`journal_id` int NOT NULL,
	`created_by` int NOT NULL,
	`code_hash` char(64) NOT NULL,
	`expires_at` datetime NOT NULL,
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `tasting_invites_id` PRIMARY KEY(`id`),
	CONSTRAINT `tasting_invites_code_unique` UNIQUE(`code_hash`)
);
--> statement-breakpoint
CREATE TABLE `tastings` (
	`id` int AUTO_INCREMENT NOT NULL,
	`journal_id` int NOT NULL,
	`taster_id` int NOT NULL,
	`tasted_on` date NOT NULL,
	`age_days` int NOT NULL,
	`overall` tinyint NOT NULL,
	`appearance` tinyint NOT NULL,
	`aroma` tinyint NOT NULL,
	`flavour` tinyint NOT NULL,
	`texture` tinyint NOT NULL,
	`finish` tinyint NOT NULL,
	`descriptors` json NOT NULL,
	`defects` json NOT NULL,
	`notes` mediumtext NOT NULL,
	`hidden_at` datetime,
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	`updated_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `tastings_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `users` ADD `calendar_version` int DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `journal_reminders` ADD CONSTRAINT `journal_reminders_journal_fk` FOREIGN KEY (`journal_id`) REFERENCES `journals`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tasting_invites` ADD CONSTRAINT `tasting_invites_journal_fk` FOREIGN KEY (`journal_id`) REFERENCES `journals`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tasting_invites` ADD CONSTRAINT `tasting_invites_user_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tastings` ADD CONSTRAINT `tastings_journal_fk` FOREIGN KEY (`journal_id`) REFERENCES `journals`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tastings` ADD CONSTRAINT `tastings_taster_fk` FOREIGN KEY (`taster_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `journal_reminders_pending_idx` ON `journal_reminders` (`sent_at`,`due_on`);--> statement-breakpoint
CREATE INDEX `tastings_journal_idx` ON `tastings` (`journal_id`,`tasted_on`);--> statement-breakpoint
CREATE INDEX `tastings_taster_idx` ON `tastings` (`taster_id`);--> statement-breakpoint
CREATE INDEX `tastings_age_idx` ON `tastings` (`age_days`);