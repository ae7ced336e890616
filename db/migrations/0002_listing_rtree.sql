-- R*Tree index over each listing's public point, for the nearby search. SQLite's
-- R*Tree stores 32-bit floats rounded outward, so a box query never misses a point.
-- Auxiliary columns carry what the search filters and orders on, so a query needs no
-- join: the point as a unit vector (x, y, z) for a chord distance computed in SQL, the
-- exact coordinates (the box columns are rounded to 32-bit floats), the kind (1 hatchery, 2 builder), the verified flag, the bit sets and the trust score.
CREATE VIRTUAL TABLE `listing_rtree` USING rtree(`id`, `min_lat`, `max_lat`, `min_lng`, `max_lng`, +`x`, +`y`, +`z`, +`kind`, +`verified`, +`species_mask`, +`tank_type_mask`, +`trust`, +`user_id`, +`lat`, +`lng`);
--> statement-breakpoint
INSERT INTO `listing_rtree` SELECT `id`, `lat`, `lat`, `lng`, `lng`,
  cos(radians(`lat`)) * cos(radians(`lng`)), cos(radians(`lat`)) * sin(radians(`lng`)), sin(radians(`lat`)),
  CASE `kind` WHEN 'hatchery' THEN 1 ELSE 2 END, `verified`, `species_mask`, `tank_type_mask`, `trust_score`, `user_id`, `lat`, `lng` FROM `listing`;
--> statement-breakpoint
CREATE TRIGGER `listing_rtree_insert` AFTER INSERT ON `listing` BEGIN
  INSERT INTO `listing_rtree` VALUES (NEW.`id`, NEW.`lat`, NEW.`lat`, NEW.`lng`, NEW.`lng`,
    cos(radians(NEW.`lat`)) * cos(radians(NEW.`lng`)), cos(radians(NEW.`lat`)) * sin(radians(NEW.`lng`)), sin(radians(NEW.`lat`)),
    CASE NEW.`kind` WHEN 'hatchery' THEN 1 ELSE 2 END, NEW.`verified`, NEW.`species_mask`, NEW.`tank_type_mask`, NEW.`trust_score`, NEW.`user_id`, NEW.`lat`, NEW.`lng`);
END;
--> statement-breakpoint
CREATE TRIGGER `listing_rtree_update` AFTER UPDATE ON `listing` BEGIN
  UPDATE `listing_rtree` SET `min_lat` = NEW.`lat`, `max_lat` = NEW.`lat`, `min_lng` = NEW.`lng`, `max_lng` = NEW.`lng`,
    `x` = cos(radians(NEW.`lat`)) * cos(radians(NEW.`lng`)), `y` = cos(radians(NEW.`lat`)) * sin(radians(NEW.`lng`)), `z` = sin(radians(NEW.`lat`)),
    `kind` = CASE NEW.`kind` WHEN 'hatchery' THEN 1 ELSE 2 END, `verified` = NEW.`verified`, `species_mask` = NEW.`species_mask`,
    `tank_type_mask` = NEW.`tank_type_mask`, `trust` = NEW.`trust_score`, `user_id` = NEW.`user_id`, `lat` = NEW.`lat`, `lng` = NEW.`lng`
  WHERE `id` = NEW.`id`;
END;
--> statement-breakpoint
CREATE TRIGGER `listing_rtree_delete` AFTER DELETE ON `listing` BEGIN
  DELETE FROM `listing_rtree` WHERE `id` = OLD.`id`;
END;
