-- Each job line now carries the customer's concern. Lines written before this had only the RO's, so
-- they take it: the customer's words as the advisor wrote them.
UPDATE `job_lines` SET `concern` = (
	SELECT `concern` FROM `repair_orders` WHERE `repair_orders`.`id` = `job_lines`.`repair_order_id`
) WHERE `concern` = '';--> statement-breakpoint
-- An RO's status follows its lines by one rule: done when it has lines and none is open, open
-- otherwise, closed once picked up. Some were left open with every line done.
UPDATE `repair_orders` SET `status` = CASE
	WHEN EXISTS (
		SELECT 1 FROM `job_lines` WHERE `job_lines`.`repair_order_id` = `repair_orders`.`id`
		AND `job_lines`.`status` NOT IN ('done', 'cancelled')
	) THEN 'open'
	WHEN EXISTS (SELECT 1 FROM `job_lines` WHERE `job_lines`.`repair_order_id` = `repair_orders`.`id`) THEN 'done'
	ELSE 'open'
END WHERE `closed_at` IS NULL;
