CREATE TABLE `projection_history` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`order_id` text NOT NULL,
	`day` text NOT NULL,
	`reason` text NOT NULL,
	`at` integer NOT NULL,
	`expected_at` integer,
	`p85_at` integer,
	`driving_kind` text,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `projection_history_order_day_uq` ON `projection_history` (`order_id`,`reason`,`day`);