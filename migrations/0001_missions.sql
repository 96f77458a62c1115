CREATE TABLE `materials` (
	`id` text PRIMARY KEY NOT NULL,
	`workspace_id` text,
	`name` text NOT NULL,
	`absorptivity_bol` real NOT NULL,
	`emissivity_bol` real NOT NULL,
	`absorptivity_eol` real NOT NULL,
	`emissivity_eol` real NOT NULL,
	`source` text NOT NULL,
	`created_at` text NOT NULL,
	FOREIGN KEY (`workspace_id`) REFERENCES `workspaces`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `materials_workspace` ON `materials` (`workspace_id`);--> statement-breakpoint
CREATE TABLE `missions` (
	`id` text PRIMARY KEY NOT NULL,
	`workspace_id` text NOT NULL,
	`name` text NOT NULL,
	`body_id` text NOT NULL,
	`description` text DEFAULT '' NOT NULL,
	`start_date` text NOT NULL,
	`end_date` text NOT NULL,
	`crewed` integer DEFAULT false NOT NULL,
	`archived_at` text,
	`created_by` text,
	`created_at` text NOT NULL,
	`updated_at` text NOT NULL,
	FOREIGN KEY (`workspace_id`) REFERENCES `workspaces`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `missions_workspace` ON `missions` (`workspace_id`);--> statement-breakpoint
CREATE TABLE `orbits` (
	`id` text PRIMARY KEY NOT NULL,
	`mission_id` text NOT NULL,
	`name` text NOT NULL,
	`definition` text NOT NULL,
	`input` text NOT NULL,
	`epoch` text NOT NULL,
	`periapsis_altitude_km` real NOT NULL,
	`apoapsis_altitude_km` real NOT NULL,
	`semi_major_axis_km` real NOT NULL,
	`eccentricity` real NOT NULL,
	`period_s` real NOT NULL,
	`inclination_deg` real NOT NULL,
	`raan_deg` real NOT NULL,
	`arg_periapsis_deg` real NOT NULL,
	`created_at` text NOT NULL,
	`updated_at` text NOT NULL,
	FOREIGN KEY (`mission_id`) REFERENCES `missions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `orbits_mission` ON `orbits` (`mission_id`);--> statement-breakpoint
CREATE TABLE `surfaces` (
	`id` text PRIMARY KEY NOT NULL,
	`mission_id` text NOT NULL,
	`name` text NOT NULL,
	`area_m2` real NOT NULL,
	`normal` text NOT NULL,
	`material_id` text NOT NULL,
	`created_at` text NOT NULL,
	`updated_at` text NOT NULL,
	FOREIGN KEY (`mission_id`) REFERENCES `missions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`material_id`) REFERENCES `materials`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `surfaces_mission` ON `surfaces` (`mission_id`);