// Scan event ids are made on the tablet (so a resend is recognised). They are UUID version 7
// (RFC 9562, section 5.7): 48 bits of Unix time in milliseconds, then random bits. Ids made later
// sort later, so the server's primary-key index grows at its end instead of at random places:
// fewer pages touched per insert on a table of millions of scans.

let lastMs = -1;
let counter = 0;

/** A UUIDv7; `now` and `random` can be given for tests. Within one millisecond the 12-bit counter keeps ids in order. */
export function uuidv7(now: number = Date.now(), random: (bytes: Uint8Array) => Uint8Array = (b) => crypto.getRandomValues(b)): string {
  const b = random(new Uint8Array(16));
  const ms = Math.max(0, Math.floor(now));
  if (ms === lastMs) counter = (counter + 1) & 0x0fff;
  else {
    lastMs = ms;
    counter = ((b[6] & 0x07) << 8) | b[7]; // random start, leaving room to count up
  }
  // 48-bit big-endian timestamp
  const high = Math.floor(ms / 2 ** 16);
  b[0] = (high >>> 24) & 0xff;
  b[1] = (high >>> 16) & 0xff;
  b[2] = (high >>> 8) & 0xff;
  b[3] = high & 0xff;
  b[4] = (ms >>> 8) & 0xff;
  b[5] = ms & 0xff;
  b[6] = 0x70 | ((counter >>> 8) & 0x0f); // version 7 + rand_a (counter)
  b[7] = counter & 0xff;
  b[8] = 0x80 | (b[8] & 0x3f); // variant 10
  const h = Array.from(b, (x) => x.toString(16).padStart(2, '0')).join('');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}

/** The millisecond timestamp inside a UUIDv7. */
export function uuidv7Time(id: string): number {
  return parseInt(id.replace(/-/g, '').slice(0, 12), 16);
}
