ALTER TABLE `compare_facts` ADD `title` varchar(140) DEFAULT '' NOT NULL;--> statement-breakpoint
UPDATE `compare_facts` f JOIN `journals` j ON j.`id` = f.`journal_id` SET f.`title` = j.`title`;
