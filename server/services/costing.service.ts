// Quoted against actual: an order's quoted cost beside the cost its scans show, step by step,
// and a report of shipped orders by process and colour count. The rules are the domain's
// (compareCost in shared/domain/costing.ts, actualStepsOf in shared/domain/costing-actual.ts);
// this file only gathers the facts: the accepted quote's line and rates, the order's routing, and
// its step runs (derived from the scans by the report facts).
import type { AppDeps } from '../app-deps';
import type { DbLike } from '../db/client';
import { ordersRepository, type OrderRow } from '../repositories/orders.repository';
import { quotesRepository } from '../repositories/quotes.repository';
import { costingRepository, type OrderStepRunRow } from '../repositories/costing.repository';
import { notFound } from '../errors';
import { reportFactsService } from './report-facts.service';
import { calendarService } from './calendar.service';
import { costingSettings } from './quotes.service';
import { windowOf } from './reports.service';
import { compareCost, costLine, type CostingSpec, type CostLine, type QuotePricing } from '@shared/domain/costing';
import { actualStepsOf, costByProcessAndColours, runWorkingMinutes } from '@shared/domain/costing-actual';
import type { WorkingCalendar } from '@shared/domain/calendar';
import type { BackingType, Material, Packaging, Plating, Process, RoutingStep, StationKind } from '@shared/domain/vocabulary';
import { costingSettingsPatchSchema, DEFAULT_COSTING_SETTINGS, mergeCostingSettings, type CostingSettings } from '@shared/schemas/costing';
import type { QuoteSpec } from '@shared/schemas/quotes';
import type { ReportQuery } from '@shared/schemas/reports';
import type { CostingBasis, CostingReport, OrderCosting } from '@shared/schemas/order-costing';
import { toCsv } from '@shared/domain/csv-safety';

interface Basis {
  basis: CostingBasis;
  quoteNumber: string | null;
  spec: CostingSpec;
  settings: CostingSettings;
  line: CostLine;
}

function routingOf(db: DbLike, orderId: string): RoutingStep[] {
  return ordersRepository.steps(db, orderId, 'tray').map((s) => ({
    seq: s.seq,
    name: s.name,
    stationKind: s.stationKind as StationKind,
    trayMinutes: s.trayMinutes,
    pieceMinutes: s.pieceMinutes,
    cureMinutes: s.cureMinutes,
    colour: s.colour,
  }));
}

/** The order's spec as costing reads it, with the factory's default geometry where an order has none. */
function standardSpec(order: OrderRow, settings: CostingSettings): CostingSpec {
  return {
    process: order.process as Process,
    material: order.material as Material,
    sizeMm: order.sizeMm,
    heightMm: order.sizeMm,
    thicknessMm: settings.defaultThicknessMm,
    outlineFactor: null,
    colours: order.colours,
    plating: order.plating as Plating,
    backing: { type: order.backingType as BackingType, count: order.backingCount },
    backLogo: order.backLogo,
    packaging: order.packaging as Packaging,
    overrunPct: order.overrunPct,
  };
}

function basisOf(db: DbLike, order: OrderRow, routing: RoutingStep[], current: () => CostingSettings): Basis {
  const quote = quotesRepository.byOrderId(db, order.id);
  const version = quote?.acceptedVersion != null ? quotesRepository.version(db, quote.id, quote.acceptedVersion) : undefined;
  if (quote && version) {
    const pricing = version.pricing as QuotePricing;
    const line = pricing.lines.find((l) => l.quantity === quote.acceptedQuantity);
    const stored = costingSettingsPatchSchema.safeParse(version.settings);
    if (line && stored.success) {
      const spec = version.spec as QuoteSpec;
      return {
        basis: 'quote',
        quoteNumber: quote.number,
        spec: { ...spec, outlineFactor: spec.outlineFactor ?? null },
        settings: mergeCostingSettings(DEFAULT_COSTING_SETTINGS, stored.data),
        line,
      };
    }
  }
  const settings = current();
  const spec = standardSpec(order, settings);
  return { basis: 'standard', quoteNumber: null, spec, settings, line: costLine(spec, routing, order.quantity, 0, settings) };
}

