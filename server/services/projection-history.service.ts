// How an order's projected dates moved: kept by the projection service (the first projection of
// each factory day, and one right after release), read by the order page.
import type { AppDeps } from '../app-deps';
import type { DateHistoryPoint } from '@shared/schemas/projections';
import { notFound } from '../errors';
import { ordersRepository } from '../repositories/orders.repository';
import { projectionHistoryRepository } from '../repositories/projection-history.repository';
import { projectionService } from './projection.service';

const iso = (x: number | null) => (x == null ? null : new Date(x).toISOString());

export const projectionHistoryService = {
  /** Called with a release's result: keeps the order's first projected dates, then hands the result on. */
  afterRelease<T>(deps: AppDeps, orderId: string, released: T): T {
    projectionService.keepRelease(deps, orderId);
    return released;
  },

  forOrder(deps: AppDeps, orderId: string): DateHistoryPoint[] {
    if (!ordersRepository.byId(deps.db, orderId)) throw notFound('That order');
    return projectionHistoryRepository.forOrder(deps.db, orderId).map((r) => ({
      at: iso(r.at)!,
      reason: r.reason,
      expectedAt: iso(r.expectedAt),
      p85At: iso(r.p85At),
      drivingKind: r.drivingKind,
    }));
  },
};
