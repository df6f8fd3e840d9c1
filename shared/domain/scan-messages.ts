// Plain-words answers for refused scans: what happened and what to do next. English here; the
// tablet says the same thing in its own language from the same code and params.

import type { RefusalParams } from './guards';
import { STATION_KIND_NAMES, type RejectionCode, type StationKind } from './vocabulary';

export interface PlainMessage {
  /** a few words, shown large */
  title: string;
  /** what happened */
  detail: string;
  /** what to do next */
  next: string;
}

function kindName(kind: unknown): string {
  return typeof kind === 'string' && kind in STATION_KIND_NAMES ? STATION_KIND_NAMES[kind as StationKind] : 'another';
}

function defaultTime(isoText: unknown): string {
  if (typeof isoText !== 'string') return 'an unknown time';
  const d = new Date(isoText);
  if (Number.isNaN(d.getTime())) return isoText;
  return `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

function plural(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

function stepLabel(name: unknown, seq: unknown): string {
  if (typeof name === 'string' && name) return typeof seq === 'number' ? `step ${seq} "${name}"` : `"${name}"`;
  return 'its next step';
}

/** What to say about a refused scan. `formatTime` lets a caller show times in its own zone. */
export function refusalMessage(code: RejectionCode, params: RefusalParams = {}, formatTime: (iso: unknown) => string = defaultTime): PlainMessage {
  const p = params;
  switch (code) {
    case 'unknown_tray':
      return {
        title: 'Tray not found',
        detail: 'This code or number does not belong to any tray.',
        next: 'Check the number on the traveller and type it again, or ask the planner.',
      };
    case 'void_traveller':
      return {
        title: 'Old traveller',
        detail:
          p.currentRevision != null ? `This traveller was replaced by a reprint (revision ${p.currentRevision}).` : 'This traveller was replaced by a reprint.',
        next: 'Use the newest traveller for this tray and throw this one away; ask the planner if you do not have it.',
      };
    case 'bad_signature':
      return {
        title: 'Traveller not genuine',
        detail: 'This code was not printed by this factory, or it was altered.',
        next: 'Do not work on this tray. Give it to the supervisor.',
      };
    case 'wrong_station': {
      const expected = kindName(p.expectedKind);
      if (p.action === 'finish') {
        return {
          title: 'Wrong station',
          detail: `This tray is in process at ${stepLabel(p.expectedName, p.expectedSeq)} (${expected}), not at ${kindName(p.stationKind)}.`,
          next: `Finish it at a ${expected} station, or ask a supervisor to override.`,
        };
      }
      return {
        title: 'Wrong station',
        detail: `This tray's next step is ${stepLabel(p.expectedName, p.expectedSeq)} at ${expected}, not ${kindName(p.stationKind)}.`,
        next: `Take the tray to ${expected}. If it must be done here, ask a supervisor to override.`,
      };
    }
    case 'not_started':
      return {
        title: 'Not started',
        detail: `${stepLabel(p.stepName, p.stepSeq)} of this tray was never started.`,
        next: 'Scan Start first, then Finish when the work is done.',
      };
    case 'already_started':
      return {
        title: 'Already started',
        detail: `This tray is already in ${stepLabel(p.stepName, p.stepSeq)} since ${formatTime(p.startedAt)}.`,
        next: 'Finish it first. If it was started by mistake, ask a supervisor.',
      };
    case 'curing': {
      const left = typeof p.minutesLeft === 'number' ? p.minutesLeft : 0;
      return {
        title: 'Still curing',
        detail: `The cure (${stepLabel(p.cureName, p.cureSeq)}) needs ${plural(left, 'more minute', 'more minutes')}; ready at ${formatTime(p.readyAt)}.`,
        next: 'Leave the tray in the oven and wait. Only a supervisor can let it out early.',
      };
    }
    case 'quantity_mismatch':
      return {
        title: 'Counts do not add up',
        detail: `Good ${p.good} + scrap ${p.scrap} must equal the ${p.quantityIn} pieces that came in${
          typeof p.rework === 'number' && p.rework > 0 ? `, and rework (${p.rework}) is part of good` : ''
        }.`,
        next: 'Count the pieces again and correct good and scrap.',
      };
    case 'on_hold':
      return {
        title: 'Tray on hold',
        detail: p.holdReason ? `This tray is on hold: ${p.holdReason}.` : 'This tray is on hold.',
        next: 'Do not work on it. A supervisor must release it first.',
      };
    case 'mould_not_ready':
      return {
        title: 'Mould not ready',
        detail: `The mould for this order is not ready, so ${stepLabel(p.stepName, p.stepSeq)} cannot start.`,
        next: 'Put the tray back and take another one. Ask the mould shop when the mould will be ready.',
      };
    case 'bad_time': {
      const detail =
        p.reason === 'future'
          ? `The scan's time (${formatTime(p.occurredAt)}) is ahead of the server clock.`
          : p.reason === 'too_old'
            ? `The scan's time (${formatTime(p.occurredAt)}) is more than 7 days ago.`
            : p.reason === 'before_release'
              ? `The scan's time (${formatTime(p.occurredAt)}) is before the tray was released (${formatTime(p.limit)}).`
              : p.reason === 'before_last_event'
                ? `The scan's time (${formatTime(p.occurredAt)}) is before this tray's last recorded scan (${formatTime(p.limit)}).`
                : 'The scan has no readable time.';
      return {
        title: 'Time is wrong',
        detail,
        next: 'Check the tablet clock and connection, then tell a supervisor so the scan can be corrected.',
      };
    }
    case 'not_on_hold':
      return {
        title: 'Not on hold',
        detail: 'This tray is not on hold, so there is nothing to release.',
        next: 'Carry on with the tray.',
      };
    case 'finished':
      return {
        title: 'Tray is finished',
        detail:
          p.phase === 'scrapped'
            ? 'Every piece of this tray was scrapped.'
            : p.phase === 'merged'
              ? 'This tray was merged into another tray.'
              : 'This tray has finished all its steps.',
        next: 'Check you scanned the right traveller. Ask a supervisor if the tray is still on the floor.',
      };
    case 'scrap_reason_missing':
      if (p.for === 'hold') {
        return {
          title: 'Reason needed',
          detail: p.reason ? `"${p.reason}" is not a known hold reason.` : 'A hold needs a reason.',
          next: 'Choose a reason from the list.',
        };
      }
      return {
        title: 'Scrap reason needed',
        detail: p.reason
          ? `"${p.reason}" is not a known scrap reason.`
          : `${plural(typeof p.scrap === 'number' ? p.scrap : 0, 'piece was', 'pieces were')} scrapped without a reason.`,
        next: 'Choose a scrap reason from the list.',
      };
    case 'bad_override':
      return p.reason === 'release_needs_supervisor'
        ? {
            title: 'Supervisor needed',
            detail: 'Only a supervisor can release a tray from hold.',
            next: 'Ask a supervisor to confirm with their badge and PIN.',
          }
        : {
            title: 'Override not valid',
            detail: 'The supervisor override for this scan is missing, used up, or for another tray.',
            next: 'Ask the supervisor to confirm again with their badge and PIN.',
          };
    case 'invalid_event':
      return {
        title: 'Scan not readable',
        detail: 'The scan was sent with missing or wrong details.',
        next: 'Scan the tray again. If it keeps happening, tell a supervisor.',
      };
    case 'station_not_allowed':
      return {
        title: 'Not this tablet’s station',
        detail: p.tabletStationName
          ? `This tablet is set up for ${p.tabletStationName}; the scan was for ${p.stationName ?? 'another station'}.`
          : `This tablet may record scans only at its own station; the scan was for ${p.stationName ?? 'another station'}.`,
        next: 'Scan the tray on the tablet at that station, or ask an administrator to move this tablet there.',
      };
    case 'badge_failures':
      return {
        title: 'Repeated wrong badge or PIN',
        detail: `${typeof p.failures === 'number' ? p.failures : 'Several'} wrong ${p.purpose === 'override' ? 'supervisor approvals' : 'sign-ins'} in a row${p.scope === 'badge' && p.badge ? ` for badge ${p.badge}` : ''}${p.device ? ` on ${p.device}` : ''}; that tablet must now wait before the next try.`,
        next: 'Check who is at the tablet. If nobody there forgot their PIN, switch the tablet off under Admin → Tablets and walls.',
      };
  }
}

/** One line for logs, API answers and the exceptions list. */
export function refusalText(code: RejectionCode, params: RefusalParams = {}): string {
  const m = refusalMessage(code, params);
  return `${m.title}. ${m.detail} ${m.next}`;
}
