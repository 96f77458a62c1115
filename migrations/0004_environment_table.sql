CREATE TABLE `environment_table_rows` (
	`id` text PRIMARY KEY NOT NULL,
	`workspace_id` text NOT NULL,
	`position` integer NOT NULL,
	`body_id` text NOT NULL,
	`inclination_min_deg` real NOT NULL,
	`inclination_max_deg` real NOT NULL,
	`averaging_time_s` real NOT NULL,
	`hot_albedo` real NOT NULL,
	`hot_olr_wm2` real NOT NULL,
	`cold_albedo` real NOT NULL,
	`cold_olr_wm2` real NOT NULL,
	`source` text NOT NULL,
	`created_at` text NOT NULL,
	FOREIGN KEY (`workspace_id`) REFERENCES `workspaces`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `environment_table_rows_workspace` ON `environment_table_rows` (`workspace_id`,`position`);