// The tablet's own copy of the guards: the same pure state machine the server runs, fed with the
// travellers cached from the station's list and the scans still on their way. The server stays
// the authority; this gives the operator the right answer at once, also offline.
import { evaluateScan, type GuardResult, type GuardStation, type OverrideKind, type TravellerVerdict, type ValidOverride } from '@shared/domain/guards';
import { parseTravellerCode } from '@shared/domain/traveller-code';
import type { Role, TrayState } from '@shared/domain/vocabulary';
import type { ScanEvent, TrayCard } from '@shared/schemas/scans';
import type { OutboxEntry } from './station-db';

/** What the tablet can tell about a code without the server's key: unreadable, or an older revision. */
export function localVerdict(code: string, card: TrayCard | null): TravellerVerdict {
  const parsed = parseTravellerCode(code);
  if (!parsed) return { status: 'unknown' };
  if (card && parsed.form === 'qr' && parsed.revision !== card.tray.revision) {
    return { status: 'void', currentRevision: card.tray.revision, currentNumber: card.tray.number };
  }
  return { status: 'valid' };
}

/**
 * The traveller's state as this tablet should see it: the server's state from the cached card,
 * with this tablet's scans replayed on top that the server had not yet counted when the card was
 * fetched (still waiting, or answered after `asOf`). Replays that the guards refuse change nothing,
 * so replaying a scan the server already counted is harmless.
 */
export function replayState(card: TrayCard, asOf: string, entries: readonly OutboxEntry[], station: GuardStation, now: number, role: Role | null): TrayState {
  let state = card.state;
  const own = [...entries].filter((e) => e.trayNumber === card.tray.number).sort((a, b) => (a.seq ?? 0) - (b.seq ?? 0));
  for (const e of own) {
    if (e.status === 'rejected') continue;
    if (e.status === 'accepted' && e.answeredAt && e.answeredAt <= asOf) continue;
    const r = evaluateScan({
      state,
      routing: card.routing,
      station,
      event: e.event,
      now,
      mouldReady: card.mouldReady,
      override: e.event.overrideId && e.overrideKind ? localOverride({ id: e.event.overrideId, kind: e.overrideKind }) : null,
      actorRole: role,
    });
    if (r.ok) state = r.next;
  }
  return state;
}

/** The tablet knows an override's id and guard; the server checks who gave it and why. */
function localOverride(o: { id: string; kind: OverrideKind }): ValidOverride {
  return { id: o.id, kind: o.kind, supervisorId: '', reason: '' };
}

export function evaluateLocal(input: {
  card: TrayCard;
  state: TrayState;
  station: GuardStation;
  event: Pick<ScanEvent, 'type' | 'occurredAt' | 'goodQty' | 'scrapQty' | 'reworkQty' | 'scrapReason' | 'note' | 'code'>;
  now: number;
  role: Role | null;
  /** a supervisor's override given on this tablet: its id and the one guard it names */
  override?: { id: string; kind: OverrideKind } | null;
  reasonCodes?: readonly string[] | null;
}): GuardResult {
  return evaluateScan({
    traveller: localVerdict(input.event.code, input.card),
    state: input.state,
    routing: input.card.routing,
    station: input.station,
    event: input.event,
    now: input.now,
    mouldReady: input.card.mouldReady,
    override: input.override ? localOverride(input.override) : null,
    actorRole: input.role,
    reasonCodes: input.reasonCodes,
  });
}
