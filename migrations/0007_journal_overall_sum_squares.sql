ALTER TABLE `journals` ADD `overall_sum_squares` double;--> statement-breakpoint
UPDATE `journals` j JOIN (SELECT `journal_id`, SUM(`overall` * `overall`) AS ssq, SUM(`overall`) / CAST(COUNT(*) AS DOUBLE) AS mean FROM `tastings` WHERE `hidden_at` IS NULL GROUP BY `journal_id`) s ON s.`journal_id` = j.`id` SET j.`overall_sum_squares` = s.ssq, j.`mean_overall` = s.mean;
