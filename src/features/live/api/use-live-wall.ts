import { useCallback, useRef } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { WallView } from '@shared/schemas/live';
import { liveKeys } from './live-keys';
import { useLiveStream } from './use-live-stream';

/**
 * Keeps the cached wall view live: WIP counts arrive with the stream's event itself; after a scan
 * or a refusal the lists beside them are fetched again (at most every 400 ms).
 */
export function useLiveWall() {
  const qc = useQueryClient();
  const pending = useRef<ReturnType<typeof setTimeout> | null>(null);
  const refresh = useCallback(() => {
    if (pending.current) return;
    pending.current = setTimeout(() => {
      pending.current = null;
      void qc.invalidateQueries({ queryKey: liveKeys.wall() });
    }, 400);
  }, [qc]);
  return useLiveStream({
    onWip: (wip) => qc.setQueryData<WallView>(liveKeys.wall(), (old) => (old ? { ...old, wip, asOf: wip.asOf } : old)),
    onScan: refresh,
    onRefusal: refresh,
  });
}
