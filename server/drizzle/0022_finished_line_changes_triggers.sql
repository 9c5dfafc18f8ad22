-- Each change to a finished line (finished, edited, reopened, removed) leaves the earlier of its completion
-- instants before and after in finished_line_changes, so a cache of past weeks knows which weeks to forget.
-- Only the latest thousand rows are kept: a reader that missed more starts over.
CREATE TRIGGER `job_lines_finished_insert` AFTER INSERT ON `job_lines` WHEN new.`completed_at` IS NOT NULL BEGIN
	INSERT INTO `finished_line_changes` (`at`) VALUES (new.`completed_at`);
	DELETE FROM `finished_line_changes` WHERE `seq` <= last_insert_rowid() - 1000;
END;
--> statement-breakpoint
CREATE TRIGGER `job_lines_finished_update` AFTER UPDATE ON `job_lines`
WHEN old.`completed_at` IS NOT NULL OR new.`completed_at` IS NOT NULL BEGIN
	INSERT INTO `finished_line_changes` (`at`)
	VALUES (min(coalesce(old.`completed_at`, new.`completed_at`), coalesce(new.`completed_at`, old.`completed_at`)));
	DELETE FROM `finished_line_changes` WHERE `seq` <= last_insert_rowid() - 1000;
END;
--> statement-breakpoint
CREATE TRIGGER `job_lines_finished_delete` AFTER DELETE ON `job_lines` WHEN old.`completed_at` IS NOT NULL BEGIN
	INSERT INTO `finished_line_changes` (`at`) VALUES (old.`completed_at`);
	DELETE FROM `finished_line_changes` WHERE `seq` <= last_insert_rowid() - 1000;
END;
