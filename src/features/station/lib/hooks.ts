import { useEffect, useRef, useState, useSyncExternalStore } from 'react';
import { liveQuery } from 'dexie';
import { createWedgeReader, type WedgeOptions } from './keyboard-wedge';

/** A Dexie query that re-renders when the data it read changes. */
export function useLive<T>(query: () => Promise<T>, deps: unknown[], initial: T): T {
  const [value, setValue] = useState<T>(initial);
  useEffect(() => {
    const sub = liveQuery(query).subscribe({ next: setValue, error: () => undefined });
    return () => sub.unsubscribe();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, deps);
  return value;
}

/** The current time, refreshed every `everyMs`. */
export function useNow(everyMs = 1000, clock: () => number = Date.now): number {
  const [now, setNow] = useState(clock);
  useEffect(() => {
    const id = setInterval(() => setNow(clock()), everyMs);
    return () => clearInterval(id);
  }, [everyMs, clock]);
  return now;
}

export function useExternal<T>(subscribe: (fn: () => void) => () => void, get: () => T): T {
  return useSyncExternalStore(subscribe, get, get);
}

function typingInField(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  if (!el) return false;
  const tag = el.tagName;
  return tag === 'INPUT' || tag === 'TEXTAREA' || tag === 'SELECT' || el.isContentEditable;
}

/**
 * Hand-scanner capture anywhere on the screen, without focusing a field: a fast run of keys
 * ending in Enter is a scan. Keys typed into a form field are left to that field.
 */
export function useWedgeScanner(onScan: (text: string) => void, enabled: boolean, options?: WedgeOptions) {
  const handler = useRef(onScan);
  handler.current = onScan;
  useEffect(() => {
    if (!enabled) return;
    const reader = createWedgeReader(options);
    const onKey = (e: KeyboardEvent) => {
      if (typingInField(e.target)) {
        reader.reset();
        return;
      }
      const wasBurst = reader.inBurst;
      const text = reader.key({ key: e.key, time: e.timeStamp });
      if (text) {
        e.preventDefault();
        handler.current(text);
      } else if (e.key === 'Enter' ? wasBurst : reader.inBurst) {
        // keep a scanner's keys and Enter from pressing a focused button
        e.preventDefault();
      }
    };
    window.addEventListener('keydown', onKey, true);
    return () => window.removeEventListener('keydown', onKey, true);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [enabled]);
}

/** Calls `onIdle` after `minutes` without a touch, click or key press. */
export function useIdle(minutes: number, onIdle: () => void, enabled: boolean): { secondsLeft: number | null; stay: () => void } {
  const last = useRef(Date.now());
  const [secondsLeft, setSecondsLeft] = useState<number | null>(null);
  const cb = useRef(onIdle);
  cb.current = onIdle;
  useEffect(() => {
    if (!enabled) return;
    last.current = Date.now();
    const bump = () => {
      last.current = Date.now();
    };
    const events = ['pointerdown', 'keydown'] as const;
    for (const ev of events) window.addEventListener(ev, bump, true);
    const id = setInterval(() => {
      const left = minutes * 60_000 - (Date.now() - last.current);
      if (left <= 0) {
        setSecondsLeft(null);
        cb.current();
      } else setSecondsLeft(left <= 30_000 ? Math.ceil(left / 1000) : null);
    }, 1000);
    return () => {
      for (const ev of events) window.removeEventListener(ev, bump, true);
      clearInterval(id);
    };
  }, [minutes, enabled]);
  return {
    secondsLeft,
    stay: () => {
      last.current = Date.now();
      setSecondsLeft(null);
    },
  };
}
