CREATE TABLE `plan_versions` (
	`id` text PRIMARY KEY NOT NULL,
	`plan_id` text NOT NULL,
	`agency_id` text NOT NULL,
	`version` integer NOT NULL,
	`name` text NOT NULL,
	`settings` text NOT NULL,
	`run_id` text NOT NULL,
	`brief` blob,
	`published_by` text,
	`published_at` text NOT NULL,
	FOREIGN KEY (`plan_id`) REFERENCES `plans`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`agency_id`) REFERENCES `agencies`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`published_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `plan_versions_number` ON `plan_versions` (`plan_id`,`version`);--> statement-breakpoint
CREATE INDEX `plan_versions_agency` ON `plan_versions` (`agency_id`);--> statement-breakpoint
ALTER TABLE `plans` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `plans` ADD `published_version_id` text;