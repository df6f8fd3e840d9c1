import type { AppDeps } from '../app-deps';
import { floorRepository, type OpenTrayRow, type WipRow } from '../repositories/floor.repository';
import { STATION_KINDS } from '@shared/domain/vocabulary';
import { floorPlace } from '@shared/domain/traveller';
import type { WipKind, WipResponse } from '@shared/schemas/reports';

const MIN = 60_000;

/** Where a traveller counts right now, as the wall and GET /api/wip show it. */
export interface Placement<R extends WipRow = OpenTrayRow> {
  row: R;
  phase: 'waiting' | 'in_process' | 'curing';
  /** station kind it counts under */
  kind: string;
  /** waiting: since when */
  waitingSince: number | null;
}

/** Where a traveller counts now: the traveller core's floor reading (the same as the scan guards'). */
export function place<R extends WipRow>(row: R, now: number): Placement<R> | null {
  const at = floorPlace(row, now);
  return at ? { row, ...at } : null;
}

const zero = () => ({ trays: 0, pieces: 0 });

export interface FloorSnapshot {
  wip: WipResponse;
  placements: Placement[];
  stations: ReturnType<typeof floorRepository.stations>;
}

function countWip(
  rows: readonly WipRow[],
  stations: ReturnType<typeof floorRepository.stations>,
  now: number,
): { wip: WipResponse; placements: Placement<WipRow>[] } {
  const kinds = new Map<string, WipKind>();
  const kindOf = (k: string): WipKind => {
    let v = kinds.get(k);
    if (!v) {
      v = {
        stationKind: k,
        waiting: zero(),
        inProcess: zero(),
        curing: zero(),
        held: 0,
        moulds: 0,
        oldestMinutes: null,
        stations: stations
          .filter((s) => s.kind === k && s.active)
          .map((s) => ({ stationId: s.id, code: s.code, name: s.name, inProcess: zero(), curing: zero() })),
      };
      kinds.set(k, v);
    }
    return v;
  };
  for (const k of STATION_KINDS) kindOf(k);
  const placements: Placement<WipRow>[] = [];
  let trays = 0;
  let pieces = 0;
  let moulds = 0;
  for (const row of rows) {
    const p = place(row, now);
    if (!p) continue;
    placements.push(p);
    const k = kindOf(p.kind);
    if (row.onHold) k.held += 1;
    if (p.waitingSince != null) {
      const waited = Math.max(0, Math.round((now - p.waitingSince) / MIN));
      if (k.oldestMinutes === null || waited > k.oldestMinutes) k.oldestMinutes = waited;
    }
    if (row.kind === 'mould') {
      k.moulds += 1;
      moulds += 1;
      continue;
    }
    trays += 1;
    pieces += row.quantity;
    const bucket = p.phase === 'waiting' ? k.waiting : p.phase === 'in_process' ? k.inProcess : k.curing;
    bucket.trays += 1;
    bucket.pieces += row.quantity;
    if (p.phase !== 'waiting' && row.stationId) {
      const st = k.stations.find((s) => s.stationId === row.stationId);
      if (st) {
        const b = p.phase === 'in_process' ? st.inProcess : st.curing;
        b.trays += 1;
        b.pieces += row.quantity;
      }
    }
  }
  return { wip: { asOf: new Date(now).toISOString(), kinds: [...kinds.values()], totals: { trays, pieces, moulds } }, placements };
}

export const wipService = {
  /** WIP with the details of every open traveller, for the wall and load planning. */
  snapshot(deps: AppDeps): FloorSnapshot {
    const now = deps.now();
    const rows = floorRepository.openTrays(deps.db);
    const stations = floorRepository.stations(deps.db);
    const { wip, placements } = countWip(rows, stations, now);
    return { wip, placements: placements as Placement[], stations };
  },

  /** GET /api/wip: the counts alone, from the lean read. */
  wip(deps: AppDeps): WipResponse {
    return countWip(floorRepository.wipRows(deps.db), floorRepository.stations(deps.db), deps.now()).wip;
  },
};
