ALTER TABLE `orders` ADD `second_plating` text;--> statement-breakpoint
ALTER TABLE `orders` ADD `sandblast` integer DEFAULT false NOT NULL;