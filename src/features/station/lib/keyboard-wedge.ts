// A hand scanner in keyboard-wedge mode "types" the code very fast and ends with Enter. People
// type far slower: even a quick typist leaves 100 ms or more between keys (from memory: 60 words
// a minute is about 5 keys a second). So a run of keys with every gap under `maxGapMs`, ended by
// Enter, is a scan; anything slower is a person, and is left alone.

export interface WedgeOptions {
  /** longest pause between two keys of one scan (ms) */
  maxGapMs?: number;
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
  const maxGap = options.maxGapMs ?? 50;
  const minLength = options.minLength ?? 4;
  let buffer = '';
  let last = -Infinity;
  let burst = false;
  return {
    get inBurst() {
      return burst && buffer.length >= 2;
    },
    key({ key, time }) {
      const gap = time - last;
      if (key === 'Enter') {
        const text = buffer;
        const fast = gap <= maxGap && burst;
        buffer = '';
        burst = false;
        last = time;
        return fast && text.length >= minLength ? text : null;
      }
      if (key.length !== 1) return null; // Shift and other keys a scanner may send between characters
      if (gap > maxGap) {
        buffer = key;
        burst = true;
      } else {
        buffer += key;
      }
      last = time;
      return null;
    },
    reset() {
      buffer = '';
      burst = false;
      last = -Infinity;
    },
  };
}
