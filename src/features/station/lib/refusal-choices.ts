// What the operator can do about a scan the tablet refused: ask a supervisor for an override
// (when the refusal is one a supervisor may lift), or send the scan anyway for the server to
// judge. Kept as data in the screen's state; the buttons are drawn from it.
import type { RejectionCode } from '@shared/domain/vocabulary';
import type { ScanEvent } from '@shared/schemas/scans';

export type OverridePanelKind = 'wrong_station' | 'curing' | 'release';
/** the scan to try again once a supervisor approved it */
export type RetryScan = Omit<ScanEvent, 'id' | 'occurredAt' | 'code' | 'stationId'>;

export interface RefusalChoices {
  code: RejectionCode;
  /** the override a supervisor can give, or null when none lifts this refusal */
  override: OverridePanelKind | null;
  retry: RetryScan;
  /** the refused scan as it was made, for "send anyway" */
  event: ScanEvent;
}

/** The supervisor's override that lifts a refusal: the cure interlock, a spent or wrong override (approve again), or the wrong station. */
export function overrideFor(code: RejectionCode, overridable: boolean): OverridePanelKind | null {
  if (code === 'bad_override') return 'release';
  if (!overridable) return null;
  return code === 'curing' ? 'curing' : 'wrong_station';
}
