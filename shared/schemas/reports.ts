import type { ProjectionNote } from '@shared/domain/projection-note';
import { z } from 'zod';
import { PROCESSES } from '../domain/vocabulary';
import type { Summary } from '../domain/stats';

export type { Summary };

// A day ("2025-06-01", a whole local day in the factory's zone) or an instant (ISO 8601).
const dayOrInstant = z.union([z.iso.date(), z.iso.datetime({ offset: true })], { error: 'Use a date (YYYY-MM-DD) or an ISO 8601 time' });

export const reportQuery = z.object({
  from: dayOrInstant.optional(),
  to: dayOrInstant.optional(),
  process: z.enum(PROCESSES).optional(),
  customerId: z.string().min(1).max(64).optional(),
  stationId: z.string().min(1).max(64).optional(),
  bucket: z.enum(['day', 'week']).default('day'),
});
export type ReportQuery = z.infer<typeof reportQuery>;

export interface ReportWindow {
  from: string;
  to: string;
  timeZone: string;
  percentileMethod: string;
}

export interface LeadTimeOrder {
  orderId: string;
  number: string;
  customer: string;
  title: string;
  process: string;
  releasedAt: string;
  shippedAt: string;
  calendarHours: number;
  workingHours: number;
  dueDate: string;
  onTime: boolean;
}

export interface LeadTimeReport {
  window: ReportWindow;
  orders: LeadTimeOrder[];
  /** calendar hours */
  summary: Summary;
  summaryWorkingHours: Summary;
  trend: { week: string; n: number; p50: number | null; p85: number | null; onTime: number }[];
}

export interface CycleTimeKind {
  stationKind: string;
  /** calendar minutes (the clock, nights and days off included) */
  process: Summary;
  queue: Summary;
  /** working minutes of the station's calendar */
  processWorking: Summary;
  queueWorking: Summary;
}

/** Flow efficiency with every time in one unit. */
export interface FlowEfficiencyFigures {
  /** value-adding time: start to finish at the stations, cure steps not included */
  processMinutes: number;
  /** time in the oven, reported apart */
  cureMinutes: number;
  /** release to done */
  flowMinutes: number;
  /** process / flow */
  flowEfficiency: number | null;
  /** cure / flow */
  cureShare: number | null;
}

export interface CycleTimeReport {
  window: ReportWindow;
  stations: CycleTimeKind[];
  /** value-adding process time over flow time of the trays finished in the window */
  flowEfficiency: {
    trays: number;
    /** the unit of the headline figure: working minutes of the factory calendar */
    unit: 'working_minutes';
    /** oven cure is not counted as value-adding (it is needed but unattended); its share is shown apart */
    cureValueAdding: false;
    /** every time in working minutes of the factory calendar */
    working: FlowEfficiencyFigures;
    /** every time in calendar minutes */
    calendar: FlowEfficiencyFigures;
  };
}

export interface FlowBucket {
  label: string;
  start: string;
  end: string;
  /** per stage, trays that had reached it (or a later stage) by the bucket's end, less those shipped before the window */
  cumulative: number[];
  /** trays shipped in the bucket */
  trays: number;
  pieces: number;
  orders: number;
  wipAverage: number;
  wipAtEnd: number;
}

export interface FlowReport {
  window: ReportWindow;
  bucket: 'day' | 'week';
  stages: string[];
  buckets: FlowBucket[];
}

export interface OnTimeReport {
  window: ReportWindow;
  bucket: 'day' | 'week';
  buckets: { label: string; shipped: number; onTime: number; share: number | null }[];
  total: { shipped: number; onTime: number; share: number | null };
}

export interface YieldStep {
  stationKind: string;
  inQty: number;
  firstPassQty: number;
  goodQty: number;
  scrapQty: number;
  reworkQty: number;
  firstPassYield: number | null;
  finalYield: number | null;
}

export interface YieldOrder {
  orderId: string;
  number: string;
  customer: string;
  shippedAt: string | null;
  steps: number;
  inQty: number;
  goodQty: number;
  reworkQty: number;
  rolledThroughputYield: number | null;
  finalYield: number | null;
}

export interface YieldReport {
  window: ReportWindow;
  steps: YieldStep[];
  orders: YieldOrder[];
  scrap: { reason: string; name: string; qty: number; share: number; cumulativeShare: number }[];
  rework: { qty: number };
}

export interface WipCount {
  trays: number;
  pieces: number;
}

export interface WipKind {
  stationKind: string;
  waiting: WipCount;
  inProcess: WipCount;
  curing: WipCount;
  held: number;
  moulds: number;
  oldestMinutes: number | null;
  stations: { stationId: string; code: string; name: string; inProcess: WipCount; curing: WipCount }[];
}

export interface WipResponse {
  asOf: string;
  kinds: WipKind[];
  totals: { trays: number; pieces: number; moulds: number };
}

export interface OrderProjection {
  orderId: string;
  expectedAt: string | null;
  p85At: string | null;
  dueDate: string | null;
  late: boolean;
  /** one or two lines saying how the dates were found (English) */
  explanation: string;
  /** the same as a code and its numbers, for screens in any language */
  explanationNote: ProjectionNote;
}

export interface LateRiskOrder extends OrderProjection {
  number: string;
  customer: string;
  title: string;
  status: string;
  /** working hours between the due date's end and the expected date (positive: late) */
  slackHours: number | null;
  risk: 'late' | 'at_risk';
}
