// The simulator's records: what it is given (stations, travellers, orders, people) and what it
// writes (scan events, refused scans, supervisor overrides, the final tray states), and the
// travellers and orders as it carries them along.
import type { Rng } from '../prng';
import type { Role, RoutingStep, ScanType, StationKind, TrayState } from '@shared/domain/vocabulary';

export interface SimStation {
  id: string;
  code: string;
  name: string;
  kind: StationKind;
  capacity: number;
  deviceId: string;
}

export interface SimTraveller {
  id: string;
  number: string;
  kind: 'tray' | 'mould';
  orderId: string;
  /** for a mould traveller: the mould it makes or checks */
  mouldId?: string | null;
  quantity: number;
  releasedAt: number;
  routing: RoutingStep[];
  /** the state the release wrote (default: waiting for step 1) */
  initial?: TrayState;
}

export interface SimOrder {
  id: string;
  releasedAt: number;
  /** false: released but nothing scanned yet */
  startsOnFloor: boolean;
  /** the whole order is put on hold from this moment */
  holdAt: number | null;
  holdNote: string | null;
  /** packed and kept back (not collected by the courier) */
  keepFromCourier: boolean;
}

export interface SimPeople {
  operatorsByKind: Partial<Record<StationKind, string[]>>;
  supervisors: string[];
  roleOf: ReadonlyMap<string, Role>;
}

export interface SimEvent {
  id: string;
  trayId: string;
  type: ScanType;
  stepSeq: number | null;
  stationId: string;
  stationKind: StationKind;
  deviceId: string;
  userId: string;
  occurredAt: number;
  receivedAt: number;
  qtyIn: number | null;
  goodQty: number | null;
  scrapQty: number | null;
  reworkQty: number | null;
  scrapReason: string | null;
  overrideId: string | null;
  note: string | null;
}

export interface SimRejection {
  id: string;
  eventId: string;
  trayId: string;
  stationId: string;
  deviceId: string;
  userId: string;
  code: string;
  message: string;
  payload: Record<string, unknown>;
  occurredAt: number;
  receivedAt: number;
}

export interface SimOverride {
  id: string;
  trayId: string;
  stationId: string;
  kind: 'wrong_station' | 'curing';
  supervisorId: string;
  reason: string;
  createdAt: number;
  expiresAt: number;
  usedEventId: string;
}

export interface SimResult {
  events: SimEvent[];
  states: Map<string, TrayState>;
  rejections: SimRejection[];
  overrides: SimOverride[];
  /** per traveller: when its pack step finished and when its last step finished */
  packedAt: Map<string, number>;
  finishedAt: Map<string, number>;
}

export interface SimInput {
  rng: Rng;
  now: number;
  stations: SimStation[];
  people: SimPeople;
  orders: SimOrder[];
  travellers: SimTraveller[];
  /** every reason code the admin has (scrap, rework and hold) */
  reasonCodes: readonly { code: string; kind: 'scrap' | 'rework' | 'hold'; stationKind?: StationKind | null }[];
}

/** A traveller on its way through the simulated floor. */
export interface Live extends SimTraveller {
  state: TrayState;
  /** seq of the next step to do */
  nextSeq: number;
  stopped: boolean;
  hadHold: boolean;
  dispatchCleared: boolean;
  last: number;
  lastReceived: number;
}

/** An order on the simulated floor: its trays, its moulds and who waits for the courier. */
export interface OrderRun extends SimOrder {
  trays: Live[];
  moulds: Live[];
  mouldsLeft: number;
  mouldsReadyAt: number | null;
  dispatchWaiting: Map<string, number>;
}
