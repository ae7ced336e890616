CREATE TABLE `api_idempotency_key` (
	`user_id` text NOT NULL,
	`scope` text NOT NULL,
	`key` text NOT NULL,
	`request_hash` text NOT NULL,
	`response_status` integer,
	`response_body` text,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`completed_at` integer,
	PRIMARY KEY(`user_id`, `scope`, `key`),
	FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `deposit_hold` (
	`id` text PRIMARY KEY NOT NULL,
	`subject_type` text NOT NULL,
	`subject_id` text NOT NULL,
	`payer_id` text NOT NULL,
	`payee_id` text NOT NULL,
	`currency` text NOT NULL,
	`amount_minor` integer NOT NULL,
	`state` text NOT NULL,
	`held_minor` integer DEFAULT 0 NOT NULL,
	`released_minor` integer DEFAULT 0 NOT NULL,
	`returned_minor` integer DEFAULT 0 NOT NULL,
	`processor` text NOT NULL,
	`processor_hold_id` text,
	`payment_method` text NOT NULL,
	`idempotency_key` text NOT NULL,
	`failure_code` text,
	`failure_message` text,
	`authorized_at` integer,
	`captured_at` integer,
	`pending_op` text,
	`version` integer DEFAULT 0 NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`payer_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`payee_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE restrict,
	CONSTRAINT "deposit_hold_amount_positive" CHECK("deposit_hold"."amount_minor" > 0),
	CONSTRAINT "deposit_hold_parts" CHECK("deposit_hold"."held_minor" >= 0 AND "deposit_hold"."released_minor" >= 0 AND "deposit_hold"."returned_minor" >= 0 AND "deposit_hold"."held_minor" + "deposit_hold"."released_minor" + "deposit_hold"."returned_minor" IN (0, "deposit_hold"."amount_minor")),
	CONSTRAINT "deposit_hold_payer_payee" CHECK("deposit_hold"."payer_id" <> "deposit_hold"."payee_id")
);
--> statement-breakpoint
CREATE UNIQUE INDEX `deposit_hold_idempotency_idx` ON `deposit_hold` (`idempotency_key`);--> statement-breakpoint
CREATE UNIQUE INDEX `deposit_hold_processor_idx` ON `deposit_hold` (`processor_hold_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `deposit_hold_live_subject_idx` ON `deposit_hold` (`subject_type`,`subject_id`) WHERE state in ('pending', 'held', 'frozen');--> statement-breakpoint
CREATE INDEX `deposit_hold_subject_idx` ON `deposit_hold` (`subject_type`,`subject_id`);--> statement-breakpoint
CREATE TABLE `hold_history` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`hold_id` text NOT NULL,
	`from_state` text,
	`to_state` text NOT NULL,
	`event` text NOT NULL,
	`actor` text NOT NULL,
	`actor_id` text,
	`at` integer NOT NULL,
	`detail` text,
	FOREIGN KEY (`hold_id`) REFERENCES `deposit_hold`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `hold_history_idx` ON `hold_history` (`hold_id`,`id`);--> statement-breakpoint
CREATE TABLE `ledger_entry` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`movement_id` text NOT NULL,
	`hold_id` text NOT NULL,
	`movement` text NOT NULL,
	`leg` integer NOT NULL,
	`account` text NOT NULL,
	`currency` text NOT NULL,
	`amount_minor` integer NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`hold_id`) REFERENCES `deposit_hold`(`id`) ON UPDATE no action ON DELETE restrict,
	CONSTRAINT "ledger_entry_amount_nonzero" CHECK("ledger_entry"."amount_minor" <> 0),
	CONSTRAINT "ledger_entry_currency_code" CHECK(length("ledger_entry"."currency") = 3 AND "ledger_entry"."currency" = upper("ledger_entry"."currency"))
);
--> statement-breakpoint
CREATE UNIQUE INDEX `ledger_entry_movement_leg_idx` ON `ledger_entry` (`movement_id`,`leg`);--> statement-breakpoint
CREATE INDEX `ledger_entry_hold_idx` ON `ledger_entry` (`hold_id`);--> statement-breakpoint
CREATE TABLE `mail_outbox` (
	`id` text PRIMARY KEY NOT NULL,
	`subject_type` text NOT NULL,
	`subject_id` text NOT NULL,
	`template` text NOT NULL,
	`context` text,
	`recipient_id` text NOT NULL,
	`dedupe_key` text NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`claimed_at` integer,
	`sent_at` integer,
	`last_error` text,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`recipient_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `mail_outbox_dedupe_idx` ON `mail_outbox` (`dedupe_key`);--> statement-breakpoint
CREATE INDEX `mail_outbox_unsent_idx` ON `mail_outbox` (`sent_at`,`created_at`);--> statement-breakpoint
CREATE TABLE `processed_webhook_event` (
	`event_id` text PRIMARY KEY NOT NULL,
	`processor` text NOT NULL,
	`type` text NOT NULL,
	`hold_id` text,
	`outcome` text NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `reservation` (
	`id` text PRIMARY KEY NOT NULL,
	`batch_id` text NOT NULL,
	`farmer_id` text NOT NULL,
	`hatchery_id` text NOT NULL,
	`state` text NOT NULL,
	`count` integer NOT NULL,
	`species` text NOT NULL,
	`mean_weight_g` real NOT NULL,
	`mean_length_cm` real NOT NULL,
	`price_per_fish_minor` integer NOT NULL,
	`currency` text NOT NULL,
	`total_minor` integer NOT NULL,
	`deposit_minor` integer NOT NULL,
	`handover_method` text NOT NULL,
	`note` text,
	`requested_at` integer NOT NULL,
	`accepted_at` integer,
	`deposit_held_at` integer,
	`handed_over_at` integer,
	`handed_over_count` integer,
	`survival_reminder_sent_at` integer,
	`survived_count` integer,
	`closed_at` integer,
	`lapse_at` integer,
	`remind_at` integer,
	`auto_release_at` integer,
	`stock_returned_at` integer,
	`quarantine_checks` text DEFAULT '{}' NOT NULL,
	`version` integer DEFAULT 0 NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`batch_id`) REFERENCES `batch`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`farmer_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`hatchery_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE restrict,
	CONSTRAINT "reservation_count_positive" CHECK("reservation"."count" > 0),
	CONSTRAINT "reservation_amounts" CHECK("reservation"."total_minor" = "reservation"."count" * "reservation"."price_per_fish_minor" AND "reservation"."deposit_minor" > 0 AND "reservation"."deposit_minor" <= "reservation"."total_minor"),
	CONSTRAINT "reservation_handed_over_range" CHECK("reservation"."handed_over_count" IS NULL OR ("reservation"."handed_over_count" >= 1 AND "reservation"."handed_over_count" <= "reservation"."count")),
	CONSTRAINT "reservation_survived_range" CHECK("reservation"."survived_count" IS NULL OR ("reservation"."survived_count" >= 0 AND "reservation"."survived_count" <= "reservation"."handed_over_count")),
	CONSTRAINT "reservation_not_own_fish" CHECK("reservation"."farmer_id" <> "reservation"."hatchery_id")
);
--> statement-breakpoint
CREATE INDEX `reservation_farmer_idx` ON `reservation` (`farmer_id`,`requested_at`);--> statement-breakpoint
CREATE INDEX `reservation_hatchery_idx` ON `reservation` (`hatchery_id`,`state`,`requested_at`);--> statement-breakpoint
CREATE INDEX `reservation_batch_idx` ON `reservation` (`batch_id`);--> statement-breakpoint
CREATE INDEX `reservation_lapse_idx` ON `reservation` (`state`,`lapse_at`);--> statement-breakpoint
CREATE INDEX `reservation_release_idx` ON `reservation` (`state`,`auto_release_at`);--> statement-breakpoint
CREATE TABLE `reservation_history` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`reservation_id` text NOT NULL,
	`from_state` text,
	`to_state` text NOT NULL,
	`event` text NOT NULL,
	`actor_id` text,
	`actor_role` text NOT NULL,
	`at` integer NOT NULL,
	`detail` text,
	FOREIGN KEY (`reservation_id`) REFERENCES `reservation`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `reservation_history_idx` ON `reservation_history` (`reservation_id`,`id`);