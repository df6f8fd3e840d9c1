// Which orders a search finds and which ones wait for the planner. Pure: runs in the browser.
import type { OrderListItem } from '@shared/schemas/orders';

export type ActionReason = 'gates' | 'release' | 'late' | 'hold';

/** Why an order waits for the planner: an open gate, ready to release, at risk of being late, or held. */
export function actionReasons(o: Pick<OrderListItem, 'status' | 'openGates' | 'late'>): ActionReason[] {
  if (o.status === 'cancelled' || o.status === 'shipped') return [];
  const out: ActionReason[] = [];
  if (o.openGates.length > 0) out.push('gates');
  else if (o.status === 'draft') out.push('release');
  if (o.late) out.push('late');
  if (o.status === 'on_hold') out.push('hold');
  return out;
}

/**
 * "1066-03" (a tray), "1066-MF" (a mould) or "1066-03.2" (a split tray) name order 1066; the
 * tray must be one the order has. Returns the order number and the traveller, or null.
 */
export function travellerOfSearch(q: string): { order: string; traveller: string; tray: number | null } | null {
  const m = /^\s*(\d+)-(?:(\d{1,3})(?:\.\d+)*|M[FB])\s*$/i.exec(q);
  if (!m) return null;
  return { order: m[1], traveller: q.trim().toUpperCase(), tray: m[2] ? Number(m[2]) : null };
}

/** Does the quick search find this order? Number, customer, title, process name, or one of its travellers. */
export function orderMatchesSearch(o: Pick<OrderListItem, 'number' | 'customer' | 'title' | 'process' | 'trays'>, q: string, processName = o.process): boolean {
  const needle = q.trim().toLowerCase();
  if (!needle) return true;
  const t = travellerOfSearch(needle);
  if (t) return o.number === t.order && (t.tray === null || (t.tray >= 1 && t.tray <= o.trays));
  return [o.number, o.customer, o.title, processName].some((f) => f.toLowerCase().includes(needle));
}
