import { useEffect, useRef, useState } from 'react';
import type { WipResponse } from '@shared/schemas/reports';
import type { ScanNotice } from '@shared/schemas/live';

export type StreamStatus = 'connecting' | 'live' | 'reconnecting';

/**
 * Listens to GET /api/stream. The browser's EventSource reconnects by itself after a dropped
 * connection or a server restart (the server asks for a 2 s retry); when the server refuses the
 * stream outright (for example after a sign-out) it gives up, so we open a new one after a pause.
 */
export function useLiveStream(handlers: { onWip?: (w: WipResponse) => void; onScan?: (s: ScanNotice) => void; onRefusal?: () => void }) {
  const [status, setStatus] = useState<StreamStatus>('connecting');
  const ref = useRef(handlers);
  ref.current = handlers;
  useEffect(() => {
    let source: EventSource | null = null;
    let retry: ReturnType<typeof setTimeout> | null = null;
    let stopped = false;
    const open = () => {
      source = new EventSource('/api/stream', { withCredentials: true });
      source.addEventListener('open', () => setStatus('live'));
      source.addEventListener('wip', (e) => {
        setStatus('live');
        ref.current.onWip?.(JSON.parse((e as MessageEvent).data) as WipResponse);
      });
      source.addEventListener('scan', (e) => ref.current.onScan?.(JSON.parse((e as MessageEvent).data) as ScanNotice));
      source.addEventListener('refusal', () => ref.current.onRefusal?.());
      source.addEventListener('error', () => {
        setStatus('reconnecting');
        if (source?.readyState === EventSource.CLOSED && !stopped) {
          source.close();
          retry = setTimeout(open, 3000);
        }
      });
    };
    open();
    return () => {
      stopped = true;
      if (retry) clearTimeout(retry);
      source?.close();
    };
  }, []);
  return status;
}
