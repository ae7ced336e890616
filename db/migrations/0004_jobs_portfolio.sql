CREATE TABLE `job` (
	`id` text PRIMARY KEY NOT NULL,
	`request_id` text NOT NULL,
	`quote_id` text NOT NULL,
	`quote_version` integer NOT NULL,
	`farmer_id` text NOT NULL,
	`builder_id` text NOT NULL,
	`state` text DEFAULT 'awaiting_deposit' NOT NULL,
	`currency` text NOT NULL,
	`total_minor` integer NOT NULL,
	`deposit_minor` integer NOT NULL,
	`hold_id` text,
	`on_site_at` integer,
	`built_at` integer,
	`completion_photo_count` integer,
	`resolution` text,
	`auto_confirm_at` integer,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`request_id`) REFERENCES `tank_request`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`quote_id`) REFERENCES `quote`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`farmer_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`builder_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `job_request_idx` ON `job` (`request_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `job_quote_idx` ON `job` (`quote_id`);--> statement-breakpoint
CREATE INDEX `job_builder_idx` ON `job` (`builder_id`,`state`);--> statement-breakpoint
CREATE INDEX `job_farmer_idx` ON `job` (`farmer_id`,`state`);--> statement-breakpoint
CREATE INDEX `job_auto_confirm_idx` ON `job` (`state`,`auto_confirm_at`);--> statement-breakpoint
CREATE TABLE `job_event` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`job_id` text NOT NULL,
	`event` text NOT NULL,
	`from_state` text,
	`to_state` text NOT NULL,
	`actor_id` text,
	`actor_role` text NOT NULL,
	`detail` text,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`job_id`) REFERENCES `job`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `job_event_job_idx` ON `job_event` (`job_id`,`id`);--> statement-breakpoint
CREATE TABLE `portfolio_item` (
	`id` text PRIMARY KEY NOT NULL,
	`builder_id` text NOT NULL,
	`job_id` text,
	`tank_type` text NOT NULL,
	`shape` text NOT NULL,
	`length_m` real,
	`width_m` real,
	`diameter_m` real,
	`depth_m` real NOT NULL,
	`size_unit` text DEFAULT 'm' NOT NULL,
	`place_name` text NOT NULL,
	`approx_lat` real NOT NULL,
	`approx_lng` real NOT NULL,
	`completed_on` integer NOT NULL,
	`caption` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`builder_id`) REFERENCES `builder`(`user_id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`job_id`) REFERENCES `job`(`id`) ON UPDATE no action ON DELETE no action,
	CONSTRAINT "portfolio_size_check" CHECK(("portfolio_item"."shape" = 'rectangular' AND "portfolio_item"."length_m" > 0 AND "portfolio_item"."width_m" > 0 AND "portfolio_item"."diameter_m" IS NULL) OR ("portfolio_item"."shape" = 'round' AND "portfolio_item"."diameter_m" > 0 AND "portfolio_item"."length_m" IS NULL AND "portfolio_item"."width_m" IS NULL))
);
--> statement-breakpoint
CREATE INDEX `portfolio_builder_idx` ON `portfolio_item` (`builder_id`,`completed_on`);--> statement-breakpoint
CREATE UNIQUE INDEX `portfolio_job_idx` ON `portfolio_item` (`job_id`);--> statement-breakpoint
CREATE TABLE `quote` (
	`id` text PRIMARY KEY NOT NULL,
	`request_id` text NOT NULL,
	`builder_id` text NOT NULL,
	`state` text DEFAULT 'sent' NOT NULL,
	`current_version` integer DEFAULT 1 NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`request_id`) REFERENCES `tank_request`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`builder_id`) REFERENCES `builder`(`user_id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `quote_request_builder_idx` ON `quote` (`request_id`,`builder_id`);--> statement-breakpoint
CREATE INDEX `quote_builder_idx` ON `quote` (`builder_id`,`state`);--> statement-breakpoint
CREATE TABLE `quote_line` (
	`quote_id` text NOT NULL,
	`version` integer NOT NULL,
	`position` integer NOT NULL,
	`kind` text NOT NULL,
	`description` text NOT NULL,
	`quantity` real NOT NULL,
	`unit_price_minor` integer NOT NULL,
	`total_minor` integer NOT NULL,
	`included` integer NOT NULL,
	PRIMARY KEY(`quote_id`, `version`, `position`),
	FOREIGN KEY (`quote_id`,`version`) REFERENCES `quote_version`(`quote_id`,`version`) ON UPDATE no action ON DELETE cascade,
	CONSTRAINT "quote_line_kind_check" CHECK("quote_line"."kind" IN ('materials', 'labour', 'travel', 'other'))
);
--> statement-breakpoint
CREATE TABLE `quote_version` (
	`quote_id` text NOT NULL,
	`version` integer NOT NULL,
	`currency` text NOT NULL,
	`farmer_supplies_materials` integer NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`travel_distance_m` integer NOT NULL,
	`travel_rate_per_km_minor` integer NOT NULL,
	`base_fee_minor` integer NOT NULL,
	`subtotal_minor` integer NOT NULL,
	`total_minor` integer NOT NULL,
	`deposit_minor` integer NOT NULL,
	`excluded_materials_minor` integer NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	PRIMARY KEY(`quote_id`, `version`),
	FOREIGN KEY (`quote_id`) REFERENCES `quote`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `tank_request` (
	`id` text PRIMARY KEY NOT NULL,
	`farmer_id` text NOT NULL,
	`tank_type` text NOT NULL,
	`shape` text NOT NULL,
	`length_m` real,
	`width_m` real,
	`diameter_m` real,
	`depth_m` real NOT NULL,
	`size_unit` text DEFAULT 'm' NOT NULL,
	`site_lat` real NOT NULL,
	`site_lng` real NOT NULL,
	`readiness` text NOT NULL,
	`water_source` text NOT NULL,
	`power` text NOT NULL,
	`wanted_by` integer NOT NULL,
	`plan_id` text,
	`notes` text DEFAULT '' NOT NULL,
	`state` text DEFAULT 'open' NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`farmer_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`plan_id`) REFERENCES `plan`(`id`) ON UPDATE no action ON DELETE set null,
	CONSTRAINT "tank_request_size_check" CHECK(("tank_request"."shape" = 'rectangular' AND "tank_request"."length_m" > 0 AND "tank_request"."width_m" > 0 AND "tank_request"."diameter_m" IS NULL) OR ("tank_request"."shape" = 'round' AND "tank_request"."diameter_m" > 0 AND "tank_request"."length_m" IS NULL AND "tank_request"."width_m" IS NULL))
);
--> statement-breakpoint
CREATE INDEX `tank_request_farmer_idx` ON `tank_request` (`farmer_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `tank_request_open_lat_idx` ON `tank_request` (`state`,`site_lat`);--> statement-breakpoint
CREATE TABLE `upload_completion` (
	`upload_id` text PRIMARY KEY NOT NULL,
	`owner_id` text NOT NULL,
	`image_id` text,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`owner_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
ALTER TABLE `image` ADD `subject_id` text;--> statement-breakpoint
CREATE INDEX `image_kind_subject_idx` ON `image` (`kind`,`subject_id`);