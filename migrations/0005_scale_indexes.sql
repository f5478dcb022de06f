DROP INDEX `journals_listing_idx` ON `journals`;--> statement-breakpoint
CREATE INDEX `journals_listed_newest_idx` ON `journals` (`status`,`visibility`,`hidden_at`,`make_date`);--> statement-breakpoint
CREATE INDEX `journals_listed_best_idx` ON `journals` (`status`,`visibility`,`hidden_at`,`mean_overall`,`tasting_count`);--> statement-breakpoint
CREATE INDEX `journals_listed_style_best_idx` ON `journals` (`status`,`visibility`,`hidden_at`,`style_id`,`mean_overall`,`tasting_count`);--> statement-breakpoint
CREATE INDEX `journals_listed_style_aging_idx` ON `journals` (`status`,`visibility`,`hidden_at`,`style_id`,`aging_target_days`);--> statement-breakpoint
CREATE INDEX `journals_listed_aging_idx` ON `journals` (`status`,`visibility`,`hidden_at`,`aging_target_days`);--> statement-breakpoint
CREATE INDEX `tastings_compare_idx` ON `tastings` (`journal_id`,`hidden_at`,`overall`,`appearance`,`aroma`,`flavour`,`texture`,`finish`,`age_days`);