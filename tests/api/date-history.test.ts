import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PNG } from 'pngjs';
import { makeTestApp, type TestApp } from '../support/test-app';
import { insertFloorOrder } from '../support/scan-fixtures';
import { projectionService } from '../../server/services/projection.service';
import type { DateHistoryPoint } from '@shared/schemas/projections';

// Each open order keeps how its projected dates moved: the first projection of each factory day,
// and one right after its release. The order page draws them.
const DAY = 86_400_000;
const NOW = Math.floor(Date.now() / 60_000) * 60_000;
let t: TestApp;
let planner: Awaited<ReturnType<TestApp['agentAs']>>;
let sales: Awaited<ReturnType<TestApp['agentAs']>>;

const history = async (id: string) => {
  const res = await sales.get(`/api/orders/${id}/date-history`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as DateHistoryPoint[];
};
const count = () => (t.deps.db.$client.prepare('select count(*) as n from projection_history').get() as { n: number }).n;

beforeAll(async () => {
  t = makeTestApp();
  t.setNow(NOW);
  planner = await t.agentAs('planner');
  sales = await t.agentAs('sales');
});
afterAll(() => t.close());

describe('projected date history', { timeout: 60_000 }, () => {
  it('keeps one point per open order per factory day, whatever the number of projections', async () => {
    const open = insertFloorOrder(t.deps, { trays: 2, quantity: 50, releasedAt: NOW - 3 * 3_600_000 });
    expect(await history(open.orderId)).toEqual([]);
    expect((await planner.get('/api/projections')).status).toBe(200);
    const first = await history(open.orderId);
    expect(first).toHaveLength(1);
    expect(first[0].reason).toBe('daily');
    expect(Date.parse(first[0].expectedAt!)).toBeGreaterThan(NOW);
    expect(Date.parse(first[0].p85At!)).toBeGreaterThanOrEqual(Date.parse(first[0].expectedAt!));
    // a new scan-free projection the same day adds nothing
    t.setNow(NOW + 2 * 60_000);
    projectionService.forOrders(t.deps);
    expect(await history(open.orderId)).toHaveLength(1);
    // the next day: a second point
    t.setNow(NOW + DAY);
    projectionService.forOrders(t.deps);
    t.setNow(NOW);
    const two = await history(open.orderId);
    expect(two).toHaveLength(2);
    expect(Date.parse(two[1].at) - Date.parse(two[0].at)).toBe(DAY);
  });

  it('keeps a point at release', async () => {
    const spec = {
      customer: 'Invented Kite Club',
      title: 'Kite badge',
      process: 'hard_enamel',
      material: 'iron',
      sizeMm: 25,
      quantity: 300,
      colours: [{ name: 'Red', hex: '#aa0000' }],
      plating: 'gold',
      backing: { type: 'butterfly_clutch', count: 1 },
      packaging: 'individual_bag',
      dueDate: new Date(NOW + 30 * DAY).toISOString().slice(0, 10),
    };
    const created = await planner.post('/api/orders').send(spec);
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const id = created.body.id as string;
    expect((await planner.post(`/api/orders/${id}/payment`).send({ amount: 500, reference: 'BT-1' })).status).toBe(201);
    const img = new PNG({ width: 8, height: 8 });
    img.data.fill(200);
    const up = await planner.post(`/api/orders/${id}/proofs`).attach('file', PNG.sync.write(img), { filename: 'proof.png', contentType: 'image/png' });
    expect(up.status).toBe(201);
    expect((await planner.post(`/api/orders/${id}/proofs/${up.body.revision}/approve`).send({})).status).toBe(200);
    expect(await history(id)).toEqual([]);
    const before = count();
    expect((await planner.post(`/api/orders/${id}/release`).send({ traySize: 100 })).status).toBe(201);
    const points = await history(id);
    expect(points.map((p) => p.reason)).toContain('release');
    const release = points.find((p) => p.reason === 'release')!;
    expect(Date.parse(release.expectedAt!)).toBeGreaterThan(NOW);
    expect(count()).toBeGreaterThan(before);
  });

  it('answers 404 for an order that does not exist', async () => {
    expect((await sales.get('/api/orders/no-such-order/date-history')).status).toBe(404);
  });
});
