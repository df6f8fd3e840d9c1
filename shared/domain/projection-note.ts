// How a projected ship date was found, as a code and its numbers: screens say it in the reader's
// language, and `projectionNoteEnglish` writes the English line the API has always sent beside it.
import { STATION_KIND_NAMES, type StationKind } from './vocabulary';
import { formatInstant } from './time-format';

export type ProjectionNote =
  /** released, but no trays on the floor yet */
  | { code: 'none' }
  /** every tray has finished its steps */
  | { code: 'all_done' }
  /** not released yet: nothing is projected */
  | { code: 'after_release' }
  /** the simple projection: standard times plus a fixed wait before each step */
  | { code: 'simple'; params: { queueMinutes: number } }
  /** the measured projection: sampled runs of the whole floor */
  | {
      code: 'measured';
      params: {
        expectedAt: string;
        p85At: string;
        runs: number;
        historyDays: number;
        remainingSteps: number;
        standardMinutes: number;
        drivingKind: StationKind | null;
        drivingWaitMinutes: number;
        traysOnHold: number;
      };
    };

export type ProjectionNoteCode = ProjectionNote['code'];

/** "2.5 h" below ten hours, "14 h" above. */
export function roundHours(minutes: number): number {
  const h = minutes / 60;
  return h < 10 ? Math.round(h * 10) / 10 : Math.round(h);
}

/** The note in English, with its times in the factory's zone. */
export function projectionNoteEnglish(note: ProjectionNote, timeZone: string): string {
  switch (note.code) {
    case 'none':
      return 'No trays on the floor yet, so there is nothing to project.';
    case 'all_done':
      return 'Every tray has finished its steps.';
    case 'after_release':
      return 'A ship date is projected once the order is released to the floor.';
    case 'simple':
      return `Projected from the standard time of every step still to do, ${note.params.queueMinutes === 60 ? 'an hour' : `${note.params.queueMinutes} minutes`} of waiting before each step, and the working week (ovens cure around the clock).`;
    case 'measured': {
      const p = note.params;
      const at = (iso: string) => formatInstant(iso, { locale: 'en', timeZone }, 'dayTime');
      const waits = p.drivingKind
        ? ` The longest waiting is at ${STATION_KIND_NAMES[p.drivingKind] ?? p.drivingKind} (about ${roundHours(p.drivingWaitMinutes)} h a run).`
        : '';
      return (
        `Expected ${at(p.expectedAt)}, and by ${at(p.p85At)} in 85 of ${p.runs} simulated runs of the whole floor: ` +
        `every open tray competes for the stations’ places, with handover, hold and process times measured over the last ${p.historyDays} days, on the working calendar. ` +
        `The tray with the most work has ${p.remainingSteps} step${p.remainingSteps === 1 ? '' : 's'} left: ${roundHours(p.standardMinutes)} h of standard work.` +
        waits +
        (p.traysOnHold ? ` ${p.traysOnHold} tray${p.traysOnHold === 1 ? ' is' : 's are'} on hold.` : '')
      );
    }
  }
}
