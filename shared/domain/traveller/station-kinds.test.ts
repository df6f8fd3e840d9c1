import { describe, expect, it } from 'vitest';
import { LOAD_KINDS, LOAD_KIND_TRAITS, OVEN_KIND, STATION_KIND_TRAITS, cures, kindTraits, kindsWhere, loadStationKind, needsMould } from './station-kinds';
import { floorPlace, effectivePhase } from './phase';
import { STATION_KINDS, initialTrayState } from '../vocabulary';
import { DEFAULT_ROUTING_TEMPLATES, expandRouting, mouldRouting } from '../routing';

describe('station kind traits: one row per kind', () => {
  it('has a row for every kind and no other', () => {
    expect(Object.keys(STATION_KIND_TRAITS).sort()).toEqual([...STATION_KINDS].sort());
  });

  it('one oven kind; it takes oven loads and is the kind of every cure step the default routings make', () => {
    expect(kindsWhere((t) => t.cures)).toEqual([OVEN_KIND]);
    expect(loadStationKind('cure')).toBe(OVEN_KIND);
    const steps = expandRouting(DEFAULT_ROUTING_TEMPLATES.hard_enamel, {
      process: 'hard_enamel',
      colours: [{}, {}],
      backLogo: false,
      printing: false,
      epoxy: true,
      backing: { type: 'butterfly_clutch', count: 1 },
      plating: 'gold',
      secondPlating: null,
      sandblast: false,
    });
    // every step with a minimum cure time is at the oven, and every oven step has one
    for (const s of steps) expect(s.cureMinutes != null, s.name).toBe(cures(s.stationKind));
  });

  it('striking and casting need the moulds (common practice); the mould shop makes and checks them', () => {
    expect(kindsWhere((t) => t.needsMould).sort()).toEqual(['cast', 'strike']);
    expect(mouldRouting({ reuse: false }).map((s) => kindTraits(s.stationKind).mouldShop)).toEqual(['make', 'check']);
  });

  it('packing and dispatch are the milestones, in that order', () => {
    expect(kindsWhere((t) => t.milestone != null).map((k) => STATION_KIND_TRAITS[k].milestone)).toEqual(['packed', 'dispatched']);
  });

  it('every load kind has one station kind that does its work', () => {
    for (const l of LOAD_KINDS) {
      expect(kindsWhere((t) => t.loads === l)).toHaveLength(1);
      expect(LOAD_KIND_TRAITS[l].label('x')).toContain('x');
    }
  });

  it('a kind read from storage that the code does not know has none of the special traits', () => {
    expect(cures('kiln')).toBe(false);
    expect(needsMould(null)).toBe(false);
    expect(kindTraits('__proto__').milestone).toBeNull();
  });
});

describe('effective phase and the floor reading: a cured tray waits for its next step', () => {
  const t0 = Date.parse('2026-06-01T08:00:00Z');
  const curing = {
    ...initialTrayState({ trayId: 't', kind: 'tray', quantity: 10, releasedAt: new Date(t0).toISOString() }),
    phase: 'curing' as const,
    cureReadyAt: new Date(t0 + 60_000).toISOString(),
  };

  it('curing until the cure has run, waiting from then on', () => {
    expect(effectivePhase(curing, t0 + 59_999)).toBe('curing');
    expect(effectivePhase(curing, t0 + 60_000)).toBe('waiting');
  });

  it('the floor counts a cured tray at its next kind, waiting since the cure ended; with no next step it stays at the oven', () => {
    const row = { phase: 'curing' as const, stationKind: OVEN_KIND, nextKind: 'stone', waitingSince: null, cureReadyAt: t0 + 60_000, releasedAt: t0 };
    expect(floorPlace(row, t0)).toEqual({ phase: 'curing', kind: OVEN_KIND, waitingSince: null });
    expect(floorPlace(row, t0 + 61_000)).toEqual({ phase: 'waiting', kind: 'stone', waitingSince: t0 + 60_000 });
    expect(floorPlace({ ...row, nextKind: null }, t0 + 61_000)).toEqual({ phase: 'curing', kind: OVEN_KIND, waitingSince: null });
    expect(floorPlace({ ...row, phase: 'waiting', stationKind: 'fill', cureReadyAt: null }, t0)).toEqual({ phase: 'waiting', kind: 'fill', waitingSince: t0 });
  });
});
