CREATE TABLE `ephemeris_point_blocks` (
	`ephemeris_id` text NOT NULL,
	`block` integer NOT NULL,
	`first_seq` integer NOT NULL,
	`points` integer NOT NULL,
	`data` blob NOT NULL,
	PRIMARY KEY(`ephemeris_id`, `block`),
	FOREIGN KEY (`ephemeris_id`) REFERENCES `ephemerides`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
-- Points stored before blocks move into them, 4,096 a block (BLOCK_POINTS); seq is 0.. in each
-- ephemeris. eclipta_pack_points is the aggregate every connection registers (point-blocks.ts).
INSERT INTO `ephemeris_point_blocks` (`ephemeris_id`, `block`, `first_seq`, `points`, `data`)
SELECT `ephemeris_id`, `seq` / 4096, min(`seq`), count(*),
  eclipta_pack_points(`t_ms`, `x_km`, `y_km`, `z_km`, `vx_km_s`, `vy_km_s`, `vz_km_s` ORDER BY `seq`)
FROM `ephemeris_points` GROUP BY `ephemeris_id`, `seq` / 4096;
--> statement-breakpoint
DROP TABLE `ephemeris_points`;