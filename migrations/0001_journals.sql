CREATE TABLE `journal_ingredients` (
	`journal_id` int NOT NULL,
	`position` smallint NOT NULL,
	`kind` enum('culture','rennet','calcium-chloride','colouring','salt','other') NOT NULL,
	`name` varchar(80) NOT NULL,
	`amount` double NOT NULL,
	`unit` enum('L','mL','gal','qt','cup','tbsp','tsp','kg','g','lb','oz','drop') NOT NULL,
	`ml_per_drop` double,
	`si_value` double NOT NULL,
	`si_dimension` enum('volume','mass','count') NOT NULL,
	`note` varchar(300) NOT NULL DEFAULT '',
	CONSTRAINT `journal_ingredients_pk` PRIMARY KEY(`journal_id`,`position`)
);
--> statement-breakpoint
CREATE TABLE `journal_photos` (
	`id` int AUTO_INCREMENT NOT NULL,
	`journal_id` int NOT NULL,
	`file_key` varchar(64) NOT NULL,
	`width` int NOT NULL,
	`height` int NOT NULL,
	`widths` varchar(40) NOT NULL,
	`caption` varchar(200) NOT NULL DEFAULT '',
	`position` smallint NOT NULL DEFAULT 0,
	`hidden_at` datetime,
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `journal_photos_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `journal_press_stages` (
	`journal_id` int NOT NULL,
	`position` smallint NOT NULL,
	`load_n` double NOT NULL,
	`load_unit` enum('N','kgf','lbf') NOT NULL DEFAULT 'kgf',
	`minutes` int NOT NULL,
	CONSTRAINT `journal_press_stages_pk` PRIMARY KEY(`journal_id`,`position`)
);
--> statement-breakpoint
CREATE TABLE `journal_readings` (
	`id` char(36) NOT NULL,
	`journal_id` int NOT NULL,
	`taken_at` datetime(3) NOT NULL,
	`temp_c` double,
	`ph` double,
	`step_index` smallint,
	`note` varchar(300) NOT NULL DEFAULT '',
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `journal_readings_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `journal_steps` (
	`journal_id` int NOT NULL,
	`position` smallint NOT NULL,
	`kind` enum('warming','ripening','colouring','coagulation','cutting','healing','cooking','stirring','draining','cheddaring','milling','salting','hooping','pressing','drying','rind-treatment','other') NOT NULL,
	`target_temp_c` double,
	`actual_temp_c` double,
	`target_minutes` double,
	`actual_minutes` double,
	`started_at` datetime(3),
	`cut_size_mm` double,
	`note` varchar(500) NOT NULL DEFAULT '',
	CONSTRAINT `journal_steps_pk` PRIMARY KEY(`journal_id`,`position`)
);
--> statement-breakpoint
CREATE TABLE `journal_weigh_ins` (
	`id` int AUTO_INCREMENT NOT NULL,
	`journal_id` int NOT NULL,
	`date` date NOT NULL,
	`mass_kg` double NOT NULL,
	`note` varchar(300) NOT NULL DEFAULT '',
	CONSTRAINT `journal_weigh_ins_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `journals` (
	`id` int AUTO_INCREMENT NOT NULL,
	`user_id` int NOT NULL,
	`style_id` int NOT NULL,
	`source_journal_id` int,
	`title` varchar(140) NOT NULL,
	`make_date` date NOT NULL,
	`status` enum('draft','published') NOT NULL DEFAULT 'draft',
	`visibility` enum('public','unlisted','private') NOT NULL DEFAULT 'private',
	`wheel_status` enum('making','pressing','drying','aging','opened','finished','discarded') NOT NULL DEFAULT 'making',
	`milk_volume_l` double NOT NULL,
	`milk_volume_unit` enum('L','mL','gal','qt','cup','tbsp','tsp') NOT NULL DEFAULT 'L',
	`species` enum('cow','goat','sheep','buffalo','mixed') NOT NULL,
	`heat_treatment` enum('raw','thermised','pasteurised','ultra-pasteurised') NOT NULL,
	`homogenised` boolean NOT NULL DEFAULT false,
	`fat_percent` double,
	`protein_percent` double,
	`mould_shape` enum('round','rectangular') NOT NULL DEFAULT 'round',
	`mould_diameter_mm` double,
	`mould_length_mm` double,
	`mould_width_mm` double,
	`mould_unit` enum('mm','cm','in') NOT NULL DEFAULT 'mm',
	`rind_treatment` enum('natural','waxed','vacuum-sealed','cloth-bound','oiled','other') NOT NULL DEFAULT 'natural',
	`drying_days` double,
	`aging_target_days` int,
	`aging_temp_c` double,
	`aging_humidity_percent` double,
	`aging_check_date` date,
	`green_weight_kg` double,
	`notes` mediumtext NOT NULL,
	`hidden_at` datetime,
	`metric_salt_g_per_l` double,
	`metric_salt_percent` double,
	`metric_colour_ml_per_l` double,
	`metric_calcium_chloride_ml_per_l` double,
	`metric_culture_g_per_l` double,
	`metric_coagulation_temp_c` double,
	`metric_cook_temp_c` double,
	`metric_cook_ramp_c_per_5min` double,
	`metric_press_max_kpa` double,
	`metric_yield_percent` double,
	`metric_moisture_loss_percent` double,
	`tasting_count` int NOT NULL DEFAULT 0,
	`mean_overall` double,
	`last_tasted_age_days` int,
	`published_at` datetime,
	`created_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	`updated_at` datetime NOT NULL DEFAULT CURRENT_TIMESTAMP,
	CONSTRAINT `journals_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `journal_ingredients` ADD CONSTRAINT `journal_ingredients_journal_fk` FOREIGN KEY (`journal_id`) REFERENCES `journals`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journal_photos` ADD CONSTRAINT `journal_photos_journal_fk` FOREIGN KEY (`journal_id`) REFERENCES `journals`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journal_press_stages` ADD CONSTRAINT `journal_press_stages_journal_fk` FOREIGN KEY (`journal_id`) REFERENCES `journals`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journal_readings` ADD CONSTRAINT `journal_readings_journal_fk` FOREIGN KEY (`journal_id`) REFERENCES `journals`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journal_steps` ADD CONSTRAINT `journal_steps_journal_fk` FOREIGN KEY (`journal_id`) REFERENCES `journals`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journal_weigh_ins` ADD CONSTRAINT `journal_weigh_ins_journal_fk` FOREIGN KEY (`journal_id`) REFERENCES `journals`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journals` ADD CONSTRAINT `journals_user_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journals` ADD CONSTRAINT `journals_style_fk` FOREIGN KEY (`style_id`) REFERENCES `styles`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `journals` ADD CONSTRAINT `journals_source_fk` FOREIGN KEY (`source_journal_id`) REFERENCES `journals`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `journal_ingredients_kind_idx` ON `journal_ingredients` (`kind`);--> statement-breakpoint
CREATE INDEX `journal_photos_journal_idx` ON `journal_photos` (`journal_id`,`position`);--> statement-breakpoint
CREATE INDEX `journal_readings_journal_idx` ON `journal_readings` (`journal_id`,`taken_at`);--> statement-breakpoint
CREATE INDEX `journal_weigh_ins_journal_idx` ON `journal_weigh_ins` (`journal_id`,`date`);--> statement-breakpoint
CREATE INDEX `journals_listing_idx` ON `journals` (`status`,`visibility`,`make_date`);--> statement-breakpoint
CREATE INDEX `journals_style_idx` ON `journals` (`style_id`,`make_date`);--> statement-breakpoint
CREATE INDEX `journals_user_idx` ON `journals` (`user_id`,`make_date`);--> statement-breakpoint
CREATE INDEX `journals_species_idx` ON `journals` (`species`);--> statement-breakpoint
CREATE INDEX `journals_heat_idx` ON `journals` (`heat_treatment`);--> statement-breakpoint
CREATE INDEX `journals_rind_idx` ON `journals` (`rind_treatment`);--> statement-breakpoint
CREATE INDEX `journals_aging_target_idx` ON `journals` (`aging_target_days`);--> statement-breakpoint
CREATE INDEX `journals_tasted_age_idx` ON `journals` (`last_tasted_age_days`);--> statement-breakpoint
CREATE INDEX `journals_score_idx` ON `journals` (`mean_overall`);--> statement-breakpoint
CREATE INDEX `journals_tasting_count_idx` ON `journals` (`tasting_count`);--> statement-breakpoint
CREATE INDEX `journals_wheel_idx` ON `journals` (`user_id`,`wheel_status`);