function costOrder(order: OrderRow, runs: OrderStepRunRow[], db: DbLike, calendar: WorkingCalendar, current: () => CostingSettings): OrderCosting {
  const routing = routingOf(db, order.id);
  const b = basisOf(db, order, routing, current);
  const facts = runs.map((r) => ({
    stepSeq: r.stepSeq,
    stationKind: r.stationKind,
    startedAt: r.startedAt,
    finishedAt: r.finishedAt,
    workingMinutes: runWorkingMinutes(r.startedAt, r.finishedAt, (from, to) => calendar.forStation(r.stationId, r.stationKind).workingMinutesBetween(from, to)),
    qtyIn: r.qtyIn,
    scrapQty: r.scrapQty,
  }));
  const actualSteps = actualStepsOf(routing, facts);
  const c = compareCost({ quoted: b.line, quantity: order.quantity, actualSteps, spec: b.spec, routing, settings: b.settings });
  return {
    orderId: order.id,
    number: order.number,
    basis: b.basis,
    quoteNumber: b.quoteNumber,
    currency: b.settings.currency,
    quantity: order.quantity,
    process: order.process,
    colours: order.colours.length,
    complete: order.shippedAt != null,
    quoted: c.quoted,
    actual: c.actual,
    variance: c.variance,
    variancePct: c.quoted > 0 ? Math.round((c.variance / c.quoted) * 1000) / 10 : null,
    actualParts: c.actualParts,
    cureCycles: { quoted: b.line.ovenCycles, actual: actualSteps.reduce((n, s) => n + s.cureCycles, 0) },
    scrapPieces: actualSteps.reduce((n, s) => n + s.scrap, 0),
    steps: c.steps,
  };
}

function once<T>(f: () => T): () => T {
  let value: { v: T } | null = null;
  return () => (value ??= { v: f() }).v;
}

export const costingService = {
  /** GET /api/orders/:id/costing */
  order(deps: AppDeps, orderId: string): OrderCosting {
    const order = ordersRepository.byId(deps.db, orderId);
    if (!order) throw notFound('The order');
    reportFactsService.catchUp(deps);
    const runs = costingRepository.runsOfOrder(deps.db, orderId);
    return costOrder(
      order,
      runs,
      deps.db,
      calendarService.calendar(deps),
      once(() => costingSettings(deps.db)),
    );
  },

  /** GET /api/reports/costing: orders shipped in the window, summed by process and colour count */
  report(deps: AppDeps, q: ReportQuery): CostingReport {
    const w = windowOf(deps, q);
    reportFactsService.catchUp(deps);
    const current = once(() => costingSettings(deps.db));
    const currency = current().currency;
    const calendar = calendarService.calendar(deps);
    const shipped = costingRepository.shippedOrders(deps.db, w.filter);
    const runs = costingRepository.runsOfOrders(
      deps.db,
      shipped.map((o) => o.id),
    );
    const orders: CostingReport['orders'] = [];
    let otherCurrency = 0;
    for (const s of shipped) {
      const order = ordersRepository.byId(deps.db, s.id);
      if (!order) continue;
      const c = costOrder(order, runs.get(s.id) ?? [], deps.db, calendar, current);
      if (c.currency !== currency) {
        otherCurrency++;
        continue;
      }
      orders.push({
        orderId: s.id,
        number: s.number,
        customer: s.customer,
        title: s.title,
        process: s.process,
        colours: c.colours,
        quantity: s.quantity,
        basis: c.basis,
        shippedAt: new Date(s.shippedAt).toISOString(),
        quoted: c.quoted,
        actual: c.actual,
        variance: c.variance,
      });
    }
    return { window: w.info, currency, rows: costByProcessAndColours(orders), orders, otherCurrency };
  },
};

/** The report as CSV: one line per process and colour count (written by the one CSV helper). */
export function costingReportCsv(r: CostingReport): string {
  return toCsv(
    ['process', 'colours', 'orders', `quoted_${r.currency}`, `actual_${r.currency}`, `variance_${r.currency}`, 'variance_pct'],
    r.rows.map((g) => [g.process, g.colours, g.orders, g.quoted, g.actual, g.variance, g.variancePct]),
  );
}
