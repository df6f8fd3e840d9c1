import type { LoadKind } from '@shared/domain/traveller';
import type { DbLike as Db } from '../db/client';
import { sqlClient } from './sql-client';

const client = sqlClient;

export interface LoadRow {
  id: string;
  number: string;
  kind: LoadKind;
  groupKey: string;
  status: 'open' | 'split';
  createdAt: number;
  splitAt: number | null;
}

export interface LoadTrayRow {
  loadId: string;
  trayId: string;
  orderId: string;
  quantity: number;
  number: string;
  orderNumber: string;
  customer: string;
  currentQuantity: number | null;
}

const LOAD_COLUMNS = 'id, number, kind, group_key as groupKey, status, created_at as createdAt, split_at as splitAt';

export const loadsRepository = {
  open: (db: Db) => client(db).prepare(`select ${LOAD_COLUMNS} from loads where status = 'open' order by created_at`).all() as LoadRow[],
  byId: (db: Db, id: string) => client(db).prepare(`select ${LOAD_COLUMNS} from loads where id = ?`).get(id) as LoadRow | undefined,
  count: (db: Db) => (client(db).prepare('select count(*) as n from loads').get() as { n: number }).n,
  traysOf(db: Db, loadIds: string[]): LoadTrayRow[] {
    const stmt = client(db).prepare(
      `select lt.load_id as loadId, lt.tray_id as trayId, lt.order_id as orderId, lt.quantity, t.number, o.number as orderNumber, c.name as customer, s.quantity as currentQuantity
       from load_trays lt join trays t on t.id = lt.tray_id join orders o on o.id = lt.order_id join customers c on c.id = o.customer_id
       left join tray_states s on s.tray_id = lt.tray_id
       where lt.load_id = ? order by o.number, t.number`,
    );
    return loadIds.flatMap((id) => stmt.all(id) as LoadTrayRow[]);
  },
  /** trays already in an open load */
  traysInOpenLoads(db: Db): Set<string> {
    return new Set(
      (client(db).prepare(`select lt.tray_id as t from load_trays lt join loads l on l.id = lt.load_id where l.status = 'open'`).all() as { t: string }[]).map(
        (r) => r.t,
      ),
    );
  },
  insert(db: Db, load: LoadRow & { createdBy: string | null }, trays: { trayId: string; orderId: string; quantity: number }[]) {
    const c = client(db);
    c.prepare('insert into loads (id, number, kind, group_key, status, created_by, created_at) values (?, ?, ?, ?, ?, ?, ?)').run(
      load.id,
      load.number,
      load.kind,
      load.groupKey,
      load.status,
      load.createdBy,
      load.createdAt,
    );
    const stmt = c.prepare('insert into load_trays (load_id, tray_id, order_id, quantity) values (?, ?, ?, ?)');
    for (const t of trays) stmt.run(load.id, t.trayId, t.orderId, t.quantity);
  },
  markSplit(db: Db, id: string, at: number, by: string | null) {
    client(db).prepare(`update loads set status = 'split', split_at = ?, split_by = ? where id = ?`).run(at, by, id);
  },
};
