// The figures on the manager's summary page, from the reports' own answers.
import { dateOfDayNumber, dayNumberOfDate } from '@shared/domain/time-zone';
import type { YieldStep } from '@shared/schemas/reports';

export interface DayRange {
  from: string;
  to: string;
}

/** The last `weeks` whole weeks of factory days ending on `today` (inclusive), oldest first. */
export function lastWeeks(today: string, weeks = 4): DayRange[] {
  const end = dayNumberOfDate(today);
  return Array.from({ length: weeks }, (_, i) => {
    const last = end - 7 * (weeks - 1 - i);
    return { from: dateOfDayNumber(last - 6), to: dateOfDayNumber(last) };
  });
}

export interface YieldTotals {
  /** pieces that passed each step the first time ÷ pieces that went into the steps */
  firstPassYield: number | null;
  /** pieces scrapped ÷ pieces that went into the steps */
  scrapRate: number | null;
  inQty: number;
}

/** One first-pass yield and one scrap rate over all steps of a yield report (pieces-weighted). */
export function yieldTotals(steps: readonly Pick<YieldStep, 'inQty' | 'firstPassQty' | 'scrapQty'>[]): YieldTotals {
  let inQty = 0;
  let passed = 0;
  let scrap = 0;
  for (const s of steps) {
    inQty += s.inQty;
    passed += s.firstPassQty;
    scrap += s.scrapQty;
  }
  return { firstPassYield: inQty ? passed / inQty : null, scrapRate: inQty ? scrap / inQty : null, inQty };
}

/**
 * The period a report opens on: the last four weeks with data, i.e. the 28 factory days that end
 * on the last day with scans (or today on an empty floor, or when the data reaches today).
 */
export function defaultWindow(lastDataDay: string | null | undefined, today: string): DayRange {
  const to = lastDataDay && lastDataDay < today ? lastDataDay : today;
  return { from: dateOfDayNumber(dayNumberOfDate(to) - 27), to };
}

export interface WeekThroughput extends DayRange {
  orders: number;
  trays: number;
  pieces: number;
}

/** Daily throughput (buckets labelled with their factory day) summed into the given weeks (the same weeks as the yield table beside it). */
export function throughputByWeek(
  weeks: readonly DayRange[],
  days: readonly { label: string; orders: number; trays: number; pieces: number }[],
): WeekThroughput[] {
  return weeks.map((w) => {
    const inWeek = days.filter((d) => d.label >= w.from && d.label <= w.to);
    return {
      ...w,
      orders: inWeek.reduce((s, d) => s + d.orders, 0),
      trays: inWeek.reduce((s, d) => s + d.trays, 0),
      pieces: inWeek.reduce((s, d) => s + d.pieces, 0),
    };
  });
}
