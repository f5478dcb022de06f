CREATE TABLE `audit_entries` (
	`id` int AUTO_INCREMENT NOT NULL,
	`actor_id` int,
	`actor_handle` varchar(32) NOT NULL,
	`action` enum('report-dismissed','item-hidden','item-restored','member-suspended','comment-approved','comment-rejected','comment-deleted','setting-changed','role-changed','member-disabled','member-enabled') NOT NULL,
	`target_type` enum('journal','photo','tasting','comment','member','setting') NOT NULL,
	`target_id` int,
	`target_user_id` int,
	`target_user_handle` varchar(32),
	`report_id` int,
	`summary` varchar(300) NOT NULL DEFAULT '',
	`note` varchar(1000) NOT NULL DEFAULT '',
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `audit_entries_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `comments` (
	`id` int AUTO_INCREMENT NOT NULL,
	`journal_id` int NOT NULL,
	`author_id` int NOT NULL,
	`parent_id` int,
	`body` text NOT NULL,
	`status` enum('pending','visible') NOT NULL DEFAULT 'visible',
	`edited_at` datetime,
	`hidden_at` datetime,
	`deleted_at` datetime,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `comments_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `follows` (
	`follower_id` int NOT NULL,
	`followee_id` int NOT NULL,
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `follows_pk` PRIMARY KEY(`follower_id`,`followee_id`)
);
--> statement-breakpoint
CREATE TABLE `notifications` (
	`id` int AUTO_INCREMENT NOT NULL,
	`user_id` int NOT NULL,
	`kind` enum('comment','reply','follow','hidden','restored','comment-approved') NOT NULL,
	`actor_id` int,
	`journal_id` int,
	`comment_id` int,
	`target_type` enum('journal','photo','tasting','comment'),
	`target_id` int,
	`note` varchar(1000) NOT NULL DEFAULT '',
	`read_at` datetime,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `notifications_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `reports` (
	`id` int AUTO_INCREMENT NOT NULL,
	`target_type` enum('journal','photo','tasting','comment') NOT NULL,
	`target_id` int NOT NULL,
	`target_user_id` int,
	`reporter_id` int,
	`reason` enum('spam','abusive','unsafe-advice','off-topic','not-theirs','other') NOT NULL,
	`details` varchar(1000) NOT NULL DEFAULT '',
	`status` enum('open','dismissed','actioned') NOT NULL DEFAULT 'open',
	`resolved_by` int,
	`resolved_at` datetime,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `reports_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `site_settings` (
	`key` varchar(64) NOT NULL,
	`value` varchar(255) NOT NULL,
	`updated_by` int,
	`updated_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `site_settings_key` PRIMARY KEY(`key`)
);
--> statement-breakpoint
ALTER TABLE `users` ADD `notify_comments` boolean DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE `audit_entries` ADD CONSTRAINT `audit_entries_actor_fk` FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `audit_entries` ADD CONSTRAINT `audit_entries_target_user_fk` FOREIGN KEY (`target_user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `audit_entries` ADD CONSTRAINT `audit_entries_report_fk` FOREIGN KEY (`report_id`) REFERENCES `reports`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `comments` ADD CONSTRAINT `comments_journal_fk` FOREIGN KEY (`journal_id`) REFERENCES `journals`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `comments` ADD CONSTRAINT `comments_parent_fk` FOREIGN KEY (`parent_id`) REFERENCES `comments`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `comments` ADD CONSTRAINT `comments_author_fk` FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `follows` ADD CONSTRAINT `follows_follower_fk` FOREIGN KEY (`follower_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `follows` ADD CONSTRAINT `follows_followee_fk` FOREIGN KEY (`followee_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `notifications` ADD CONSTRAINT `notifications_user_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `notifications` ADD CONSTRAINT `notifications_actor_fk` FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `notifications` ADD CONSTRAINT `notifications_journal_fk` FOREIGN KEY (`journal_id`) REFERENCES `journals`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `notifications` ADD CONSTRAINT `notifications_comment_fk` FOREIGN KEY (`comment_id`) REFERENCES `comments`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `reports` ADD CONSTRAINT `reports_target_user_fk` FOREIGN KEY (`target_user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `reports` ADD CONSTRAINT `reports_reporter_fk` FOREIGN KEY (`reporter_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `reports` ADD CONSTRAINT `reports_resolved_by_fk` FOREIGN KEY (`resolved_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `site_settings` ADD CONSTRAINT `site_settings_updated_by_fk` FOREIGN KEY (`updated_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `audit_entries_created_idx` ON `audit_entries` (`created_at`);--> statement-breakpoint
CREATE INDEX `audit_entries_target_idx` ON `audit_entries` (`target_type`,`target_id`);--> statement-breakpoint
CREATE INDEX `audit_entries_actor_idx` ON `audit_entries` (`actor_id`);--> statement-breakpoint
CREATE INDEX `comments_journal_idx` ON `comments` (`journal_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `comments_author_idx` ON `comments` (`author_id`,`status`);--> statement-breakpoint
CREATE INDEX `comments_status_idx` ON `comments` (`status`,`created_at`);--> statement-breakpoint
CREATE INDEX `follows_followee_idx` ON `follows` (`followee_id`);--> statement-breakpoint
CREATE INDEX `notifications_user_idx` ON `notifications` (`user_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `notifications_unread_idx` ON `notifications` (`user_id`,`read_at`);--> statement-breakpoint
CREATE INDEX `reports_status_idx` ON `reports` (`status`,`created_at`);--> statement-breakpoint
CREATE INDEX `reports_target_idx` ON `reports` (`target_type`,`target_id`);--> statement-breakpoint
CREATE INDEX `reports_reporter_idx` ON `reports` (`reporter_id`);