ALTER TABLE `pay_weeks` ADD `paid_at` integer;--> statement-breakpoint
UPDATE `pay_weeks` SET `paid_at` = `closed_at` WHERE `snapshot` IS NOT NULL;