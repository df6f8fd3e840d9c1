import type { DbLike as Db } from '../db/client';
import { sqlClient as client } from './sql-client';

export interface OrderStepRunRow {
  orderId: string;
  stepSeq: number;
  stationKind: string;
  stationId: string | null;
  startedAt: number | null;
  finishedAt: number;
  qtyIn: number;
  scrapQty: number;
}

export interface CostedOrderRow {
  id: string;
  number: string;
  customer: string;
  title: string;
  process: string;
  quantity: number;
  shippedAt: number;
}

const RUN_COLUMNS = `r.order_id as orderId, r.step_seq as stepSeq, r.station_kind as stationKind, r.station_id as stationId,
  r.started_at as startedAt, r.finished_at as finishedAt, r.qty_in as qtyIn, r.scrap_qty as scrapQty`;

/** Reads for quoted against actual: the tray step runs of orders (mould travellers are costed as moulds). */
export const costingRepository = {
  runsOfOrder: (db: Db, orderId: string): OrderStepRunRow[] =>
    client(db)
      .prepare(`select ${RUN_COLUMNS} from step_runs r where r.order_id = ? and r.traveller_kind = 'tray' order by r.step_seq, r.started_at`)
      .all(orderId) as OrderStepRunRow[],

  /** orders shipped in [from, to), optionally of one process and one customer */
  shippedOrders(db: Db, f: { from: number; to: number; process?: string; customerId?: string }): CostedOrderRow[] {
    const where: string[] = ['o.shipped_at >= ?', 'o.shipped_at < ?'];
    const args: unknown[] = [f.from, f.to];
    if (f.process) {
      where.push('o.process = ?');
      args.push(f.process);
    }
    if (f.customerId) {
      where.push('o.customer_id = ?');
      args.push(f.customerId);
    }
    return client(db)
      .prepare(
        `select o.id, o.number, o.title, o.process, o.quantity, c.name as customer, o.shipped_at as shippedAt
         from orders o join customers c on c.id = o.customer_id
         where ${where.join(' and ')} order by o.shipped_at`,
      )
      .all(...args) as CostedOrderRow[];
  },

  /** the tray runs of many orders at once, grouped by order */
  runsOfOrders(db: Db, orderIds: readonly string[]): Map<string, OrderStepRunRow[]> {
    const out = new Map<string, OrderStepRunRow[]>();
    const stmt = client(db).prepare(`select ${RUN_COLUMNS} from step_runs r where r.order_id = ? and r.traveller_kind = 'tray'`);
    for (const id of orderIds) out.set(id, stmt.all(id) as OrderStepRunRow[]);
    return out;
  },
};
