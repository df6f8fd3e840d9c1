CREATE TABLE `sessions` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`device_id` text,
	`created_at` integer NOT NULL,
	`last_seen_at` integer NOT NULL,
	`expires_at` integer NOT NULL,
	`idle_minutes` integer NOT NULL,
	`revoked_at` integer,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `sessions_user_idx` ON `sessions` (`user_id`);--> statement-breakpoint
CREATE TABLE `users` (
	`id` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`email` text NOT NULL,
	`role` text NOT NULL,
	`password_hash` text NOT NULL,
	`badge` text,
	`pin_hash` text,
	`active` integer DEFAULT true NOT NULL,
	`failed_logins` integer DEFAULT 0 NOT NULL,
	`throttled_until` integer,
	`last_login_at` integer,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `users_email_unique` ON `users` (`email`);--> statement-breakpoint
CREATE UNIQUE INDEX `users_badge_unique` ON `users` (`badge`);--> statement-breakpoint
CREATE INDEX `users_role_idx` ON `users` (`role`);--> statement-breakpoint
CREATE TABLE `stations` (
	`id` text PRIMARY KEY NOT NULL,
	`code` text NOT NULL,
	`name` text NOT NULL,
	`kind` text NOT NULL,
	`capacity_trays` integer DEFAULT 1 NOT NULL,
	`continuous` integer DEFAULT false NOT NULL,
	`instructions` text DEFAULT '' NOT NULL,
	`safety_notes` text DEFAULT '' NOT NULL,
	`active` integer DEFAULT true NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `stations_code_unique` ON `stations` (`code`);--> statement-breakpoint
CREATE TABLE `devices` (
	`id` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`kind` text NOT NULL,
	`station_id` text,
	`token_hash` text NOT NULL,
	`pairing_code` text,
	`pairing_expires_at` integer,
	`locale` text DEFAULT 'en' NOT NULL,
	`idle_minutes` integer DEFAULT 10 NOT NULL,
	`clock_offset_ms` integer,
	`last_seen_at` integer,
	`active` integer DEFAULT true NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`station_id`) REFERENCES `stations`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `devices_token_hash_unique` ON `devices` (`token_hash`);--> statement-breakpoint
CREATE UNIQUE INDEX `devices_pairing_code_unique` ON `devices` (`pairing_code`);--> statement-breakpoint
CREATE TABLE `customers` (
	`id` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`contact_name` text,
	`contact_email` text,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `customers_name_unique` ON `customers` (`name`);--> statement-breakpoint
CREATE TABLE `order_steps` (
	`id` text PRIMARY KEY NOT NULL,
	`order_id` text NOT NULL,
	`traveller_kind` text DEFAULT 'tray' NOT NULL,
	`seq` integer NOT NULL,
	`name` text NOT NULL,
	`station_kind` text NOT NULL,
	`tray_minutes` real NOT NULL,
	`piece_minutes` real NOT NULL,
	`cure_minutes` integer,
	`colour` integer,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `order_steps_seq_uq` ON `order_steps` (`order_id`,`traveller_kind`,`seq`);--> statement-breakpoint
CREATE TABLE `orders` (
	`id` text PRIMARY KEY NOT NULL,
	`number` text NOT NULL,
	`customer_id` text NOT NULL,
	`title` text NOT NULL,
	`product_type` text DEFAULT 'pin' NOT NULL,
	`process` text NOT NULL,
	`material` text NOT NULL,
	`size_mm` real NOT NULL,
	`quantity` integer NOT NULL,
	`overrun_pct` real DEFAULT 5 NOT NULL,
	`colours` text NOT NULL,
	`plating` text NOT NULL,
	`backing_type` text NOT NULL,
	`backing_count` integer DEFAULT 1 NOT NULL,
	`back_logo` integer DEFAULT false NOT NULL,
	`printing` integer DEFAULT false NOT NULL,
	`epoxy` integer DEFAULT false NOT NULL,
	`packaging` text NOT NULL,
	`due_date` text NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`design_key` text NOT NULL,
	`tray_size` integer,
	`sales_owner_id` text,
	`created_by` text,
	`released_at` integer,
	`packed_at` integer,
	`shipped_at` integer,
	`cancelled_at` integer,
	`hold_reason` text,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`customer_id`) REFERENCES `customers`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`sales_owner_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `orders_number_unique` ON `orders` (`number`);--> statement-breakpoint
CREATE INDEX `orders_status_idx` ON `orders` (`status`);--> statement-breakpoint
CREATE INDEX `orders_customer_idx` ON `orders` (`customer_id`);--> statement-breakpoint
CREATE INDEX `orders_due_idx` ON `orders` (`due_date`);--> statement-breakpoint
CREATE INDEX `orders_released_idx` ON `orders` (`released_at`);--> statement-breakpoint
CREATE INDEX `orders_shipped_idx` ON `orders` (`shipped_at`);--> statement-breakpoint
CREATE INDEX `orders_design_idx` ON `orders` (`design_key`);--> statement-breakpoint
CREATE TABLE `payments` (
	`id` text PRIMARY KEY NOT NULL,
	`order_id` text NOT NULL,
	`amount` real,
	`reference` text NOT NULL,
	`is_exception` integer DEFAULT false NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`recorded_by` text NOT NULL,
	`recorded_at` integer NOT NULL,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `payments_order_idx` ON `payments` (`order_id`);--> statement-breakpoint
CREATE TABLE `proofs` (
	`id` text PRIMARY KEY NOT NULL,
	`order_id` text NOT NULL,
	`revision` integer NOT NULL,
	`file_hash` text NOT NULL,
	`mime` text NOT NULL,
	`size_bytes` integer NOT NULL,
	`original_name` text NOT NULL,
	`uploaded_by` text NOT NULL,
	`uploaded_at` integer NOT NULL,
	`approved_at` integer,
	`approved_by` text,
	`approval_note` text,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`uploaded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`approved_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `proofs_revision_uq` ON `proofs` (`order_id`,`revision`);--> statement-breakpoint
CREATE TABLE `moulds` (
	`id` text PRIMARY KEY NOT NULL,
	`number` text NOT NULL,
	`design_key` text NOT NULL,
	`side` text NOT NULL,
	`first_order_id` text,
	`status` text DEFAULT 'engraving' NOT NULL,
	`storage_location` text,
	`use_count` integer DEFAULT 0 NOT NULL,
	`ready_at` integer,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`first_order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `moulds_number_unique` ON `moulds` (`number`);--> statement-breakpoint
CREATE INDEX `moulds_design_idx` ON `moulds` (`design_key`,`side`);--> statement-breakpoint
CREATE TABLE `order_moulds` (
	`order_id` text NOT NULL,
	`mould_id` text NOT NULL,
	PRIMARY KEY(`order_id`, `mould_id`),
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`mould_id`) REFERENCES `moulds`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `tray_states` (
	`tray_id` text PRIMARY KEY NOT NULL,
	`kind` text NOT NULL,
	`phase` text NOT NULL,
	`step_seq` integer,
	`station_kind` text,
	`quantity` integer NOT NULL,
	`station_id` text,
	`started_at` integer,
	`waiting_since` integer,
	`cure_ready_at` integer,
	`on_hold` integer DEFAULT false NOT NULL,
	`hold_reason` text,
	`released_at` integer NOT NULL,
	`last_event_at` integer,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`tray_id`) REFERENCES `trays`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`station_id`) REFERENCES `stations`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `tray_states_phase_kind_idx` ON `tray_states` (`phase`,`station_kind`);--> statement-breakpoint
CREATE TABLE `trays` (
	`id` text PRIMARY KEY NOT NULL,
	`number` text NOT NULL,
	`kind` text NOT NULL,
	`order_id` text NOT NULL,
	`mould_id` text,
	`parent_tray_id` text,
	`merged_into_id` text,
	`revision` integer DEFAULT 1 NOT NULL,
	`quantity` integer NOT NULL,
	`released_at` integer NOT NULL,
	`written_off_at` integer,
	`write_off_reason` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`mould_id`) REFERENCES `moulds`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`parent_tray_id`) REFERENCES `trays`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`merged_into_id`) REFERENCES `trays`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `trays_number_unique` ON `trays` (`number`);--> statement-breakpoint
CREATE INDEX `trays_order_idx` ON `trays` (`order_id`);--> statement-breakpoint
CREATE INDEX `trays_parent_idx` ON `trays` (`parent_tray_id`);--> statement-breakpoint
CREATE TABLE `attachments` (
	`id` text PRIMARY KEY NOT NULL,
	`tray_id` text NOT NULL,
	`event_id` text,
	`file_hash` text NOT NULL,
	`mime` text NOT NULL,
	`size_bytes` integer NOT NULL,
	`created_by` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`tray_id`) REFERENCES `trays`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `overrides` (
	`id` text PRIMARY KEY NOT NULL,
	`tray_id` text NOT NULL,
	`station_id` text,
	`kind` text NOT NULL,
	`supervisor_id` text NOT NULL,
	`reason` text NOT NULL,
	`created_at` integer NOT NULL,
	`expires_at` integer NOT NULL,
	`used_event_id` text,
	FOREIGN KEY (`tray_id`) REFERENCES `trays`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`supervisor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `scan_events` (
	`id` text PRIMARY KEY NOT NULL,
	`tray_id` text NOT NULL,
	`type` text NOT NULL,
	`step_seq` integer,
	`station_id` text,
	`station_kind` text,
	`device_id` text,
	`user_id` text,
	`occurred_at` integer NOT NULL,
	`received_at` integer NOT NULL,
	`qty_in` integer,
	`good_qty` integer,
	`scrap_qty` integer,
	`rework_qty` integer,
	`scrap_reason` text,
	`override_id` text,
	`note` text,
	`photo_hash` text,
	FOREIGN KEY (`tray_id`) REFERENCES `trays`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `scan_events_tray_idx` ON `scan_events` (`tray_id`,`occurred_at`);--> statement-breakpoint
CREATE INDEX `scan_events_time_idx` ON `scan_events` (`occurred_at`);--> statement-breakpoint
CREATE INDEX `scan_events_kind_time_idx` ON `scan_events` (`station_kind`,`type`,`occurred_at`);--> statement-breakpoint
CREATE TABLE `scan_rejections` (
	`id` text PRIMARY KEY NOT NULL,
	`event_id` text NOT NULL,
	`tray_id` text,
	`station_id` text,
	`device_id` text,
	`user_id` text,
	`code` text NOT NULL,
	`message` text NOT NULL,
	`payload` text NOT NULL,
	`occurred_at` integer,
	`received_at` integer NOT NULL,
	`resolved_at` integer,
	`resolved_by` text,
	`resolution` text
);
--> statement-breakpoint
CREATE INDEX `scan_rejections_event_idx` ON `scan_rejections` (`event_id`);--> statement-breakpoint
CREATE INDEX `scan_rejections_open_idx` ON `scan_rejections` (`resolved_at`);--> statement-breakpoint
CREATE TABLE `audit_log` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`at` integer NOT NULL,
	`user_id` text,
	`action` text NOT NULL,
	`entity` text NOT NULL,
	`entity_id` text,
	`detail` text
);
--> statement-breakpoint
CREATE TABLE `calendar_days_off` (
	`id` text PRIMARY KEY NOT NULL,
	`date` text NOT NULL,
	`station_id` text,
	`name` text NOT NULL,
	FOREIGN KEY (`station_id`) REFERENCES `stations`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `calendar_shifts` (
	`id` text PRIMARY KEY NOT NULL,
	`station_id` text,
	`weekday` integer NOT NULL,
	`start_minute` integer NOT NULL,
	`end_minute` integer NOT NULL,
	FOREIGN KEY (`station_id`) REFERENCES `stations`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `reason_codes` (
	`code` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`name_zh` text NOT NULL,
	`kind` text NOT NULL,
	`station_kind` text,
	`active` integer DEFAULT true NOT NULL
);
--> statement-breakpoint
CREATE TABLE `routing_templates` (
	`process` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`template` text NOT NULL,
	`updated_at` integer NOT NULL,
	`updated_by` text
);
--> statement-breakpoint
CREATE TABLE `settings` (
	`key` text PRIMARY KEY NOT NULL,
	`value` text NOT NULL
);
--> statement-breakpoint
CREATE TABLE `cartons` (
	`id` text PRIMARY KEY NOT NULL,
	`order_id` text NOT NULL,
	`shipment_id` text,
	`count` integer NOT NULL,
	`pieces_per_carton` integer NOT NULL,
	`weight_kg` real,
	`created_by` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`shipment_id`) REFERENCES `shipments`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `cartons_order_idx` ON `cartons` (`order_id`);--> statement-breakpoint
CREATE TABLE `mail_queue` (
	`id` text PRIMARY KEY NOT NULL,
	`kind` text NOT NULL,
	`dedupe_key` text,
	`order_id` text,
	`to` text NOT NULL,
	`subject` text NOT NULL,
	`text` text NOT NULL,
	`html` text,
	`attachments` text,
	`status` text DEFAULT 'queued' NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`next_attempt_at` integer NOT NULL,
	`last_error` text,
	`created_at` integer NOT NULL,
	`sent_at` integer
);
--> statement-breakpoint
CREATE UNIQUE INDEX `mail_queue_dedupe_key_unique` ON `mail_queue` (`dedupe_key`);--> statement-breakpoint
CREATE TABLE `share_links` (
	`id` text PRIMARY KEY NOT NULL,
	`order_id` text NOT NULL,
	`token_hash` text NOT NULL,
	`purpose` text DEFAULT 'manual' NOT NULL,
	`created_by` text,
	`created_at` integer NOT NULL,
	`revoked_at` integer,
	`revoked_by` text,
	`last_opened_at` integer,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `share_links_token_hash_unique` ON `share_links` (`token_hash`);--> statement-breakpoint
CREATE INDEX `share_links_order_idx` ON `share_links` (`order_id`);--> statement-breakpoint
CREATE TABLE `shipments` (
	`id` text PRIMARY KEY NOT NULL,
	`order_id` text NOT NULL,
	`number` integer NOT NULL,
	`carrier` text NOT NULL,
	`tracking_number` text NOT NULL,
	`pieces` integer NOT NULL,
	`shipped_at` integer NOT NULL,
	`short_accepted` integer DEFAULT false NOT NULL,
	`note` text,
	`created_by` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `shipments_order_idx` ON `shipments` (`order_id`);--> statement-breakpoint
CREATE INDEX `shipments_tracking_idx` ON `shipments` (`tracking_number`);--> statement-breakpoint
CREATE UNIQUE INDEX `shipments_order_number_uq` ON `shipments` (`order_id`,`number`);--> statement-breakpoint
CREATE TABLE `report_cursors` (
	`name` text PRIMARY KEY NOT NULL,
	`position` integer NOT NULL,
	`updated_at` integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE `step_runs` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`tray_id` text NOT NULL,
	`order_id` text NOT NULL,
	`traveller_kind` text NOT NULL,
	`step_seq` integer NOT NULL,
	`station_kind` text NOT NULL,
	`station_id` text,
	`ready_at` integer NOT NULL,
	`started_at` integer,
	`finished_at` integer NOT NULL,
	`queue_minutes` real,
	`process_minutes` real,
	`cure_minutes` real,
	`qty_in` integer NOT NULL,
	`good_qty` integer NOT NULL,
	`scrap_qty` integer NOT NULL,
	`rework_qty` integer NOT NULL,
	`scrap_reason` text,
	`implicit` integer DEFAULT false NOT NULL
);
--> statement-breakpoint
CREATE INDEX `step_runs_kind_finished_idx` ON `step_runs` (`station_kind`,`finished_at`,`traveller_kind`,`queue_minutes`,`process_minutes`,`implicit`,`qty_in`,`good_qty`,`scrap_qty`,`rework_qty`,`scrap_reason`,`station_id`,`order_id`);--> statement-breakpoint
CREATE INDEX `step_runs_order_idx` ON `step_runs` (`order_id`,`step_seq`,`traveller_kind`,`qty_in`,`good_qty`,`scrap_qty`,`rework_qty`);--> statement-breakpoint
CREATE INDEX `step_runs_tray_idx` ON `step_runs` (`tray_id`);--> statement-breakpoint
CREATE INDEX `step_runs_scrap_idx` ON `step_runs` (`finished_at`,`scrap_reason`,`scrap_qty`,`traveller_kind`,`station_id`,`order_id`) WHERE "step_runs"."scrap_qty" > 0;--> statement-breakpoint
CREATE TABLE `tray_flows` (
	`tray_id` text PRIMARY KEY NOT NULL,
	`order_id` text NOT NULL,
	`released_at` integer NOT NULL,
	`started_at` integer,
	`inspected_at` integer,
	`packed_at` integer,
	`shipped_at` integer,
	`shipped_qty` integer,
	`last_finish_at` integer,
	`process_minutes` real NOT NULL,
	`cure_minutes` real NOT NULL
);
--> statement-breakpoint
CREATE INDEX `tray_flows_order_idx` ON `tray_flows` (`order_id`);--> statement-breakpoint
CREATE INDEX `tray_flows_released_idx` ON `tray_flows` (`released_at`);--> statement-breakpoint
CREATE TABLE `load_trays` (
	`load_id` text NOT NULL,
	`tray_id` text NOT NULL,
	`order_id` text NOT NULL,
	`quantity` integer NOT NULL,
	PRIMARY KEY(`load_id`, `tray_id`),
	FOREIGN KEY (`load_id`) REFERENCES `loads`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`tray_id`) REFERENCES `trays`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `load_trays_tray_idx` ON `load_trays` (`tray_id`);--> statement-breakpoint
CREATE TABLE `loads` (
	`id` text PRIMARY KEY NOT NULL,
	`number` text NOT NULL,
	`kind` text NOT NULL,
	`group_key` text NOT NULL,
	`status` text NOT NULL,
	`created_by` text,
	`created_at` integer NOT NULL,
	`split_at` integer,
	`split_by` text,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`split_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `loads_number_unique` ON `loads` (`number`);--> statement-breakpoint
CREATE INDEX `loads_status_idx` ON `loads` (`status`);