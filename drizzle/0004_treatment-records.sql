CREATE TABLE `treatment_records` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`agency_id` text NOT NULL,
	`segment_ref` integer NOT NULL,
	`treated_on` text NOT NULL,
	`kind` text NOT NULL,
	`name` text NOT NULL,
	`treatment_id` text,
	`mix` text,
	`thickness_in` real,
	`cost_usd` real,
	`notes` text,
	`user_id` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`agency_id`) REFERENCES `agencies`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`segment_ref`) REFERENCES `segments`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`treatment_id`) REFERENCES `treatments`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `treatment_records_segment` ON `treatment_records` (`segment_ref`,`treated_on`);