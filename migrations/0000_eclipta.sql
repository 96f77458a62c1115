CREATE TABLE `api_tokens` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`name` text NOT NULL,
	`token_hash` text NOT NULL,
	`prefix` text NOT NULL,
	`read_only` integer DEFAULT false NOT NULL,
	`created_at` text NOT NULL,
	`expires_at` text,
	`last_used_at` text,
	`revoked_at` text,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `api_tokens_token_hash_unique` ON `api_tokens` (`token_hash`);--> statement-breakpoint
CREATE INDEX `api_tokens_user` ON `api_tokens` (`user_id`);--> statement-breakpoint
CREATE TABLE `audit_events` (
	`id` text PRIMARY KEY NOT NULL,
	`workspace_id` text,
	`actor_user_id` text,
	`action` text NOT NULL,
	`target_type` text NOT NULL,
	`target_id` text,
	`summary` text NOT NULL,
	`at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`workspace_id`) REFERENCES `workspaces`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `audit_events_workspace_at` ON `audit_events` (`workspace_id`,`at`);--> statement-breakpoint
CREATE TABLE `invitations` (
	`id` text PRIMARY KEY NOT NULL,
	`workspace_id` text NOT NULL,
	`email` text NOT NULL,
	`role` text NOT NULL,
	`token_hash` text NOT NULL,
	`invited_by` text,
	`created_at` text NOT NULL,
	`expires_at` text NOT NULL,
	`accepted_at` text,
	FOREIGN KEY (`workspace_id`) REFERENCES `workspaces`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`invited_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `invitations_token_hash_unique` ON `invitations` (`token_hash`);--> statement-breakpoint
CREATE INDEX `invitations_workspace` ON `invitations` (`workspace_id`);--> statement-breakpoint
CREATE TABLE `memberships` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`workspace_id` text NOT NULL,
	`role` text NOT NULL,
	`created_at` text NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`workspace_id`) REFERENCES `workspaces`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `memberships_user_workspace` ON `memberships` (`user_id`,`workspace_id`);--> statement-breakpoint
CREATE INDEX `memberships_workspace` ON `memberships` (`workspace_id`);--> statement-breakpoint
CREATE TABLE `password_resets` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`token_hash` text NOT NULL,
	`created_at` text NOT NULL,
	`expires_at` text NOT NULL,
	`used_at` text,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `password_resets_token_hash_unique` ON `password_resets` (`token_hash`);--> statement-breakpoint
CREATE TABLE `users` (
	`id` text PRIMARY KEY NOT NULL,
	`email` text NOT NULL,
	`name` text NOT NULL,
	`password_hash` text NOT NULL,
	`is_admin` integer DEFAULT false NOT NULL,
	`password_changed_at` text,
	`created_at` text NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `users_email_unique` ON `users` (`email`);--> statement-breakpoint
CREATE TABLE `workspaces` (
	`id` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`created_at` text NOT NULL
);
--> statement-breakpoint
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
CREATE INDEX `surfaces_mission` ON `surfaces` (`mission_id`);--> statement-breakpoint
CREATE TABLE `ephemerides` (
	`id` text PRIMARY KEY NOT NULL,
	`mission_id` text NOT NULL,
	`name` text NOT NULL,
	`frame` text NOT NULL,
	`format` text NOT NULL,
	`rows` integer NOT NULL,
	`start_epoch` text NOT NULL,
	`end_epoch` text NOT NULL,
	`step_s` real NOT NULL,
	`min_altitude_km` real NOT NULL,
	`max_altitude_km` real NOT NULL,
	`has_velocity` integer NOT NULL,
	`sha256` text NOT NULL,
	`file_name` text NOT NULL,
	`created_by` text,
	`created_at` text NOT NULL,
	FOREIGN KEY (`mission_id`) REFERENCES `missions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `ephemerides_mission` ON `ephemerides` (`mission_id`);--> statement-breakpoint
CREATE TABLE `ephemeris_points` (
	`ephemeris_id` text NOT NULL,
	`seq` integer NOT NULL,
	`t_ms` real NOT NULL,
	`x_km` real NOT NULL,
	`y_km` real NOT NULL,
	`z_km` real NOT NULL,
	`vx_km_s` real,
	`vy_km_s` real,
	`vz_km_s` real,
	PRIMARY KEY(`ephemeris_id`, `seq`),
	FOREIGN KEY (`ephemeris_id`) REFERENCES `ephemerides`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `case_subscriptions` (
	`id` text PRIMARY KEY NOT NULL,
	`case_series_id` text NOT NULL,
	`user_id` text NOT NULL,
	`created_at` text NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `case_subscriptions_series_user` ON `case_subscriptions` (`case_series_id`,`user_id`);--> statement-breakpoint
CREATE TABLE `load_cases` (
	`id` text PRIMARY KEY NOT NULL,
	`mission_id` text NOT NULL,
	`workspace_id` text NOT NULL,
	`series_id` text NOT NULL,
	`revision` integer NOT NULL,
	`name` text NOT NULL,
	`kind` text NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`inputs` text NOT NULL,
	`results` text NOT NULL,
	`checksum` text,
	`author_id` text,
	`submitted_by` text,
	`submitted_at` text,
	`released_by` text,
	`released_at` text,
	`created_at` text NOT NULL,
	`updated_at` text NOT NULL,
	FOREIGN KEY (`mission_id`) REFERENCES `missions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`workspace_id`) REFERENCES `workspaces`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`submitted_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`released_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `load_cases_mission` ON `load_cases` (`mission_id`);--> statement-breakpoint
CREATE INDEX `load_cases_workspace` ON `load_cases` (`workspace_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `load_cases_series_revision` ON `load_cases` (`series_id`,`revision`);--> statement-breakpoint
CREATE TABLE `thermal_models` (
	`id` text PRIMARY KEY NOT NULL,
	`mission_id` text NOT NULL,
	`workspace_id` text NOT NULL,
	`name` text NOT NULL,
	`description` text DEFAULT '' NOT NULL,
	`model` text NOT NULL,
	`created_by` text,
	`created_at` text NOT NULL,
	`updated_at` text NOT NULL,
	FOREIGN KEY (`mission_id`) REFERENCES `missions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`workspace_id`) REFERENCES `workspaces`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `thermal_models_mission` ON `thermal_models` (`mission_id`);--> statement-breakpoint
CREATE TABLE `thermal_runs` (
	`id` text PRIMARY KEY NOT NULL,
	`model_id` text NOT NULL,
	`case_id` text NOT NULL,
	`pass` integer NOT NULL,
	`model_updated_at` text NOT NULL,
	`result` text NOT NULL,
	`ran_by` text,
	`ran_at` text NOT NULL,
	FOREIGN KEY (`model_id`) REFERENCES `thermal_models`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`case_id`) REFERENCES `load_cases`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`ran_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `thermal_runs_model_case` ON `thermal_runs` (`model_id`,`case_id`);