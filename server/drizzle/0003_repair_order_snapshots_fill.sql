-- Each repair order now keeps the customer and vehicle as written. Rows written before this kept
-- only links, so they take the details on file now: the best record there is of them.
UPDATE `repair_orders` SET
	`customer_name` = (SELECT `name` FROM `customers` WHERE `customers`.`id` = `repair_orders`.`customer_id`),
	`customer_phone` = (SELECT `phone` FROM `customers` WHERE `customers`.`id` = `repair_orders`.`customer_id`),
	`customer_email` = (SELECT `email` FROM `customers` WHERE `customers`.`id` = `repair_orders`.`customer_id`),
	`vehicle_year` = (SELECT `year` FROM `vehicles` WHERE `vehicles`.`id` = `repair_orders`.`vehicle_id`),
	`vehicle_make` = (SELECT `make` FROM `vehicles` WHERE `vehicles`.`id` = `repair_orders`.`vehicle_id`),
	`vehicle_model` = (SELECT `model` FROM `vehicles` WHERE `vehicles`.`id` = `repair_orders`.`vehicle_id`),
	`vehicle_plate` = (SELECT `plate` FROM `vehicles` WHERE `vehicles`.`id` = `repair_orders`.`vehicle_id`);
