import type { WipResponse } from './reports';

/** `scan` Server-Sent Event: one accepted scan, as the wall shows it. */
export interface ScanNotice {
  id: string;
  type: string;
  trayId: string;
  trayNumber: string;
  stationId: string | null;
  stationName: string | null;
  stationKind: string | null;
  occurredAt: string;
}

export interface WallView {
  asOf: string;
  timeZone: string;
  wip: WipResponse;
  curing: { trayId: string; number: string; orderNumber: string; stationName: string | null; readyAt: string; pieces: number; stepName: string | null }[];
  /** reason: the hold reason's name; reasonZh its Chinese name where the admin gave one */
  holds: { trayId: string; number: string; orderNumber: string; stationKind: string; reason: string | null; reasonZh: string | null; pieces: number }[];
  oldest: { stationKind: string; trayNumber: string; orderNumber: string; minutes: number }[];
  refusals: { id: string; code: string; message: string; at: string; trayNumber: string | null; stationName: string | null; userName: string | null }[];
  overrides: {
    id: string;
    kind: string;
    reason: string;
    at: string;
    trayNumber: string;
    stationName: string | null;
    supervisorName: string | null;
    used: boolean;
  }[];
  atRisk: {
    orderId: string;
    number: string;
    customer: string;
    title: string;
    dueDate: string | null;
    expectedAt: string | null;
    p85At: string | null;
    risk: 'late' | 'at_risk';
  }[];
  bottleneck: { stationKind: string; waitingTrays: number; capacityTrays: number; ratio: number } | null;
}
