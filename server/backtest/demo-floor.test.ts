import { describe, expect, it } from 'vitest';
import { FloorReplay } from '@shared/domain/floor-history';
import { measureFloor, projectFloor } from '@shared/domain/floor-projection';
import { makeDemoFloor } from './demo-floor';
import { BACKTEST_END } from './backtest';

const floor = makeDemoFloor('replay-check', BACKTEST_END, 40);

describe('the floor as of a moment, from its scans', () => {
  it('replaying every scan through the guards ends in the states the simulator left', () => {
    const replay = new FloorReplay(floor.history);
    replay.advanceTo(BACKTEST_END);
    expect(floor.finalStates.size).toBeGreaterThan(100);
    for (const [id, state] of floor.finalStates) expect(replay.stateOf(id), id).toEqual(state);
  });

  it('sees nothing after the cut: the projection at t is the same with the later scans removed', () => {
    const t = BACKTEST_END - 12 * 86_400_000;
    const full = new FloorReplay(floor.history);
    full.advanceTo(t);
    const cut = new FloorReplay({ ...floor.history, events: floor.history.events.filter((e) => e.occurredAt <= t) });
    cut.advanceTo(t);
    const a = full.snapshot();
    const b = cut.snapshot();
    expect(b).toEqual(a);
    expect(a.orders.length).toBeGreaterThan(3);
    const project = (s: typeof a) => projectFloor(s, { calendar: floor.calendar, model: measureFloor(s.measured, floor.calendar, floor.stations), runs: 20 });
    expect(project(b)).toEqual(project(a));
  });
});
