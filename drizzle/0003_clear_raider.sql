CREATE TABLE `checkout_sessions` (
	`id` text PRIMARY KEY NOT NULL,
	`order_id` text NOT NULL,
	`amount` real NOT NULL,
	`currency` text NOT NULL,
	`url` text NOT NULL,
	`status` text DEFAULT 'open' NOT NULL,
	`created_at` integer NOT NULL,
	`expires_at` integer NOT NULL,
	`completed_at` integer,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `checkout_sessions_order_idx` ON `checkout_sessions` (`order_id`);--> statement-breakpoint
PRAGMA foreign_keys=OFF;--> statement-breakpoint
CREATE TABLE `__new_payments` (
	`id` text PRIMARY KEY NOT NULL,
	`order_id` text NOT NULL,
	`amount` real,
	`currency` text,
	`reference` text NOT NULL,
	`source` text DEFAULT 'manual' NOT NULL,
	`event_id` text,
	`is_exception` integer DEFAULT false NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`recorded_by` text,
	`recorded_at` integer NOT NULL,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
INSERT INTO `__new_payments`("id", "order_id", "amount", "reference", "is_exception", "note", "recorded_by", "recorded_at") SELECT "id", "order_id", "amount", "reference", "is_exception", "note", "recorded_by", "recorded_at" FROM `payments`;--> statement-breakpoint
DROP TABLE `payments`;--> statement-breakpoint
ALTER TABLE `__new_payments` RENAME TO `payments`;--> statement-breakpoint
PRAGMA foreign_keys=ON;--> statement-breakpoint
CREATE UNIQUE INDEX `payments_event_id_unique` ON `payments` (`event_id`);--> statement-breakpoint
CREATE INDEX `payments_order_idx` ON `payments` (`order_id`);--> statement-breakpoint
ALTER TABLE `orders` ADD `price_total` real;--> statement-breakpoint
ALTER TABLE `orders` ADD `currency` text;--> statement-breakpoint
ALTER TABLE `proofs` ADD `approved_by_name` text;--> statement-breakpoint
ALTER TABLE `proofs` ADD `changes_requested_at` integer;--> statement-breakpoint
ALTER TABLE `proofs` ADD `changes_comment` text;--> statement-breakpoint
ALTER TABLE `attachments` ADD `shareable` integer DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `attachments` ADD `shared_by` text;--> statement-breakpoint
ALTER TABLE `attachments` ADD `shared_at` integer;--> statement-breakpoint
ALTER TABLE `share_links` ADD `expires_at` integer;