// The outbox's sync loop: sends waiting scans in batches of up to 500 to POST /api/scans, marks
// each by the server's answer, measures the clock offset on every round trip, and retries with
// back-off when the network or the server is away. Event ids are made on the tablet, so a batch
// sent twice (say the answer was lost when the server restarted) changes nothing on the server.
import { bestOffset, type ClockOffset, type ClockSample } from '@shared/domain/clock-offset';
import { MAX_SCAN_BATCH, type ScanBatchResponse, type ScanEvent } from '@shared/schemas/scans';
import { retryDelayMs } from './backoff';
import type { OutboxEntry, PendingPhoto, StationDb } from './station-db';

export interface SyncTransport {
  postScans(events: ScanEvent[]): Promise<ScanBatchResponse>;
  clock(): Promise<{ serverTime: string }>;
  uploadPhoto(photo: PendingPhoto): Promise<void>;
}

/** A failure the transport reports: `status` 0 means the server could not be reached. */
export interface TransportFailure {
  status: number;
  code?: string;
}

export interface SyncStatus {
  /** the last request reached the server (and the browser says it is online) */
  online: boolean;
  /** scans waiting to be sent */
  pending: number;
  /** scans the server refused that the operator has not dismissed */
  refusedUnseen: number;
  photosPending: number;
  sending: boolean;
  lastSyncAt: number | null;
  offset: ClockOffset | null;
  nextRetryAt: number | null;
  /** the device token was refused: the tablet must be paired again */
  unpaired: boolean;
  /** the outbox has been read from the tablet's storage (counts before that mean nothing) */
  ready: boolean;
}

const SAMPLES_KEY = 'clockSamples';
const MAX_SAMPLES = 8;
const HEARTBEAT_MS = 30_000;
const KEEP_ANSWERED_MS = 3 * 24 * 3600_000;

function failureOf(error: unknown): TransportFailure {
  const e = error as { status?: unknown; code?: unknown };
  return { status: typeof e?.status === 'number' ? e.status : 0, code: typeof e?.code === 'string' ? e.code : undefined };
}

export class SyncEngine {
  private readonly listeners = new Set<() => void>();
  private readonly syncedListeners = new Set<(accepted: number) => void>();
  private status: SyncStatus = {
    online: typeof navigator === 'undefined' ? true : navigator.onLine,
    pending: 0,
    refusedUnseen: 0,
    photosPending: 0,
    sending: false,
    lastSyncAt: null,
    offset: null,
    nextRetryAt: null,
    unpaired: false,
    ready: false,
  };
  private samples: ClockSample[] = [];
  private attempt = 0;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private heartbeat: ReturnType<typeof setInterval> | null = null;
  private running: Promise<void> | null = null;
  private again = false;
  private started = false;
  private readonly onOnline = () => {
    this.attempt = 0;
    this.kick();
  };
  private readonly onOffline = () => this.update({ online: false });

  constructor(
    readonly db: StationDb,
    private readonly transport: SyncTransport,
    private readonly clock: () => number = () => Date.now(),
  ) {}

  // --- state for the screen -------------------------------------------------------------
  subscribe = (fn: () => void) => {
    this.listeners.add(fn);
    return () => this.listeners.delete(fn);
  };
  getStatus = () => this.status;
  /** Called after a sync in which the server accepted scans (the screen refreshes its lists). */
  onSynced(fn: (accepted: number) => void) {
    this.syncedListeners.add(fn);
    return () => this.syncedListeners.delete(fn);
  }

  private update(patch: Partial<SyncStatus>) {
    this.status = { ...this.status, ...patch };
    for (const fn of this.listeners) fn();
  }

  /** Server time now, as well as this tablet knows it. */
  now(): number {
    return this.clock() + (this.status.offset?.offsetMs ?? 0);
  }

  async init(): Promise<void> {
    this.samples = (await this.db.getMeta<ClockSample[]>(SAMPLES_KEY)) ?? [];
    // Answered scans are kept a few days for the operator's list, then dropped; waiting ones never.
    const cutoff = this.clock() - KEEP_ANSWERED_MS;
    await this.db.outbox
      .where('createdAt')
      .below(cutoff)
      .and((e) => e.status !== 'pending')
      .delete();
    this.update({ offset: bestOffset(this.samples) });
    await this.refreshCounts();
    this.update({ ready: true });
  }

  start() {
    if (this.started) return;
    this.started = true;
    if (typeof window !== 'undefined') {
      window.addEventListener('online', this.onOnline);
      window.addEventListener('offline', this.onOffline);
    }
    this.heartbeat = setInterval(() => {
      if (!this.status.sending && this.status.pending === 0 && this.status.photosPending === 0) void this.ping();
      else this.kick();
    }, HEARTBEAT_MS);
    this.kick();
  }

  stop() {
    this.started = false;
    if (typeof window !== 'undefined') {
      window.removeEventListener('online', this.onOnline);
      window.removeEventListener('offline', this.onOffline);
    }
    if (this.timer) clearTimeout(this.timer);
    if (this.heartbeat) clearInterval(this.heartbeat);
    this.timer = null;
    this.heartbeat = null;
  }

