// Words for the stored codes of the trade, as people read them on screens.
import type { OrderStatus, TrayPhase } from '@shared/domain/vocabulary';

/** "black_nickel" → "Black nickel"; "die_cast_3d" → "3D die-cast". */
export function humanise(code: string): string {
  if (code === 'die_cast_3d') return '3D die-cast';
  if (code === 'die_struck') return 'Die-struck';
  const s = code.replace(/_/g, ' ');
  return s.charAt(0).toUpperCase() + s.slice(1);
}

export const ORDER_STATUS_LABELS: Record<OrderStatus, string> = {
  draft: 'Ready to release',
  awaiting_payment: 'Awaiting payment',
  awaiting_proof: 'Awaiting proof approval',
  released: 'Released',
  in_production: 'In production',
  packed: 'Packed',
  shipped: 'Shipped',
  on_hold: 'On hold',
  cancelled: 'Cancelled',
};

export const TRAY_PHASE_LABELS: Record<TrayPhase | 'on_hold', string> = {
  waiting: 'Waiting',
  in_process: 'In process',
  curing: 'Curing',
  done: 'Done',
  scrapped: 'Scrapped',
  merged: 'Merged',
  on_hold: 'On hold',
};

// Dates and times come from the one formatter (factory zone, reader's language).
export { formatDateTime, formatDate, formatDueDay } from '@/lib/datetime';
