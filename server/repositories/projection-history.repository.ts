import type { DbLike as Db } from '../db/client';
import { sqlClient } from './sql-client';

export interface ProjectionHistoryRow {
  orderId: string;
  day: string;
  reason: 'daily' | 'release';
  at: number;
  expectedAt: number | null;
  p85At: number | null;
  drivingKind: string | null;
}

export const projectionHistoryRepository = {
  /** keeps each row unless the order already has one for that reason and day */
  insertIgnoring(db: Db, rows: readonly ProjectionHistoryRow[]): number {
    if (rows.length === 0) return 0;
    const c = sqlClient(db);
    const stmt = c.prepare(
      `insert into projection_history (order_id, day, reason, at, expected_at, p85_at, driving_kind)
       values (@orderId, @day, @reason, @at, @expectedAt, @p85At, @drivingKind)
       on conflict (order_id, reason, day) do nothing`,
    );
    let added = 0;
    c.transaction(() => {
      for (const r of rows) added += stmt.run(r).changes;
    })();
    return added;
  },
  /** the orders that already have their daily row for `day` */
  ordersWithDailyRow(db: Db, day: string): Set<string> {
    const rows = sqlClient(db).prepare(`select order_id as orderId from projection_history where reason = 'daily' and day = ?`).all(day) as {
      orderId: string;
    }[];
    return new Set(rows.map((r) => r.orderId));
  },
  forOrder(db: Db, orderId: string): ProjectionHistoryRow[] {
    return sqlClient(db)
      .prepare(
        `select order_id as orderId, day, reason, at, expected_at as expectedAt, p85_at as p85At, driving_kind as drivingKind
         from projection_history where order_id = ? order by at, id`,
      )
      .all(orderId) as ProjectionHistoryRow[];
  },
};
