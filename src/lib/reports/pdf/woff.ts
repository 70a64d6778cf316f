/**
 * WOFF (1.0) back to the plain TrueType it wraps. Our fonts ship as WOFF only, and fontkit,
 * reading a WOFF, inflates the whole glyph table again for every glyph it lays out or embeds —
 * most of a long report's render time. Inflated once here, the tables are read in place.
 * Format: W3C WOFF File Format 1.0 (header, table directory, zlib-compressed tables).
 */
import { inflateSync } from 'node:zlib';

const WOFF_SIGNATURE = 0x774f4646; // "wOFF"
const WOFF_HEADER_BYTES = 44;
const WOFF_ENTRY_BYTES = 20;
const SFNT_HEADER_BYTES = 12;
const SFNT_ENTRY_BYTES = 16;

const padded = (length: number) => (length + 3) & ~3;

/** The TrueType/OpenType font inside a WOFF file. Throws on anything that is not WOFF 1.0. */
export function sfntFromWoff(woff: Buffer): Buffer {
  if (woff.length < WOFF_HEADER_BYTES || woff.readUInt32BE(0) !== WOFF_SIGNATURE) throw new Error('not a WOFF 1.0 font');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables = Array.from({ length: numTables }, (_, i) => {
    const at = WOFF_HEADER_BYTES + i * WOFF_ENTRY_BYTES;
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const stored = woff.subarray(offset, offset + compLength);
    const data = compLength < origLength ? inflateSync(stored) : stored;
    if (data.length !== origLength) throw new Error('a WOFF table did not inflate to its stated length');
    return { tag: woff.readUInt32BE(at), checksum: woff.readUInt32BE(at + 16), data };
  });
  // The sfnt directory's binary-search fields, from the largest power of two ≤ numTables.
  const power = 2 ** Math.floor(Math.log2(Math.max(1, numTables)));
  const header = Buffer.alloc(SFNT_HEADER_BYTES + numTables * SFNT_ENTRY_BYTES);
  header.writeUInt32BE(flavor, 0);
  header.writeUInt16BE(numTables, 4);
  header.writeUInt16BE(power * 16, 6);
  header.writeUInt16BE(Math.log2(power), 8);
  header.writeUInt16BE(numTables * 16 - power * 16, 10);
  const parts: Buffer[] = [header];
  let offset = header.length;
  tables.forEach((table, i) => {
    const at = SFNT_HEADER_BYTES + i * SFNT_ENTRY_BYTES;
    header.writeUInt32BE(table.tag, at);
    header.writeUInt32BE(table.checksum, at + 4);
    header.writeUInt32BE(offset, at + 8);
    header.writeUInt32BE(table.data.length, at + 12);
    const block = Buffer.alloc(padded(table.data.length));
    table.data.copy(block);
    parts.push(block);
    offset += block.length;
  });
  return Buffer.concat(parts);
}
