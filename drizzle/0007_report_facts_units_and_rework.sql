DROP INDEX `step_runs_kind_finished_idx`;--> statement-breakpoint
DROP INDEX `step_runs_order_idx`;--> statement-breakpoint
ALTER TABLE `step_runs` ADD `pass` text DEFAULT 'first' NOT NULL;--> statement-breakpoint
ALTER TABLE `step_runs` ADD `queue_working_minutes` real;--> statement-breakpoint
ALTER TABLE `step_runs` ADD `process_working_minutes` real;--> statement-breakpoint
CREATE INDEX `step_runs_kind_finished_idx` ON `step_runs` (`station_kind`,`finished_at`,`traveller_kind`,`queue_minutes`,`process_minutes`,`queue_working_minutes`,`process_working_minutes`,`implicit`,`pass`,`qty_in`,`good_qty`,`scrap_qty`,`rework_qty`,`scrap_reason`,`station_id`,`order_id`);--> statement-breakpoint
CREATE INDEX `step_runs_order_idx` ON `step_runs` (`order_id`,`step_seq`,`traveller_kind`,`qty_in`,`good_qty`,`scrap_qty`,`rework_qty`,`pass`);--> statement-breakpoint
ALTER TABLE `tray_flows` ADD `process_working_minutes` real DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `tray_flows` ADD `cure_working_minutes` real DEFAULT 0 NOT NULL;--> statement-breakpoint
-- the report facts are derived: rebuild them all once with the new columns
DELETE FROM `report_cursors` WHERE `name` = 'step_runs';