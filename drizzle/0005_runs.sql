CREATE TABLE `runs` (
	`id` text PRIMARY KEY NOT NULL,
	`agency_id` text NOT NULL,
	`user_id` text,
	`kind` text NOT NULL,
	`subject_id` text,
	`status` text NOT NULL,
	`progress` real DEFAULT 0 NOT NULL,
	`input` blob NOT NULL,
	`result` blob,
	`error` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`started_at` text,
	`ended_at` text,
	FOREIGN KEY (`agency_id`) REFERENCES `agencies`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `runs_subject` ON `runs` (`agency_id`,`kind`,`subject_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `runs_status` ON `runs` (`status`);