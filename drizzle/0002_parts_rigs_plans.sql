CREATE TABLE `accessories` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`name` text NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_by_user_id` integer,
	`updated_by_user_id` integer,
	`created_at_ms` integer NOT NULL,
	`updated_at_ms` integer NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`spec` text NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`updated_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `accessories_team_name_idx` ON `accessories` (`team_id`,`name`);--> statement-breakpoint
CREATE TABLE `amplifiers` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`name` text NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_by_user_id` integer,
	`updated_by_user_id` integer,
	`created_at_ms` integer NOT NULL,
	`updated_at_ms` integer NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`spec` text NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`updated_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `amplifiers_team_name_idx` ON `amplifiers` (`team_id`,`name`);--> statement-breakpoint
CREATE TABLE `discharge_logs` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`pack_id` integer NOT NULL,
	`team_id` integer NOT NULL,
	`file_name` text NOT NULL,
	`uploaded_by_user_id` integer,
	`created_at_ms` integer NOT NULL,
	`analysis` text NOT NULL,
	`points` text NOT NULL,
	`accepted_at_ms` integer,
	FOREIGN KEY (`pack_id`) REFERENCES `packs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`uploaded_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `discharge_logs_pack_id_idx` ON `discharge_logs` (`pack_id`);--> statement-breakpoint
CREATE INDEX `discharge_logs_team_id_idx` ON `discharge_logs` (`team_id`);--> statement-breakpoint
CREATE TABLE `packs` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`name` text NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_by_user_id` integer,
	`updated_by_user_id` integer,
	`created_at_ms` integer NOT NULL,
	`updated_at_ms` integer NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`spec` text NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`updated_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `packs_team_name_idx` ON `packs` (`team_id`,`name`);--> statement-breakpoint
CREATE TABLE `plans` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`name` text NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_by_user_id` integer,
	`updated_by_user_id` integer,
	`created_at_ms` integer NOT NULL,
	`updated_at_ms` integer NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`rig_id` integer NOT NULL,
	`date` text NOT NULL,
	`start_time` text NOT NULL,
	`temperature_c` real,
	`pack_count` integer,
	`swap_policy` text,
	`schedule` text NOT NULL,
	`summary` text,
	`summary_engine_version` text,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`updated_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`rig_id`) REFERENCES `rigs`(`id`) ON UPDATE no action ON DELETE restrict,
	CONSTRAINT "plans_date_check" CHECK("plans"."date" glob '[0-9][0-9][0-9][0-9]-[0-9][0-9]-[0-9][0-9]'),
	CONSTRAINT "plans_start_time_check" CHECK("plans"."start_time" glob '[0-2][0-9]:[0-5][0-9]')
);
--> statement-breakpoint
CREATE INDEX `plans_team_name_idx` ON `plans` (`team_id`,`name`);--> statement-breakpoint
CREATE INDEX `plans_rig_id_idx` ON `plans` (`rig_id`);--> statement-breakpoint
CREATE TABLE `rig_accessories` (
	`rig_id` integer NOT NULL,
	`accessory_id` integer NOT NULL,
	`position` integer NOT NULL,
	PRIMARY KEY(`rig_id`, `accessory_id`),
	FOREIGN KEY (`rig_id`) REFERENCES `rigs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`accessory_id`) REFERENCES `accessories`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `rig_accessories_accessory_id_idx` ON `rig_accessories` (`accessory_id`);--> statement-breakpoint
CREATE TABLE `rigs` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`name` text NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_by_user_id` integer,
	`updated_by_user_id` integer,
	`created_at_ms` integer NOT NULL,
	`updated_at_ms` integer NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`spec` text NOT NULL,
	`spec_schema_version` integer NOT NULL,
	`summary` text,
	`summary_engine_version` text,
	`pack_id` integer,
	`amplifier_id` integer,
	`speakers_id` integer,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`updated_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`pack_id`) REFERENCES `packs`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`amplifier_id`) REFERENCES `amplifiers`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`speakers_id`) REFERENCES `speakers`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE INDEX `rigs_team_name_idx` ON `rigs` (`team_id`,`name`);--> statement-breakpoint
CREATE INDEX `rigs_pack_id_idx` ON `rigs` (`pack_id`);--> statement-breakpoint
CREATE INDEX `rigs_amplifier_id_idx` ON `rigs` (`amplifier_id`);--> statement-breakpoint
CREATE INDEX `rigs_speakers_id_idx` ON `rigs` (`speakers_id`);--> statement-breakpoint
CREATE TABLE `share_links` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`plan_id` integer NOT NULL,
	`token_hash` text NOT NULL,
	`label` text DEFAULT '' NOT NULL,
	`created_by_user_id` integer,
	`created_at_ms` integer NOT NULL,
	`expires_at_ms` integer,
	`revoked_at_ms` integer,
	FOREIGN KEY (`plan_id`) REFERENCES `plans`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `share_links_token_hash_unique` ON `share_links` (`token_hash`);--> statement-breakpoint
CREATE INDEX `share_links_plan_id_idx` ON `share_links` (`plan_id`);--> statement-breakpoint
CREATE TABLE `speakers` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`team_id` integer NOT NULL,
	`name` text NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_by_user_id` integer,
	`updated_by_user_id` integer,
	`created_at_ms` integer NOT NULL,
	`updated_at_ms` integer NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`spec` text NOT NULL,
	FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`updated_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `speakers_team_name_idx` ON `speakers` (`team_id`,`name`);