// The tablet's own database (IndexedDB through Dexie): the outbox of scans, the cached travellers
// its guards need offline, waiting QC photos, and small settings. A scan is written here before
// anything else happens, so closing the tab, losing the network or a crash never loses it.
import Dexie, { type EntityTable } from 'dexie';
import type { ScanEvent, ScanTray, TrayCard } from '@shared/schemas/scans';
import type { OverrideKind, RefusalParams } from '@shared/domain/guards';
import type { RejectionCode, Role } from '@shared/domain/vocabulary';

export type OutboxStatus = 'pending' | 'accepted' | 'rejected';

export interface OutboxEntry {
  /** insertion order: the order events are sent in */
  seq?: number;
  id: string;
  event: ScanEvent;
  trayNumber: string;
  status: OutboxStatus;
  /** the tablet's own verdict when the scan was made (null: tray unknown to the tablet) */
  local: { ok: boolean; code?: RejectionCode } | null;
  /** the guard the event's supervisor override names, so the tablet can replay it */
  overrideKind?: OverrideKind;
  createdAt: number;
  attempts: number;
  /** server time of the answer */
  answeredAt?: string;
  code?: RejectionCode;
  message?: string;
  params?: RefusalParams;
  minutesLeft?: number;
  tray?: ScanTray;
  /** the operator saw the server's refusal and dismissed it from the screen */
  seen?: boolean;
}

export interface CachedCard {
  number: string;
  card: TrayCard;
  /** server time of the list or lookup it came from */
  asOf: string;
}

export interface PendingPhoto {
  seq?: number;
  id: string;
  code: string;
  trayNumber: string;
  eventId?: string;
  blob: Blob;
  createdAt: number;
  status: 'pending' | 'sent' | 'failed';
  attempts: number;
  operatorId?: string;
}

/** A PIN check for fast switching while offline (see pin-verifier.ts). */
export interface KnownOperator {
  badge: string;
  id: string;
  name: string;
  role: Role;
  salt: string;
  verifier: string;
  /** until when this person may sign in here without the server */
  validUntil: number;
}

export interface MetaRow {
  key: string;
  value: unknown;
}

export class StationDb extends Dexie {
  outbox!: EntityTable<OutboxEntry, 'seq'>;
  cards!: EntityTable<CachedCard, 'number'>;
  photos!: EntityTable<PendingPhoto, 'seq'>;
  operators!: EntityTable<KnownOperator, 'badge'>;
  meta!: EntityTable<MetaRow, 'key'>;

  constructor(name = 'trayce-station') {
    super(name);
    this.version(1).stores({
      outbox: '++seq, &id, status, trayNumber, createdAt',
      cards: 'number',
      photos: '++seq, &id, status',
      operators: 'badge, id',
      meta: 'key',
    });
  }

  async getMeta<T>(key: string): Promise<T | undefined> {
    return (await this.meta.get(key))?.value as T | undefined;
  }

  async setMeta(key: string, value: unknown): Promise<void> {
    await this.meta.put({ key, value });
  }
}

let shared: StationDb | null = null;
export function stationDb(): StationDb {
  shared ??= new StationDb();
  return shared;
}
