import { measureFloor, projectFloor, type P85Width } from '@shared/domain/floor-projection';
import type { FloorProjector } from './backtest';

/**
 * The product's projection, as the server makes it (same model, same number of runs). `p85Width`
 * null gives the runs' own 85th percentile (what the conformal width is fitted from).
 */
export function productProjector(runs: number, p85Width?: P85Width | null): FloorProjector {
  return (snapshot, { calendar, stations }) => {
    const model = measureFloor(snapshot.measured, calendar, stations);
    const out = new Map<string, { expectedAt: number | null; p85At: number | null }>();
    for (const [id, p] of projectFloor(snapshot, { calendar, model, runs, p85Width })) out.set(id, { expectedAt: p.expectedAt, p85At: p.p85At });
    return out;
  };
}
