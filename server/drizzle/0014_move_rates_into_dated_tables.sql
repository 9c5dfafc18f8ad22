-- The rates on users and the pay rules on shop_settings become the first dated rows, in force from a day
-- before any data, so every week already recorded is paid as before.
INSERT INTO `pay_rules` (`effective_from`, `overtime_rules`, `minimum_wage_cents`, `local_minimum_wage_cents`, `pay_non_productive_separately`, `recorded_at`, `recorded_by`)
SELECT '2000-01-01', `overtime_rules`, `minimum_wage_cents`, NULL, `pay_non_productive_separately`, CAST(strftime('%s', 'now') AS INTEGER) * 1000, NULL
FROM `shop_settings` WHERE `id` = 1;
--> statement-breakpoint
INSERT INTO `pay_rates` (`user_id`, `effective_from`, `pay_type`, `flat_rate_cents`, `hourly_rate_cents`, `guarantee_cents`, `overtime_exempt`, `recorded_at`, `recorded_by`)
SELECT `id`, '2000-01-01', 'flat-rate', `flat_rate_cents`, `hourly_rate_cents`, 0, `overtime_exempt`, CAST(strftime('%s', 'now') AS INTEGER) * 1000, NULL
FROM `users` WHERE `role` = 'technician';
