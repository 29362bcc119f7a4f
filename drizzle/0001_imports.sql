CREATE TABLE `import_mappings` (
	`agency_id` text NOT NULL,
	`kind` text NOT NULL,
	`mapping` text NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`agency_id`) REFERENCES `agencies`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `import_mappings_agency_kind` ON `import_mappings` (`agency_id`,`kind`);--> statement-breakpoint
CREATE TABLE `imports` (
	`id` text PRIMARY KEY NOT NULL,
	`agency_id` text NOT NULL,
	`user_id` text,
	`file_name` text NOT NULL,
	`kind` text NOT NULL,
	`format` text NOT NULL,
	`mode` text NOT NULL,
	`added` integer NOT NULL,
	`updated` integer NOT NULL,
	`unchanged` integer NOT NULL,
	`rejected` integer NOT NULL,
	`rejected_csv` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`agency_id`) REFERENCES `agencies`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `imports_agency` ON `imports` (`agency_id`,`created_at`);