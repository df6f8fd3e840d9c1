// Wire shapes of quoted against actual: one order's costing (GET /api/orders/:id/costing) and
// the report across orders by process and colour count (GET /api/reports/costing).
import type { StepVariance } from '@shared/domain/costing';
import type { CostGroup } from '@shared/domain/costing-actual';
import type { ReportWindow } from './reports';

/**
 * `quote`: the accepted quote's line at the quote's rates. `standard`: the order was not made
 * from a quote; its spec is priced from its routing at today's rates (the default thickness and
 * a height equal to its size stand in for what a quote would give).
 */
export type CostingBasis = 'quote' | 'standard';

export interface OrderCosting {
  orderId: string;
  number: string;
  basis: CostingBasis;
  /** the quote's number when the basis is a quote */
  quoteNumber: string | null;
  currency: string;
  quantity: number;
  process: string;
  colours: number;
  /** shipped: every step has run; otherwise the actual side is what has run so far */
  complete: boolean;
  /** quoted cost of the make (before margin, moulds apart) */
  quoted: number;
  actual: number;
  /** actual − quoted: above 0 cost more than quoted */
  variance: number;
  variancePct: number | null;
  /** the actual cost in parts: labour (with the office set-up), oven, scrap, and the parts taken as quoted */
  actualParts: { labour: number; oven: number; scrap: number; material: number };
  cureCycles: { quoted: number; actual: number };
  scrapPieces: number;
  steps: StepVariance[];
}

export interface CostingReportOrder {
  orderId: string;
  number: string;
  customer: string;
  title: string;
  process: string;
  colours: number;
  quantity: number;
  basis: CostingBasis;
  shippedAt: string;
  quoted: number;
  actual: number;
  variance: number;
}

export interface CostingReport {
  window: ReportWindow;
  currency: string;
  rows: CostGroup[];
  orders: CostingReportOrder[];
  /** shipped orders left out because they were quoted in another currency */
  otherCurrency: number;
}
