import { measureFloor, projectFloor } from '@shared/domain/floor-projection';
import type { FloorProjector } from './backtest';

/** The product's projection, as the server makes it (same model, same number of runs). */
export function productProjector(runs: number): FloorProjector {
  return (snapshot, { calendar, stations }) => {
    const model = measureFloor(snapshot.measured, calendar, stations);
    const out = new Map<string, { expectedAt: number | null; p85At: number | null }>();
    for (const [id, p] of projectFloor(snapshot, { calendar, model, runs })) out.set(id, { expectedAt: p.expectedAt, p85At: p.p85At });
    return out;
  };
}
