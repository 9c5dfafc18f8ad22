-- The office searches repair orders by any part of the RO number, the customer's name or phone (as
-- written or as bare digits), the plate or the VIN: an FTS5 index of trigrams finds them without
-- reading every RO. Triggers keep it in step with `repair_orders`; the VIN of a vehicle never changes.
CREATE VIRTUAL TABLE `repair_orders_search` USING fts5(
	`number`, `customer_name`, `customer_phone`, `phone_digits`, `plate`, `vin`,
	tokenize = 'trigram'
);
--> statement-breakpoint
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
--> statement-breakpoint
INSERT INTO `repair_orders_search` (`rowid`, `number`, `customer_name`, `customer_phone`, `phone_digits`, `plate`, `vin`)
SELECT
	`repair_orders`.`id`, `number`, `customer_name`, `customer_phone`,
	replace(replace(replace(replace(replace(replace(`customer_phone`, ' ', ''), '-', ''), '(', ''), ')', ''), '.', ''), '+', ''),
	`vehicle_plate`, `vin`
FROM `repair_orders` JOIN `vehicles` ON `vehicles`.`id` = `repair_orders`.`vehicle_id`;
