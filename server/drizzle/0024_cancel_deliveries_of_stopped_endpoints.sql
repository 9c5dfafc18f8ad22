-- Stopping an endpoint now cancels what was still waiting for it. An endpoint stopped before this kept
-- its pending deliveries, and they would be tried again: they are cancelled the same way.
UPDATE `webhook_deliveries` SET `status` = 'cancelled', `next_attempt_at` = NULL
WHERE `status` = 'pending'
	AND `webhook_id` IN (SELECT `id` FROM `webhooks` WHERE `revoked_at` IS NOT NULL);
