CREATE TABLE `earlier_ledger_rules` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`until` integer NOT NULL,
	`concurrent_split` text NOT NULL,
	`minimum_meal_minutes` integer NOT NULL,
	CONSTRAINT "earlier_ledger_rules_concurrent_split_check" CHECK("concurrent_split" in ('even', 'full'))
);
