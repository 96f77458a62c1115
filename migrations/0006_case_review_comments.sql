CREATE TABLE `case_comments` (
	`id` text PRIMARY KEY NOT NULL,
	`case_id` text NOT NULL,
	`series_id` text NOT NULL,
	`revision` integer NOT NULL,
	`kind` text NOT NULL,
	`text` text NOT NULL,
	`author_id` text,
	`created_at` text NOT NULL,
	FOREIGN KEY (`case_id`) REFERENCES `load_cases`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `case_comments_series` ON `case_comments` (`series_id`);