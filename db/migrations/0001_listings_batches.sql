CREATE TABLE `batch` (
	`id` text PRIMARY KEY NOT NULL,
	`hatchery_id` text NOT NULL,
	`species` text NOT NULL,
	`mean_weight_g` real NOT NULL,
	`mean_length_cm` real NOT NULL,
	`count_total` integer NOT NULL,
	`count_available` integer NOT NULL,
	`price_minor` integer NOT NULL,
	`currency` text NOT NULL,
	`ready_from` integer NOT NULL,
	`sell_by` integer NOT NULL,
	`delivery` text DEFAULT 'pickup' NOT NULL,
	`state` text DEFAULT 'open' NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`hatchery_id`) REFERENCES `hatchery`(`user_id`) ON UPDATE no action ON DELETE cascade,
	CONSTRAINT "batch_count_available_range" CHECK("batch"."count_available" >= 0 AND "batch"."count_available" <= "batch"."count_total")
);
--> statement-breakpoint
CREATE INDEX `batch_hatchery_idx` ON `batch` (`hatchery_id`,`state`,`sell_by`);--> statement-breakpoint
CREATE TABLE `listing` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` text NOT NULL,
	`kind` text NOT NULL,
	`display_name` text NOT NULL,
	`region` text NOT NULL,
	`lat` real NOT NULL,
	`lng` real NOT NULL,
	`verified` integer DEFAULT false NOT NULL,
	`species_mask` integer DEFAULT 0 NOT NULL,
	`tank_type_mask` integer DEFAULT 0 NOT NULL,
	`service_radius_km` integer DEFAULT 0 NOT NULL,
	`avatar_image_id` text,
	`trust_score` real DEFAULT 0 NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `profile`(`user_id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `listing_user_kind_idx` ON `listing` (`user_id`,`kind`);