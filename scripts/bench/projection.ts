// Projection of every open order with capacity, on a floor of 200 open orders and about 1,500
// open trays: a demo floor's open work at a moment, copied until it is that large.
import { FloorReplay, type SnapshotOrder } from '@shared/domain/floor-history';
import { measureFloor, projectFloor } from '@shared/domain/floor-projection';
import { makeDemoFloor } from '../../server/backtest/demo-floor';
import { BACKTEST_END } from '../../server/backtest/backtest';
import { PROJECTION_RUNS } from '../../server/services/projection.service';

export async function benchProjection() {
  const floor = makeDemoFloor('bench-floor', BACKTEST_END);
  const replay = new FloorReplay(floor.history);
  replay.advanceTo(BACKTEST_END);
  const base = replay.snapshot();
  const openTrays = (o: SnapshotOrder) => o.travellers.filter((t) => t.kind === 'tray' && !['done', 'scrapped', 'merged'].includes(t.state.phase)).length;
  const orders: SnapshotOrder[] = [];
  // about 7.5 open trays an order: 200 orders, 1,500 trays
  const pool = base.orders.filter((o) => openTrays(o) > 0 && openTrays(o) <= 12);
  let trayCount = 0;
  for (let copy = 0; orders.length < 200; copy++) {
    for (const o of pool) {
      if (trayCount + openTrays(o) > 1500 - (199 - orders.length)) continue;
      trayCount += openTrays(o);
      if (orders.length >= 200) break;
      orders.push({ ...o, id: `${o.id}-${copy}`, travellers: o.travellers.map((t) => ({ ...t, id: `${t.id}-${copy}` })) });
      if (orders.length >= 200) break;
    }
    if (copy > 1000) break;
  }
  const snapshot = { ...base, orders };
  const trays = orders.reduce((s, o) => s + openTrays(o), 0);
  const times: number[] = [];
  for (let i = 0; i < 3; i++) {
    const t0 = performance.now();
    const model = measureFloor(snapshot.measured, floor.calendar, floor.stations);
    projectFloor(snapshot, { calendar: floor.calendar, model, runs: PROJECTION_RUNS });
    times.push(performance.now() - t0);
  }
  return {
    'open orders': orders.length,
    'open trays': trays,
    runs: PROJECTION_RUNS,
    'every open order, capacity: ms (3 tries)': times.map((x) => Math.round(x)).join(' / '),
  };
}
