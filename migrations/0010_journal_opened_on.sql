ALTER TABLE `journals` ADD `opened_on` date;--> statement-breakpoint
UPDATE `journals` j
  JOIN (SELECT journal_id, MIN(tasted_on) AS first_on FROM `tastings` GROUP BY journal_id) t
    ON t.journal_id = j.id
  SET j.opened_on = t.first_on
  WHERE j.wheel_status IN ('opened', 'finished');
