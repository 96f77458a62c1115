CREATE TABLE `attitude_modes` (
	`id` text PRIMARY KEY NOT NULL,
	`mission_id` text NOT NULL,
	`name` text NOT NULL,
	`description` text DEFAULT '' NOT NULL,
	`yaw_steering` integer DEFAULT false NOT NULL,
	`pointing` text NOT NULL,
	`created_at` text NOT NULL,
	`updated_at` text NOT NULL,
	FOREIGN KEY (`mission_id`) REFERENCES `missions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `attitude_modes_mission` ON `attitude_modes` (`mission_id`);--> statement-breakpoint
CREATE TABLE `mission_phases` (
	`id` text PRIMARY KEY NOT NULL,
	`mission_id` text NOT NULL,
	`name` text NOT NULL,
	`description` text DEFAULT '' NOT NULL,
	`start_date` text NOT NULL,
	`end_date` text NOT NULL,
	`mode_id` text NOT NULL,
	`dissipation` text NOT NULL,
	`created_at` text NOT NULL,
	`updated_at` text NOT NULL,
	FOREIGN KEY (`mission_id`) REFERENCES `missions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`mode_id`) REFERENCES `attitude_modes`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `mission_phases_mission` ON `mission_phases` (`mission_id`);