-- Rebuilding repair_orders for its CHECK (0013_constraints) dropped the triggers that keep the search index in step;
-- the index rows themselves kept their rowids, which are the RO ids the rebuild copied.
CREATE TRIGGER `repair_orders_search_insert` AFTER INSERT ON `repair_orders` BEGIN
	INSERT INTO `repair_orders_search` (`rowid`, `number`, `customer_name`, `customer_phone`, `phone_digits`, `plate`, `vin`)
	VALUES (
		new.`id`, new.`number`, new.`customer_name`, new.`customer_phone`,
		replace(replace(replace(replace(replace(replace(new.`customer_phone`, ' ', ''), '-', ''), '(', ''), ')', ''), '.', ''), '+', ''),
		new.`vehicle_plate`,
		(SELECT `vin` FROM `vehicles` WHERE `vehicles`.`id` = new.`vehicle_id`)
	);
END;
--> statement-breakpoint
CREATE TRIGGER `repair_orders_search_update` AFTER UPDATE OF `number`, `customer_name`, `customer_phone`, `vehicle_plate`, `vehicle_id` ON `repair_orders` BEGIN
	DELETE FROM `repair_orders_search` WHERE `rowid` = old.`id`;
	INSERT INTO `repair_orders_search` (`rowid`, `number`, `customer_name`, `customer_phone`, `phone_digits`, `plate`, `vin`)
	VALUES (
		new.`id`, new.`number`, new.`customer_name`, new.`customer_phone`,
		replace(replace(replace(replace(replace(replace(new.`customer_phone`, ' ', ''), '-', ''), '(', ''), ')', ''), '.', ''), '+', ''),
		new.`vehicle_plate`,
		(SELECT `vin` FROM `vehicles` WHERE `vehicles`.`id` = new.`vehicle_id`)
	);
END;
--> statement-breakpoint
CREATE TRIGGER `repair_orders_search_delete` AFTER DELETE ON `repair_orders` BEGIN
	DELETE FROM `repair_orders_search` WHERE `rowid` = old.`id`;
END;
