import { describe, expect, it } from 'vitest';
import { evaluateLocal, localVerdict, replayState } from './local-guard';
import { initialTrayState, type RoutingStep } from '@shared/domain/vocabulary';
import type { TrayCard } from '@shared/schemas/scans';
import type { OutboxEntry } from './station-db';

const routing: RoutingStep[] = [
  { seq: 1, name: 'Trimming', stationKind: 'trim', trayMinutes: 5, pieceMinutes: 0.1 },
  { seq: 2, name: 'Polishing', stationKind: 'polish', trayMinutes: 5, pieceMinutes: 0.1 },
];
const T = Date.parse('2025-06-02T08:00:00.000Z');
const at = (m: number) => new Date(T + m * 60_000).toISOString();
const card: TrayCard = {
  tray: { id: 't1', number: '1042-07', kind: 'tray', revision: 2, releasedQuantity: 50 },
  order: null,
  state: { ...initialTrayState({ trayId: 't1', kind: 'tray', quantity: 50, releasedAt: at(0) }), lastEventAt: null },
  routing,
  mouldReady: true,
  artworkUrl: null,
};
const trim = { id: 'st-trim', kind: 'trim' as const };
const entry = (seq: number, type: 'start' | 'finish', m: number, status: OutboxEntry['status'] = 'pending', answeredAt?: string): OutboxEntry => ({
  seq,
  id: `e${seq}`,
  event: { id: `00000000-0000-4000-8000-00000000000${seq}`, code: '1042-07', stationId: 'st-trim', type, occurredAt: at(m) },
  trayNumber: '1042-07',
  status,
  local: { ok: true },
  createdAt: T,
  attempts: 0,
  answeredAt,
});

describe('the tablet’s view of a traveller', () => {
  it('replays scans still waiting in the outbox on top of the cached state', () => {
    const s = replayState(card, at(0), [entry(1, 'start', 5), entry(2, 'finish', 10)], trim, T + 3600_000, 'operator');
    expect(s).toMatchObject({ phase: 'waiting', stepSeq: 2 });
  });

  it('skips scans the server counted before the card was fetched, and refused ones', () => {
    const s = replayState(card, at(30), [entry(1, 'start', 5, 'accepted', at(6)), entry(2, 'finish', 10, 'rejected')], trim, T + 3600_000, 'operator');
    expect(s).toMatchObject({ phase: 'waiting', stepSeq: 1 });
  });

  it('a scan answered after the card was fetched still counts', () => {
    const s = replayState(card, at(1), [entry(1, 'start', 5, 'accepted', at(6))], trim, T + 3600_000, 'operator');
    expect(s.phase).toBe('in_process');
  });

  it('tells an older printed revision apart without the server key', () => {
    expect(localVerdict('T1:1042-07:1:AAAAAAAAAAAAAAAA', card)).toMatchObject({ status: 'void', currentRevision: 2 });
    expect(localVerdict('T1:1042-07:2:AAAAAAAAAAAAAAAA', card)).toEqual({ status: 'valid' });
    expect(localVerdict('1042-07', card)).toEqual({ status: 'valid' });
    expect(localVerdict('hello', card)).toEqual({ status: 'unknown' });
  });

  it('gives the same answer as the server’s guards (wrong station offline)', () => {
    const r = evaluateLocal({
      card,
      state: card.state,
      station: { id: 'p', kind: 'polish' },
      event: { type: 'start', code: '1042-07', occurredAt: at(5) },
      now: T + 3600_000,
      role: 'operator',
    });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.code).toBe('wrong_station');
  });
});
