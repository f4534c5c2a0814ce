// WOFF 1.0 → the plain TrueType/OpenType (sfnt) font it wraps, per the W3C WOFF
// File Format 1.0 recommendation. fontkit reads a WOFF by inflating a table, in
// JavaScript, every time it reads from it (once per glyph laid out or subset), so
// the PDF export hands it the unwrapped font, inflated once by node's zlib.
import { inflateSync } from 'node:zlib';

const WOFF_SIGNATURE = 0x774f4646; // 'wOFF'
const WOFF_HEADER = 44;
const WOFF_ENTRY = 20;
const SFNT_HEADER = 12;
const SFNT_ENTRY = 16;

const pad4 = (n: number) => (n + 3) & ~3;

export function sfntFromWoff(woff: Uint8Array): Buffer {
  const src = Buffer.from(woff.buffer, woff.byteOffset, woff.byteLength);
  if (src.readUInt32BE(0) !== WOFF_SIGNATURE) throw new Error('not a WOFF 1.0 font');
  const flavor = src.readUInt32BE(4);
  const numTables = src.readUInt16BE(12);
  const tables = Array.from({ length: numTables }, (_, i) => {
    const at = WOFF_HEADER + i * WOFF_ENTRY;
    const tag = src.readUInt32BE(at);
    const offset = src.readUInt32BE(at + 4);
    const compLength = src.readUInt32BE(at + 8);
    const origLength = src.readUInt32BE(at + 12);
    const checksum = src.readUInt32BE(at + 16);
    const stored = src.subarray(offset, offset + compLength);
    // A table is zlib-compressed only when that made it smaller.
    const data = compLength < origLength ? inflateSync(stored) : stored;
    if (data.length !== origLength) throw new Error('WOFF table of the wrong length');
    return { tag, checksum, data };
  });
  // The sfnt table directory's binary-search fields (OpenType spec, "Table Directory").
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  let offset = SFNT_HEADER + numTables * SFNT_ENTRY;
  const out = Buffer.alloc(offset + tables.reduce((n, t) => n + pad4(t.data.length), 0));
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(searchRange, 6);
  out.writeUInt16BE(entrySelector, 8);
  out.writeUInt16BE(numTables * 16 - searchRange, 10);
  tables.forEach((t, i) => {
    const at = SFNT_HEADER + i * SFNT_ENTRY;
    out.writeUInt32BE(t.tag, at);
    out.writeUInt32BE(t.checksum, at + 4);
    out.writeUInt32BE(offset, at + 8);
    out.writeUInt32BE(t.data.length, at + 12);
    out.set(t.data, offset);
    offset += pad4(t.data.length);
  });
  return out;
}
