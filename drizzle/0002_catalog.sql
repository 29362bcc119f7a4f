CREATE TABLE `analyses` (
	`id` text PRIMARY KEY NOT NULL,
	`agency_id` text NOT NULL,
	`name` text NOT NULL,
	`created_by` text,
	`input` text NOT NULL,
	`result` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`agency_id`) REFERENCES `agencies`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `analyses_agency` ON `analyses` (`agency_id`);--> statement-breakpoint
CREATE TABLE `mixes` (
	`id` text PRIMARY KEY NOT NULL,
	`agency_id` text NOT NULL,
	`name` text NOT NULL,
	`binder_grade` text NOT NULL,
	`modifier` text NOT NULL,
	`price_per_ton` real NOT NULL,
	`spread_rate_lb_per_sy_in` real NOT NULL,
	`min_lift_in` real NOT NULL,
	`max_lift_in` real NOT NULL,
	`ref_lift_in` real NOT NULL,
	`ref_life_years` real NOT NULL,
	`cold_weather_note` text,
	`price_effective_date` text NOT NULL,
	`is_demo` integer DEFAULT false NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`agency_id`) REFERENCES `agencies`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `mixes_agency` ON `mixes` (`agency_id`);--> statement-breakpoint
CREATE TABLE `price_history` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`agency_id` text NOT NULL,
	`entity` text NOT NULL,
	`entity_id` text NOT NULL,
	`name` text NOT NULL,
	`field` text NOT NULL,
	`before` text,
	`after` text,
	`effective_date` text NOT NULL,
	`user_id` text,
	`at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`agency_id`) REFERENCES `agencies`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `price_history_agency` ON `price_history` (`agency_id`,`at`);--> statement-breakpoint
CREATE TABLE `treatments` (
	`id` text PRIMARY KEY NOT NULL,
	`agency_id` text NOT NULL,
	`name` text NOT NULL,
	`category` text NOT NULL,
	`kind` text NOT NULL,
	`mix_id` text,
	`default_thickness_in` real,
	`mill_depth_in` real DEFAULT 0 NOT NULL,
	`life_years` real,
	`production_sy_per_day` real NOT NULL,
	`cost_items` text NOT NULL,
	`effect` text NOT NULL,
	`applicability` text NOT NULL,
	`price_effective_date` text NOT NULL,
	`is_demo` integer DEFAULT false NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`agency_id`) REFERENCES `agencies`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`mix_id`) REFERENCES `mixes`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `treatments_agency` ON `treatments` (`agency_id`);--> statement-breakpoint
ALTER TABLE `agencies` ADD `mobilization_per_job` real DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `agencies` ADD `traffic_control_per_day` real DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `agencies` ADD `engineering_fraction` real DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `agencies` ADD `contingency_fraction` real DEFAULT 0 NOT NULL;