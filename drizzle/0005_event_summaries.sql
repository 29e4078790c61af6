ALTER TABLE `events` ADD `summary` text;--> statement-breakpoint
ALTER TABLE `events` ADD `summary_engine_version` text;