// A hand scanner in keyboard-wedge mode "types" the code very fast and ends with Enter. People
// type far slower: even a quick typist leaves 100 ms or more between keys on average (from
// memory: 60 words a minute is about 5 keys a second). So a run of keys whose average gap is
// under `meanGapMs` (no single pause longer than `maxGapMs`), ended by Enter, is a scan; anything
// slower is a person, and is left alone. The average tolerates the odd hiccup of a busy tablet.

export interface WedgeOptions {
  /** longest single pause inside one scan (ms) */
  maxGapMs?: number;
  /** largest average gap between the keys of one scan (ms) */
  meanGapMs?: number;
  /** shortest code worth reporting */
  minLength?: number;
}

export interface WedgeKey {
  key: string;
  /** event time in ms (KeyboardEvent.timeStamp) */
  time: number;
}

export interface WedgeReader {
  /** Feed one keydown. Returns the scanned text when this key (Enter) ends a scan, else null. */
  key(k: WedgeKey): string | null;
  /** true while a fast run is in progress (the caller may hold back the keys from other handlers) */
  readonly inBurst: boolean;
  reset(): void;
}

export function createWedgeReader(options: WedgeOptions = {}): WedgeReader {
  const maxGap = options.maxGapMs ?? 120;
  const meanGap = options.meanGapMs ?? 35;
  const minLength = options.minLength ?? 4;
  let buffer = '';
  let first = 0;
  let last = -Infinity;
  const fast = () => buffer.length >= 2 && (last - first) / (buffer.length - 1) <= meanGap;
  return {
    get inBurst() {
      return fast();
    },
    key({ key, time }) {
      const gap = time - last;
      if (key === 'Enter') {
        const ok = gap <= maxGap && buffer.length >= minLength && fast();
        const text = buffer;
        buffer = '';
        last = -Infinity;
        return ok ? text : null;
      }
      if (key.length !== 1) return null; // Shift and other keys a scanner may send between characters
      if (gap > maxGap) {
        buffer = key;
        first = time;
      } else {
        buffer += key;
      }
      last = time;
      return null;
    },
    reset() {
      buffer = '';
      last = -Infinity;
    },
  };
}
