CREATE TABLE `event_plans` (
	`event_id` integer NOT NULL,
	`plan_id` integer NOT NULL,
	`position` integer NOT NULL,
	PRIMARY KEY(`event_id`, `plan_id`),
	FOREIGN KEY (`event_id`) REFERENCES `events`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`plan_id`) REFERENCES `plans`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `event_plans_plan_id_idx` ON `event_plans` (`plan_id`);--> statement-breakpoint
CREATE TABLE `event_share_links` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`event_id` integer NOT NULL,
	`token_hash` text NOT NULL,
	`label` text DEFAULT '' NOT NULL,
	`created_by_user_id` integer,
	`created_at_ms` integer NOT NULL,
	`expires_at_ms` integer,
	`revoked_at_ms` integer,
	FOREIGN KEY (`event_id`) REFERENCES `events`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `event_share_links_token_hash_unique` ON `event_share_links` (`token_hash`);--> statement-breakpoint
CREATE INDEX `event_share_links_event_id_idx` ON `event_share_links` (`event_id`);--> statement-breakpoint
CREATE TABLE `events` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`name` text NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_by_user_id` integer,
	`updated_by_user_id` integer,
	`created_at_ms` integer NOT NULL,
	`updated_at_ms` integer NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`date` text NOT NULL,
	`pool` text NOT NULL,
	`chargers` text NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`updated_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	CONSTRAINT "events_date_check" CHECK("events"."date" glob '[0-9][0-9][0-9][0-9]-[0-9][0-9]-[0-9][0-9]')
);
--> statement-breakpoint
CREATE INDEX `events_team_name_idx` ON `events` (`team_id`,`name`);