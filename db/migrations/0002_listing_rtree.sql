-- R*Tree index over each listing's public point, for the bounding-box pre-filter of
-- the nearby search. SQLite's R*Tree stores 32-bit floats rounded outward, so a box
-- query never misses a point; the exact distance is computed afterwards.
CREATE VIRTUAL TABLE `listing_rtree` USING rtree(`id`, `min_lat`, `max_lat`, `min_lng`, `max_lng`);
--> statement-breakpoint
INSERT INTO `listing_rtree` (`id`, `min_lat`, `max_lat`, `min_lng`, `max_lng`) SELECT `id`, `lat`, `lat`, `lng`, `lng` FROM `listing`;
--> statement-breakpoint
CREATE TRIGGER `listing_rtree_insert` AFTER INSERT ON `listing` BEGIN
  INSERT INTO `listing_rtree` (`id`, `min_lat`, `max_lat`, `min_lng`, `max_lng`) VALUES (NEW.`id`, NEW.`lat`, NEW.`lat`, NEW.`lng`, NEW.`lng`);
END;
--> statement-breakpoint
CREATE TRIGGER `listing_rtree_update` AFTER UPDATE OF `lat`, `lng` ON `listing` BEGIN
  UPDATE `listing_rtree` SET `min_lat` = NEW.`lat`, `max_lat` = NEW.`lat`, `min_lng` = NEW.`lng`, `max_lng` = NEW.`lng` WHERE `id` = NEW.`id`;
END;
--> statement-breakpoint
CREATE TRIGGER `listing_rtree_delete` AFTER DELETE ON `listing` BEGIN
  DELETE FROM `listing_rtree` WHERE `id` = OLD.`id`;
END;
