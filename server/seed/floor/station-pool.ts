// The floor's places and people: each station works on as many trays at once as its capacity
// (a tray takes the place that is free first), and each station kind has its crew (the member
// who is free first takes the next tray).
import type { StationKind } from '@shared/domain/vocabulary';
import type { Rng } from '../prng';
import type { SimPeople, SimStation } from './types';

/** Minutes a station's work holds the person (absent: the whole process time). The oven and the
 * plating bath work on their own once loaded; the courier collects. */
const PERSON_MINUTES: Partial<Record<StationKind, number>> = { cure: 5, plate: 0, dispatch: 0 };

export interface Slot {
  station: SimStation;
  freeAt: number;
}

export class StationPool {
  private readonly slots = new Map<StationKind, Slot[]>();
  private readonly busyUntil = new Map<string, number>();

  constructor(
    stations: readonly SimStation[],
    private readonly people: SimPeople,
    private readonly rng: Rng,
  ) {
    for (const s of stations) {
      const list = this.slots.get(s.kind) ?? [];
      for (let i = 0; i < s.capacity; i++) list.push({ station: s, freeAt: 0 });
      this.slots.set(s.kind, list);
    }
  }

  /** the first station of a kind (where a hold or a refused scan is made) */
  firstStation(kind: StationKind): SimStation {
    return this.freestSlots(kind)[0].station;
  }

  /** the place of this kind that is free first */
  freestSlot(kind: StationKind): Slot {
    const candidates = this.freestSlots(kind);
    let slot = candidates[0];
    for (const c of candidates) if (c.freeAt < slot.freeAt) slot = c;
    return slot;
  }

  private freestSlots(kind: StationKind): Slot[] {
    const list = this.slots.get(kind);
    if (!list?.length) throw new Error(`no station of kind ${kind}`);
    return list;
  }

  /** any crew member of the kind (a scan without a planned person) */
  anyOperator(kind: StationKind): string {
    return this.rng.pick(this.people.operatorsByKind[kind] ?? this.people.supervisors);
  }

  supervisor(): string {
    return this.rng.pick(this.people.supervisors);
  }

  /** the crew member of this station kind who is free first */
  crewFor(kind: StationKind): string {
    const crew = this.people.operatorsByKind[kind] ?? this.people.supervisors;
    let best = crew[0];
    for (const c of crew) if (this.personFreeAt(c) < this.personFreeAt(best)) best = c;
    return best;
  }

  /** minutes the kind's work holds its person, or null when it holds them throughout */
  personMinutes(kind: StationKind): number | null {
    return PERSON_MINUTES[kind] ?? null;
  }

  /** when the person is free again (0: now) */
  personFreeAt(person: string): number {
    return this.busyUntil.get(person) ?? 0;
  }

  setPersonBusy(person: string, until: number) {
    this.busyUntil.set(person, until);
  }
}
