INSERT INTO `pending_upgrades` (`name`) VALUES ('concerns-from-findings');
