CREATE TABLE `review` (
	`id` text PRIMARY KEY NOT NULL,
	`subject_kind` text NOT NULL,
	`subject_id` text NOT NULL,
	`role` text NOT NULL,
	`author_id` text NOT NULL,
	`provider_id` text NOT NULL,
	`stars` integer NOT NULL,
	`workmanship` integer,
	`timeliness` integer,
	`communication` integer,
	`fish_health` integer,
	`count_as_promised` integer,
	`size_as_promised` integer,
	`body` text NOT NULL,
	`subject_label` text NOT NULL,
	`helpful_count` integer DEFAULT 0 NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`edited_at` integer,
	`hidden_at` integer,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`author_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`provider_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade,
	CONSTRAINT "review_stars_range" CHECK("review"."stars" >= 1 AND "review"."stars" <= 5),
	CONSTRAINT "review_aspects_range" CHECK(("review"."workmanship" IS NULL OR ("review"."workmanship" >= 1 AND "review"."workmanship" <= 5)) AND ("review"."timeliness" IS NULL OR ("review"."timeliness" >= 1 AND "review"."timeliness" <= 5)) AND ("review"."communication" IS NULL OR ("review"."communication" >= 1 AND "review"."communication" <= 5)) AND ("review"."fish_health" IS NULL OR ("review"."fish_health" >= 1 AND "review"."fish_health" <= 5)) AND ("review"."count_as_promised" IS NULL OR ("review"."count_as_promised" >= 1 AND "review"."count_as_promised" <= 5)) AND ("review"."size_as_promised" IS NULL OR ("review"."size_as_promised" >= 1 AND "review"."size_as_promised" <= 5))),
	CONSTRAINT "review_aspects_of_role" CHECK(("review"."role" = 'builder' AND "review"."fish_health" IS NULL AND "review"."count_as_promised" IS NULL AND "review"."size_as_promised" IS NULL) OR ("review"."role" = 'hatchery' AND "review"."workmanship" IS NULL AND "review"."timeliness" IS NULL AND "review"."communication" IS NULL)),
	CONSTRAINT "review_subject_matches_role" CHECK(("review"."subject_kind" = 'job' AND "review"."role" = 'builder') OR ("review"."subject_kind" = 'reservation' AND "review"."role" = 'hatchery')),
	CONSTRAINT "review_not_own" CHECK("review"."author_id" <> "review"."provider_id"),
	CONSTRAINT "review_body_length" CHECK(length("review"."body") >= 10 AND length("review"."body") <= 2000),
	CONSTRAINT "review_helpful_count" CHECK("review"."helpful_count" >= 0)
);
--> statement-breakpoint
CREATE UNIQUE INDEX `review_subject_idx` ON `review` (`subject_kind`,`subject_id`);--> statement-breakpoint
CREATE INDEX `review_provider_idx` ON `review` (`provider_id`,`role`,`hidden_at`,`created_at`);--> statement-breakpoint
CREATE INDEX `review_author_idx` ON `review` (`author_id`);--> statement-breakpoint
CREATE TABLE `review_helpful` (
	`review_id` text NOT NULL,
	`user_id` text NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	PRIMARY KEY(`review_id`, `user_id`),
	FOREIGN KEY (`review_id`) REFERENCES `review`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `review_helpful_user_idx` ON `review_helpful` (`user_id`);--> statement-breakpoint
CREATE TABLE `review_photo` (
	`review_id` text NOT NULL,
	`image_id` text NOT NULL,
	`position` integer NOT NULL,
	PRIMARY KEY(`review_id`, `image_id`),
	FOREIGN KEY (`review_id`) REFERENCES `review`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`image_id`) REFERENCES `image`(`id`) ON UPDATE no action ON DELETE cascade,
	CONSTRAINT "review_photo_position" CHECK("review_photo"."position" >= 0 AND "review_photo"."position" < 6)
);
--> statement-breakpoint
CREATE UNIQUE INDEX `review_photo_image_idx` ON `review_photo` (`image_id`);--> statement-breakpoint
CREATE TABLE `review_reply` (
	`id` text PRIMARY KEY NOT NULL,
	`review_id` text NOT NULL,
	`author_id` text NOT NULL,
	`body` text NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`review_id`) REFERENCES `review`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`author_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade,
	CONSTRAINT "review_reply_body_length" CHECK(length("review_reply"."body") >= 10 AND length("review_reply"."body") <= 1000)
);
--> statement-breakpoint
CREATE UNIQUE INDEX `review_reply_review_idx` ON `review_reply` (`review_id`);--> statement-breakpoint
CREATE TABLE `review_report` (
	`id` text PRIMARY KEY NOT NULL,
	`review_id` text NOT NULL,
	`reporter_id` text NOT NULL,
	`reason` text NOT NULL,
	`details` text,
	`state` text DEFAULT 'open' NOT NULL,
	`decision` text,
	`decision_note` text,
	`decided_by` text,
	`decided_at` integer,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`review_id`) REFERENCES `review`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`reporter_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`decided_by`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null,
	CONSTRAINT "review_report_reason" CHECK("review_report"."reason" IN ('abusive', 'false', 'private_info', 'spam', 'other')),
	CONSTRAINT "review_report_decided" CHECK(("review_report"."state" = 'open' AND "review_report"."decision" IS NULL) OR ("review_report"."state" <> 'open' AND "review_report"."decision" IS NOT NULL AND "review_report"."decided_at" IS NOT NULL))
);
--> statement-breakpoint
CREATE UNIQUE INDEX `review_report_reporter_idx` ON `review_report` (`review_id`,`reporter_id`);--> statement-breakpoint
CREATE INDEX `review_report_state_idx` ON `review_report` (`state`,`created_at`);--> statement-breakpoint
CREATE TABLE `review_revision` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`review_id` text NOT NULL,
	`version` integer NOT NULL,
	`stars` integer NOT NULL,
	`aspects` text NOT NULL,
	`body` text NOT NULL,
	`photo_ids` text NOT NULL,
	`written_at` integer NOT NULL,
	`replaced_at` integer NOT NULL,
	FOREIGN KEY (`review_id`) REFERENCES `review`(`id`) ON UPDATE no action ON DELETE cascade,
	CONSTRAINT "review_revision_stars_range" CHECK("review_revision"."stars" >= 1 AND "review_revision"."stars" <= 5)
);
--> statement-breakpoint
CREATE UNIQUE INDEX `review_revision_version_idx` ON `review_revision` (`review_id`,`version`);--> statement-breakpoint
ALTER TABLE `listing` ADD `trust_is_new` integer DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE `listing` ADD `trust_rating` real;--> statement-breakpoint
ALTER TABLE `listing` ADD `trust_reviews` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `listing` ADD `trust_jobs_completed` integer DEFAULT 0 NOT NULL;