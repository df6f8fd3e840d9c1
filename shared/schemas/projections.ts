// Ship-date what-if and the per-order history of projected dates.
import { z } from 'zod';
import { checkContradictions, checkCustomer, orderSpecFields } from './orders';

/** POST /api/projections/what-if: the body of POST /api/orders, plus when it would be released. */
export const whatIfBodySchema = z
  .strictObject({
    ...orderSpecFields,
    /** when the order would go to the floor (default now; a time already past counts as now) */
    releaseAt: z.iso.datetime({ offset: true }).optional(),
  })
  .superRefine((spec, ctx) => {
    checkCustomer(spec, ctx);
    checkContradictions(spec, ctx);
  });
export type WhatIfBody = z.output<typeof whatIfBodySchema>;
export type WhatIfBodyInput = z.input<typeof whatIfBodySchema>;

export interface WhatIfImpact {
  orderId: string;
  number: string;
  p85Before: string;
  p85After: string;
}

export interface WhatIfResult {
  expectedAt: string | null;
  p85At: string | null;
  /** open orders whose 85th-percentile date this order would move later, the largest move first */
  impacts: WhatIfImpact[];
}

/** One projected date of an order as it stood on a day (or at its release). */
export interface DateHistoryPoint {
  at: string;
  /** `daily`: the first projection of the day; `release`: made when the order was released */
  reason: 'daily' | 'release';
  expectedAt: string | null;
  p85At: string | null;
  /** the station kind whose queue added the most waiting, when known */
  drivingKind: string | null;
}

/** Measured calibration of the 85th-percentile date (from the backtest). */
export interface ProjectionCoverage {
  /** share of held-out orders that shipped by their 85th-percentile date, over the daily snapshots (0–1) */
  p85Coverage: number;
  /** when it was measured (YYYY-MM-DD) */
  measuredOn: string;
  floors: number;
  orders: number;
}
