-- Databases made before parts.available existed: fill it from the bins once.
UPDATE `parts` SET `available` = COALESCE((SELECT SUM(`on_hand` - `reserved`) FROM `stock` WHERE `stock`.`part_id` = `parts`.`id`), 0);
