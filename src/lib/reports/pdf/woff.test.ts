import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { sfntFromWoff } from './woff';

const require = createRequire(import.meta.url);
const woff = readFileSync(require.resolve('@fontsource/manrope/files/manrope-latin-700-normal.woff'));

/** An sfnt table's checksum (OpenType spec: sum of big-endian uint32s, zero-padded, mod 2³²). */
function tableChecksum(data: Buffer): number {
  const padded = Buffer.alloc((data.length + 3) & ~3);
  data.copy(padded);
  let sum = 0;
  for (let i = 0; i < padded.length; i += 4) sum = (sum + padded.readUInt32BE(i)) >>> 0;
  return sum;
}

describe('sfntFromWoff', () => {
  it('gives back each table of the TrueType font a WOFF wraps, whole: every checksum the WOFF recorded matches', () => {
    const ttf = sfntFromWoff(woff);
    expect(ttf.readUInt32BE(0)).toBe(woff.readUInt32BE(4));
    const numTables = ttf.readUInt16BE(4);
    expect(numTables).toBe(woff.readUInt16BE(12));
    // The total size the WOFF header states for the font it wraps.
    expect(ttf.length).toBe(woff.readUInt32BE(16));
    const tags: string[] = [];
    for (let i = 0; i < numTables; i++) {
      const at = 12 + i * 16;
      const tag = ttf.subarray(at, at + 4).toString('latin1');
      tags.push(tag);
      const data = Buffer.from(ttf.subarray(ttf.readUInt32BE(at + 8), ttf.readUInt32BE(at + 8) + ttf.readUInt32BE(at + 12)));
      // head's checksum is taken with its checkSumAdjustment field as zero.
      if (tag === 'head') data.writeUInt32BE(0, 8);
      expect(tableChecksum(data), tag).toBe(ttf.readUInt32BE(at + 4));
    }
    expect(tags).toEqual(expect.arrayContaining(['cmap', 'glyf', 'head', 'hmtx', 'loca', 'name']));
  });

  it('refuses a file that is not WOFF 1.0', () => {
    expect(() => sfntFromWoff(Buffer.from('not a font at all, not even close to one'))).toThrow(/not a WOFF/);
    expect(() => sfntFromWoff(sfntFromWoff(woff))).toThrow(/not a WOFF/);
  });
});
