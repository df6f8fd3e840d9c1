// Our font ships as WOFF 1.0. pdfkit can read WOFF, but its decoder inflates the tables in pure
// JavaScript for every new document; unpacking once to a plain sfnt (TrueType/OpenType) with
// Node's zlib makes each travellers PDF start fast. Layout per the W3C WOFF File Format 1.0.
import zlib from 'node:zlib';

const WOFF_SIGNATURE = 0x774f4646; // 'wOFF'

/** Unpacks a WOFF 1.0 font into the sfnt it wraps. */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.length < 44 || woff.readUInt32BE(0) !== WOFF_SIGNATURE) throw new Error('Not a WOFF 1.0 font');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables: { tag: number; checksum: number; data: Buffer }[] = [];
  for (let i = 0; i < numTables; i++) {
    const e = 44 + i * 20;
    const tag = woff.readUInt32BE(e);
    const offset = woff.readUInt32BE(e + 4);
    const compLength = woff.readUInt32BE(e + 8);
    const origLength = woff.readUInt32BE(e + 12);
    const checksum = woff.readUInt32BE(e + 16);
    const raw = woff.subarray(offset, offset + compLength);
    const data = compLength < origLength ? zlib.inflateSync(raw) : Buffer.from(raw);
    if (data.length !== origLength) throw new Error('Damaged WOFF table');
    tables.push({ tag, checksum, data });
  }
  // sfnt offset table: searchRange etc. from the largest power of two <= numTables
  let entrySelector = 0;
  while (1 << (entrySelector + 1) <= numTables) entrySelector++;
  const searchRange = (1 << entrySelector) * 16;
  const headerLength = 12 + numTables * 16;
  const pad4 = (n: number) => (n + 3) & ~3;
  const total = tables.reduce((sum, t) => sum + pad4(t.data.length), headerLength);
  const out = Buffer.alloc(total);
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(searchRange, 6);
  out.writeUInt16BE(entrySelector, 8);
  out.writeUInt16BE(numTables * 16 - searchRange, 10);
  let offset = headerLength;
  tables.forEach((t, i) => {
    const r = 12 + i * 16;
    out.writeUInt32BE(t.tag, r);
    out.writeUInt32BE(t.checksum, r + 4);
    out.writeUInt32BE(offset, r + 8);
    out.writeUInt32BE(t.data.length, r + 12);
    t.data.copy(out, offset);
    offset += pad4(t.data.length);
  });
  return out;
}
