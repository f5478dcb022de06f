-- Full-text search over journal titles and notes (drizzle-kit has no FULLTEXT builder).
CREATE FULLTEXT INDEX `journals_text_ftx` ON `journals` (`title`, `notes`);
