ALTER TABLE `shop_settings` DROP COLUMN `minimum_wage_cents`;--> statement-breakpoint
ALTER TABLE `shop_settings` DROP COLUMN `overtime_rules`;--> statement-breakpoint
ALTER TABLE `shop_settings` DROP COLUMN `pay_non_productive_separately`;--> statement-breakpoint
ALTER TABLE `users` DROP COLUMN `flat_rate_cents`;--> statement-breakpoint
ALTER TABLE `users` DROP COLUMN `hourly_rate_cents`;--> statement-breakpoint
ALTER TABLE `users` DROP COLUMN `overtime_exempt`;