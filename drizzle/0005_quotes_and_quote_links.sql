CREATE TABLE `quote_versions` (
	`id` text PRIMARY KEY NOT NULL,
	`quote_id` text NOT NULL,
	`version` integer NOT NULL,
	`spec` text NOT NULL,
	`quantities` text NOT NULL,
	`valid_until` text NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`currency` text NOT NULL,
	`settings` text NOT NULL,
	`pricing` text NOT NULL,
	`created_by` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`quote_id`) REFERENCES `quotes`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `quote_versions_uq` ON `quote_versions` (`quote_id`,`version`);--> statement-breakpoint
CREATE TABLE `quotes` (
	`id` text PRIMARY KEY NOT NULL,
	`number` text NOT NULL,
	`customer_id` text NOT NULL,
	`contact_name` text,
	`contact_email` text NOT NULL,
	`current_version` integer NOT NULL,
	`sent_at` integer,
	`order_id` text,
	`accepted_version` integer,
	`accepted_quantity` integer,
	`accepted_name` text,
	`accepted_at` integer,
	`created_by` text,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`customer_id`) REFERENCES `customers`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `quotes_number_unique` ON `quotes` (`number`);--> statement-breakpoint
CREATE INDEX `quotes_customer_idx` ON `quotes` (`customer_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `quotes_order_uq` ON `quotes` (`order_id`);--> statement-breakpoint
PRAGMA foreign_keys=OFF;--> statement-breakpoint
CREATE TABLE `__new_share_links` (
	`id` text PRIMARY KEY NOT NULL,
	`order_id` text,
	`quote_id` text,
	`token_hash` text NOT NULL,
	`purpose` text DEFAULT 'manual' NOT NULL,
	`created_by` text,
	`created_at` integer NOT NULL,
	`revoked_at` integer,
	`revoked_by` text,
	`expires_at` integer,
	`last_opened_at` integer,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`quote_id`) REFERENCES `quotes`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
INSERT INTO `__new_share_links`("id", "order_id", "quote_id", "token_hash", "purpose", "created_by", "created_at", "revoked_at", "revoked_by", "expires_at", "last_opened_at") SELECT "id", "order_id", NULL, "token_hash", "purpose", "created_by", "created_at", "revoked_at", "revoked_by", "expires_at", "last_opened_at" FROM `share_links`;--> statement-breakpoint
DROP TABLE `share_links`;--> statement-breakpoint
ALTER TABLE `__new_share_links` RENAME TO `share_links`;--> statement-breakpoint
PRAGMA foreign_keys=ON;--> statement-breakpoint
CREATE UNIQUE INDEX `share_links_token_hash_unique` ON `share_links` (`token_hash`);--> statement-breakpoint
CREATE INDEX `share_links_order_idx` ON `share_links` (`order_id`);--> statement-breakpoint
CREATE INDEX `share_links_quote_idx` ON `share_links` (`quote_id`);