  /** Write a scan to the outbox first; only then is it on its way. */
  async add(event: ScanEvent, meta: { trayNumber: string; local: OutboxEntry['local']; overrideKind?: OutboxEntry['overrideKind'] }): Promise<void> {
    await this.db.outbox.add({
      id: event.id,
      event,
      trayNumber: meta.trayNumber,
      status: 'pending',
      local: meta.local,
      ...(meta.overrideKind ? { overrideKind: meta.overrideKind } : {}),
      createdAt: this.clock(),
      attempts: 0,
    });
    await this.refreshCounts();
    this.kick();
  }

  async addPhoto(photo: Omit<PendingPhoto, 'status' | 'attempts' | 'createdAt'>): Promise<void> {
    await this.db.photos.add({ ...photo, status: 'pending', attempts: 0, createdAt: this.clock() });
    await this.refreshCounts();
    this.kick();
  }

  async markSeen(id: string) {
    await this.db.outbox.where('id').equals(id).modify({ seen: true });
    await this.refreshCounts();
  }

  async refreshCounts() {
    const [pending, refusedUnseen, photosPending] = await Promise.all([
      this.db.outbox.where('status').equals('pending').count(),
      this.db.outbox
        .where('status')
        .equals('rejected')
        .and((e) => !e.seen)
        .count(),
      this.db.photos.where('status').equals('pending').count(),
    ]);
    this.update({ pending, refusedUnseen, photosPending });
  }

  /** Ask for a sync as soon as possible (after a scan, when the network returns). */
  kick() {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    this.update({ nextRetryAt: null });
    void this.syncNow();
  }

  private schedule(delayMs: number) {
    if (!this.started) return;
    if (this.timer) clearTimeout(this.timer);
    this.update({ nextRetryAt: this.clock() + delayMs });
    this.timer = setTimeout(() => {
      this.timer = null;
      void this.syncNow();
    }, delayMs);
  }

  /** One sync run: every waiting scan (in batches), then waiting photos. Resolves when done. */
  syncNow(): Promise<void> {
    if (this.running) {
      this.again = true;
      return this.running;
    }
    this.running = (async () => {
      this.update({ sending: true });
      try {
        do {
          this.again = false;
          await this.sendScans();
          await this.sendPhotos();
        } while (this.again);
        this.attempt = 0;
        this.update({ online: true, unpaired: false, lastSyncAt: this.clock() });
      } catch (error) {
        const f = failureOf(error);
        this.attempt += 1;
        this.update({ online: f.status !== 0 && (typeof navigator === 'undefined' || navigator.onLine), unpaired: f.status === 401 });
        this.schedule(retryDelayMs(this.attempt));
      } finally {
        this.update({ sending: false });
        this.running = null;
        await this.refreshCounts();
      }
    })();
    return this.running;
  }

  private async sendScans() {
    for (;;) {
      const batch = await this.db.outbox.where('status').equals('pending').sortBy('seq');
      if (batch.length === 0) return;
      const part = batch.slice(0, MAX_SCAN_BATCH);
      await this.db.outbox.bulkUpdate(part.map((e) => ({ key: e.seq!, changes: { attempts: e.attempts + 1 } })));
      const sentAt = this.clock();
      const response = await this.transport.postScans(part.map((e) => e.event));
      const receivedAt = this.clock();
      await this.recordSample({ sentAt, serverTime: Date.parse(response.serverTime), receivedAt });
      let accepted = 0;
      await this.db.transaction('rw', this.db.outbox, async () => {
        for (const r of response.results) {
          const entry = await this.db.outbox.where('id').equals(r.id).first();
          if (!entry) continue;
          const refused = r.status === 'rejected' || (r.status === 'duplicate' && !!r.code);
          if (!refused) accepted += 1;
          await this.db.outbox.update(entry.seq!, {
            status: refused ? 'rejected' : 'accepted',
            answeredAt: response.serverTime,
            code: r.code,
            message: r.message,
            params: r.params,
            minutesLeft: r.minutesLeft,
            tray: r.tray,
          });
        }
      });
      this.update({ online: true });
      await this.refreshCounts();
      if (accepted) for (const fn of this.syncedListeners) fn(accepted);
      if (part.length < MAX_SCAN_BATCH) return;
    }
  }

  private async sendPhotos() {
    const waiting = await this.db.photos.where('status').equals('pending').sortBy('seq');
    for (const photo of waiting) {
      try {
        await this.transport.uploadPhoto(photo);
        await this.db.photos.update(photo.seq!, { status: 'sent' });
      } catch (error) {
        const f = failureOf(error);
        if (f.status >= 400 && f.status < 500 && f.status !== 401 && f.status !== 429) {
          // the server will never take this one (unknown tray, not a picture): keep it, stop trying
          await this.db.photos.update(photo.seq!, { status: 'failed', attempts: photo.attempts + 1 });
        } else throw error;
      }
    }
  }

  private async ping() {
    try {
      const sentAt = this.clock();
      const { serverTime } = await this.transport.clock();
      await this.recordSample({ sentAt, serverTime: Date.parse(serverTime), receivedAt: this.clock() });
      this.update({ online: true, unpaired: false });
    } catch (error) {
      const f = failureOf(error);
      this.update({ online: f.status !== 0, unpaired: f.status === 401 });
    }
  }

  private async recordSample(sample: ClockSample) {
    if (!Number.isFinite(sample.serverTime)) return;
    this.samples = [...this.samples, sample].slice(-MAX_SAMPLES);
    await this.db.setMeta(SAMPLES_KEY, this.samples);
    this.update({ offset: bestOffset(this.samples) });
  }
}
