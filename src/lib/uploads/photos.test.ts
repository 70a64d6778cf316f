import { readFileSync } from 'node:fs';
import { crc32, deflateSync } from 'node:zlib';
import sharp from 'sharp';
import { PDFDocument } from 'pdf-lib';
import { describe, expect, it } from 'vitest';
import { MAX_PHOTO_BYTES, MAX_PHOTOS } from '../../schemas/assessment';
import { DomainError } from '../errors';
import {
  checkPhotoCount,
  cleanPhoto,
  displayFileName,
  MAX_PHOTO_PIXELS,
  MAX_PHOTO_SIDE_PX,
  photoRefusalError,
  type CleanPhoto,
  type CleanPhotoResult,
  type PhotoRefusal,
} from './photos';

const MIB = 1024 * 1024;
const CAMERA_MAKE = 'Tamsin Creek Test Camera';
const GPS_EXIF = {
  IFD0: { Make: CAMERA_MAKE, Model: 'TC-1' },
  IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '52/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '1/1 15/1 0/1' },
};
const GPS_XMP = `<?xpacket begin="" id="W5M0MpCehiHzreSzNTczkc9d"?>
<x:xmpmeta xmlns:x="adobe:ns:meta/"><rdf:RDF xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#">
<rdf:Description rdf:about="" xmlns:exif="http://ns.adobe.com/exif/1.0/" exif:GPSLatitude="52,30.0N" exif:GPSLongitude="1,15.0W"/>
</rdf:RDF></x:xmpmeta><?xpacket end="w"?>`;

const fixture = (name: string) => readFileSync(new URL(`./__fixtures__/${name}`, import.meta.url));

type Rgb = [number, number, number];
const RED: Rgb = [220, 30, 30];
const BLUE: Rgb = [30, 30, 220];
const GREEN: Rgb = [30, 200, 30];
const WHITE: Rgb = [240, 240, 240];

/** Four colored quarters, so a rotation can be told from a mirror image. */
function quarters(width: number, height: number, [tl, tr, bl, br]: [Rgb, Rgb, Rgb, Rgb]): sharp.Sharp {
  const pixels = Buffer.alloc(width * height * 3);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const color = y < height / 2 ? (x < width / 2 ? tl : tr) : x < width / 2 ? bl : br;
      pixels.set(color, (y * width + x) * 3);
    }
  }
  return sharp(pixels, { raw: { width, height, channels: 3 } });
}

async function pixelAt(image: Buffer, x: number, y: number): Promise<Rgb> {
  const { data, info } = await sharp(image).removeAlpha().raw().toBuffer({ resolveWithObject: true });
  const i = (y * info.width + x) * info.channels;
  return [data[i] ?? -1, data[i + 1] ?? -1, data[i + 2] ?? -1];
}

/** Lossy encoding moves colors a little; a swapped or mirrored quarter moves them a lot. */
function expectColour(actual: Rgb, expected: Rgb): void {
  actual.forEach((value, channel) => expect(Math.abs(value - (expected[channel] ?? 0))).toBeLessThan(40));
}

/** An IPTC record (city) in a Photoshop APP13 segment, which sharp cannot write itself. */
function withIptcCity(jpeg: Buffer, city: string): Buffer {
  const dataset = Buffer.concat([Buffer.from([0x1c, 0x02, 90]), Buffer.from([0, city.length]), Buffer.from(city, 'latin1')]);
  const padded = dataset.length % 2 ? Buffer.concat([dataset, Buffer.alloc(1)]) : dataset;
  const size = Buffer.alloc(4);
  size.writeUInt32BE(dataset.length);
  const resource = Buffer.concat([Buffer.from('8BIM'), Buffer.from([0x04, 0x04, 0, 0]), size, padded]);
  const payload = Buffer.concat([Buffer.from('Photoshop 3.0\0', 'latin1'), resource]);
  const header = Buffer.from([0xff, 0xed, 0, 0]);
  header.writeUInt16BE(payload.length + 2, 2);
  return Buffer.concat([jpeg.subarray(0, 2), header, payload, jpeg.subarray(2)]);
}

function pngChunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const typed = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(typed));
  return Buffer.concat([length, typed, crc]);
}

/** A valid one-bit PNG of the given size: all zeros, so it deflates to almost nothing. */
function decompressionBombPng(width: number, height: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.set([1, 0, 0, 0, 0], 8);
  const rows = Buffer.alloc((1 + Math.ceil(width / 8)) * height);
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    pngChunk('IHDR', ihdr),
    pngChunk('IDAT', deflateSync(rows, { level: 9 })),
    pngChunk('IEND', Buffer.alloc(0)),
  ]);
}

/** Bytes without any file signature, the same on every run. */
function noiseBytes(length: number): Buffer {
  const bytes = Buffer.alloc(length);
  let state = 0x2545f491;
  for (let i = 0; i < length; i++) {
    state = (Math.imul(state, 1103515245) + 12345) >>> 0;
    bytes[i] = state >>> 24;
  }
  return bytes;
}

/** A real PDF of `pages` pages made with pdf-lib, padded with a comment to `padTo` bytes. */
async function pdfWithPages(pages: number, padTo?: number): Promise<Buffer> {
  const doc = await PDFDocument.create();
  for (let i = 0; i < pages; i += 1) doc.addPage([200, 200]);
  const bytes = Buffer.from(await doc.save({ useObjectStreams: false }));
  if (padTo === undefined) return bytes;
  // A comment line after the header keeps the file valid and brings it to the size asked for.
  const headerEnd = bytes.indexOf('\n') + 1;
  const comment = Buffer.from(`%${'x'.repeat(padTo - bytes.length - 2)}\n`, 'latin1');
  return Buffer.concat([bytes.subarray(0, headerEnd), comment, bytes.subarray(headerEnd)]);
}

function minimalPdf(padTo?: number): Buffer {
  const head = '%PDF-1.4\n1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj\n2 0 obj << /Type /Pages /Kids [] /Count 0 >> endobj\n';
  const tail = 'trailer << /Root 1 0 R >>\n%%EOF\n';
  const padding = padTo === undefined ? '' : `%${'x'.repeat(padTo - head.length - tail.length - 2)}\n`;
  return Buffer.from(head + padding + tail, 'latin1');
}

function accepted(result: CleanPhotoResult): CleanPhoto {
  if (!result.ok) throw new Error(`expected the file to be accepted, got ${result.code}: ${result.message}`);
  return result.photo;
}

function refused(result: CleanPhotoResult): PhotoRefusal {
  if (result.ok) throw new Error(`expected a refusal, got a ${result.photo.contentType}`);
  return result;
}

async function expectNoMetadata(image: Buffer): Promise<sharp.Metadata> {
  const metadata = await sharp(image).metadata();
  expect(metadata.exif).toBeUndefined();
  expect(metadata.xmp).toBeUndefined();
  expect(metadata.iptc).toBeUndefined();
  expect(metadata.icc).toBeUndefined();
  expect(metadata.orientation).toBeUndefined();
  expect(metadata.comments).toBeUndefined();
  const text = image.toString('latin1');
  for (const trace of [CAMERA_MAKE, 'GPSLatitude', 'Tamsin Creek', 'Photoshop 3.0', 'xmpmeta']) {
    expect(text).not.toContain(trace);
  }
  return metadata;
}

describe('cleanPhoto: JPEG', () => {
  it('turns the photo upright and strips EXIF with GPS, XMP, IPTC and the ICC profile', async () => {
    // Stored 60 × 40 lying on its side; EXIF orientation 6 says "turn 90° clockwise to view".
    const raw = await quarters(60, 40, [RED, BLUE, GREEN, WHITE])
      .withIccProfile('p3')
      .withMetadata({ orientation: 6 })
      .withExifMerge(GPS_EXIF)
      .withXmp(GPS_XMP)
      .jpeg({ quality: 95 })
      .toBuffer();
    const input = withIptcCity(raw, 'Tamsin Creek');
    const before = await sharp(input).metadata();
    expect(before.orientation).toBe(6);
    expect(before.exif?.toString('latin1')).toContain(CAMERA_MAKE);
    expect(before.xmp?.toString('latin1')).toContain('GPSLatitude');
    expect(before.iptc?.toString('latin1')).toContain('Tamsin Creek');
    expect(before.icc).toBeDefined();

    const photo = accepted(await cleanPhoto(input, 'tamsin-creek-boiler-room.jpg'));

    expect(photo).toMatchObject({
      contentType: 'image/jpeg',
      extension: 'jpg',
      widthPx: 40,
      heightPx: 60,
      originalName: 'tamsin-creek-boiler-room.jpg',
    });
    const after = await expectNoMetadata(photo.bytes);
    expect(after).toMatchObject({ format: 'jpeg', width: 40, height: 60, space: 'srgb' });
    // Turned clockwise, the bottom-left quarter comes to the top left and the top right to the bottom right.
    expectColour(await pixelAt(photo.bytes, 5, 5), GREEN);
    expectColour(await pixelAt(photo.bytes, 35, 5), RED);
    expectColour(await pixelAt(photo.bytes, 5, 55), WHITE);
    expectColour(await pixelAt(photo.bytes, 35, 55), BLUE);
  });

  it(`shrinks the long side to ${MAX_PHOTO_SIDE_PX} px and keeps the proportions`, async () => {
    const input = await quarters(4000, 1000, [RED, BLUE, GREEN, WHITE]).jpeg().toBuffer();
    const photo = accepted(await cleanPhoto(input, 'tamsin-creek-header-run.jpg'));
    expect([photo.widthPx, photo.heightPx]).toEqual([MAX_PHOTO_SIDE_PX, 800]);
    expect(await sharp(photo.bytes).metadata()).toMatchObject({ width: MAX_PHOTO_SIDE_PX, height: 800 });
  });

  it('does not enlarge a small photo', async () => {
    const input = await quarters(30, 20, [RED, BLUE, GREEN, WHITE]).jpeg().toBuffer();
    const photo = accepted(await cleanPhoto(input, 'valve.jpg'));
    expect([photo.widthPx, photo.heightPx]).toEqual([30, 20]);
  });

  it('refuses a JPEG cut off halfway as unreadable', async () => {
    const whole = await quarters(400, 300, [RED, BLUE, GREEN, WHITE]).jpeg().toBuffer();
    const result = refused(await cleanPhoto(whole.subarray(0, Math.floor(whole.length / 2)), 'tamsin-creek-trap.jpg'));
    expect(result.code).toBe('UNREADABLE');
    expect(result.message).toBe('"tamsin-creek-trap.jpg" is not a picture we can read; it may be damaged — open it on your device to check, then send it again.');
  });
});

describe('cleanPhoto: PNG and WebP', () => {
  it('keeps a PNG as PNG with its transparency, without EXIF, XMP or text chunks', async () => {
    const rgba = Buffer.alloc(50 * 30 * 4);
    for (let i = 0; i < 50 * 30; i++) rgba.set([30, 30, 220, i % 50 < 25 ? 255 : 100], i * 4);
    const encoded = await sharp(rgba, { raw: { width: 50, height: 30, channels: 4 } }).withExif(GPS_EXIF).withXmp(GPS_XMP).png().toBuffer();
    const afterHeader = 8 + 25;
    const comment = pngChunk('tEXt', Buffer.from('Comment\0Tamsin Creek plant, 52.5 N 1.25 W', 'latin1'));
    const input = Buffer.concat([encoded.subarray(0, afterHeader), comment, encoded.subarray(afterHeader)]);
    const before = await sharp(input).metadata();
    expect(before.exif).toBeDefined();
    expect(before.xmp).toBeDefined();
    expect(before.comments?.[0]?.text).toContain('Tamsin Creek');

    const photo = accepted(await cleanPhoto(input, 'tamsin-creek-gauge.png'));

    expect(photo).toMatchObject({ contentType: 'image/png', extension: 'png', widthPx: 50, heightPx: 30 });
    const after = await expectNoMetadata(photo.bytes);
    expect(after).toMatchObject({ format: 'png', hasAlpha: true });
    const { data } = await sharp(photo.bytes).raw().toBuffer({ resolveWithObject: true });
    expect([data[3], data[40 * 4 + 3]]).toEqual([255, 100]);
  });

  it('keeps a WebP as WebP without EXIF or XMP', async () => {
    const input = await quarters(64, 48, [RED, BLUE, GREEN, WHITE]).withExif(GPS_EXIF).withXmp(GPS_XMP).webp({ quality: 90 }).toBuffer();
    const before = await sharp(input).metadata();
    expect(before.exif).toBeDefined();
    expect(before.xmp).toBeDefined();

    const photo = accepted(await cleanPhoto(input, 'tamsin-creek-pump.webp'));

    expect(photo).toMatchObject({ contentType: 'image/webp', extension: 'webp', widthPx: 64, heightPx: 48 });
    expect(await expectNoMetadata(photo.bytes)).toMatchObject({ format: 'webp' });
    expectColour(await pixelAt(photo.bytes, 5, 5), RED);
    expectColour(await pixelAt(photo.bytes, 60, 44), WHITE);
  });

  it('goes by the bytes, not the name: a PNG called .jpg stays a PNG', async () => {
    const input = await quarters(20, 20, [RED, BLUE, GREEN, WHITE]).png().toBuffer();
    const photo = accepted(await cleanPhoto(input, 'tamsin-creek-gauge.jpg'));
    expect(photo).toMatchObject({ contentType: 'image/png', extension: 'png', originalName: 'tamsin-creek-gauge.jpg' });
    expect((await sharp(photo.bytes).metadata()).format).toBe('png');
  });

  it('refuses a PNG whose header is followed by rubbish as unreadable', async () => {
    const input = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), noiseBytes(2000)]);
    expect(refused(await cleanPhoto(input, 'gauge.png')).code).toBe('UNREADABLE');
  });
});

describe('cleanPhoto: HEIC', () => {
  it('decodes a HEIC photo and re-encodes it as JPEG without its EXIF (which holds GPS)', async () => {
    const input = fixture('tamsin-creek-valve.heic');
    // The fixture's EXIF item, written from a JPEG with GPS tags (see __fixtures__/README.md).
    expect(input.toString('latin1')).toContain(CAMERA_MAKE);

    const photo = accepted(await cleanPhoto(input, 'IMG_4127.HEIC'));

    expect(photo).toMatchObject({ contentType: 'image/jpeg', extension: 'jpg', widthPx: 96, heightPx: 64, originalName: 'IMG_4127.HEIC' });
    expect(await expectNoMetadata(photo.bytes)).toMatchObject({ format: 'jpeg', width: 96, height: 64 });
    expectColour(await pixelAt(photo.bytes, 10, 32), RED);
    expectColour(await pixelAt(photo.bytes, 85, 32), BLUE);
  });

  it('turns a HEIC upright by the rotation stored in the file', async () => {
    // A quarter turn clockwise: the red left half comes to the top.
    const photo = accepted(await cleanPhoto(fixture('tamsin-creek-valve-rotated.heic'), 'IMG_4130.HEIC'));
    expect([photo.widthPx, photo.heightPx]).toEqual([64, 96]);
    await expectNoMetadata(photo.bytes);
    expectColour(await pixelAt(photo.bytes, 32, 10), RED);
    expectColour(await pixelAt(photo.bytes, 32, 85), BLUE);
  });

  it('refuses a HEIC with too many pixels before decoding it', async () => {
    const input = fixture('tamsin-creek-oversized.heic');
    expect(input.length).toBeLessThan(64 * 1024);
    const result = refused(await cleanPhoto(input, 'IMG_4128.HEIC'));
    expect(result.code).toBe('TOO_MANY_PIXELS');
    expect(result.message).toBe(
      '"IMG_4128.HEIC" is 8200 × 8200 pixels, more than our limit of 64 megapixels; send a smaller copy of the photo.',
    );
  });

  it('refuses a cut-off HEIC as unreadable', async () => {
    const input = fixture('tamsin-creek-valve.heic');
    expect(refused(await cleanPhoto(input.subarray(0, 300), 'IMG_4129.HEIC')).code).toBe('UNREADABLE');
  });
});

describe('cleanPhoto: PDF', () => {
  it('stores the pages of a PDF, rewritten', async () => {
    const input = await pdfWithPages(2);
    const photo = accepted(await cleanPhoto(input, 'tamsin-creek-steam-survey.pdf'));
    expect(photo).toMatchObject({ contentType: 'application/pdf', extension: 'pdf', originalName: 'tamsin-creek-steam-survey.pdf' });
    expect(photo.widthPx).toBeUndefined();
    expect((await PDFDocument.load(photo.bytes)).getPageCount()).toBe(2);
  });

  it('accepts a file of exactly the size limit', async () => {
    const input = await pdfWithPages(1, MAX_PHOTO_BYTES);
    expect(input.length).toBe(MAX_PHOTO_BYTES);
    expect((await PDFDocument.load(accepted(await cleanPhoto(input, 'survey.pdf')).bytes)).getPageCount()).toBe(1);
  });

  it('refuses a PDF with no pages', async () => {
    expect(refused(await cleanPhoto(minimalPdf(), 'blank.pdf')).message).toBe('"blank.pdf" has no pages; send the PDF that shows the plant.');
  });

  it('refuses a PDF without its end marker as cut off', async () => {
    const whole = minimalPdf();
    const result = refused(await cleanPhoto(whole.subarray(0, whole.indexOf('trailer')), 'tamsin-creek-steam-survey.pdf'));
    expect(result.code).toBe('UNREADABLE');
    expect(result.message).toBe(
      '"tamsin-creek-steam-survey.pdf" does not look like a complete PDF; it may be damaged or cut off — save it again and send the new copy.',
    );
  });
});

describe('cleanPhoto: refusals', () => {
  it('refuses a GIF, whatever its name, saying what it is and what we take', async () => {
    const gif = await quarters(16, 16, [RED, BLUE, GREEN, WHITE]).gif().toBuffer();
    expect(refused(await cleanPhoto(gif, 'boiler-room.gif'))).toEqual({
      ok: false,
      code: 'UNSUPPORTED_TYPE',
      message: '"boiler-room.gif" is a GIF image; send a JPEG, PNG, WebP or HEIC photo, or a PDF.',
    });
    expect(refused(await cleanPhoto(gif, 'boiler-room.jpg')).message).toBe(
      '"boiler-room.jpg" is a GIF image; send a JPEG, PNG, WebP or HEIC photo, or a PDF.',
    );
  });

  it('refuses TIFF and AVIF (an ftyp container like HEIC) as unsupported types', async () => {
    const tiff = await quarters(16, 16, [RED, BLUE, GREEN, WHITE]).tiff().toBuffer();
    expect(refused(await cleanPhoto(tiff, 'scan.tif')).message).toBe('"scan.tif" is a TIFF image; send a JPEG, PNG, WebP or HEIC photo, or a PDF.');
    const avif = await quarters(16, 16, [RED, BLUE, GREEN, WHITE]).avif().toBuffer();
    expect(refused(await cleanPhoto(avif, 'IMG_4131.heic'))).toEqual({
      ok: false,
      code: 'UNSUPPORTED_TYPE',
      message: '"IMG_4131.heic" is an AVIF image; send a JPEG, PNG, WebP or HEIC photo, or a PDF.',
    });
  });

  it('refuses bytes that are no known file as unreadable', async () => {
    expect(refused(await cleanPhoto(noiseBytes(4096), 'notes.jpg'))).toEqual({
      ok: false,
      code: 'UNREADABLE',
      message: '"notes.jpg" is not a picture we can read; it may be damaged — open it on your device to check, then send it again.',
    });
  });

  it('refuses an empty file', async () => {
    expect(refused(await cleanPhoto(new Uint8Array(0), 'tamsin-creek-drain.jpg'))).toEqual({
      ok: false,
      code: 'EMPTY',
      message: '"tamsin-creek-drain.jpg" is empty; choose the photo again, or take a new one.',
    });
  });

  it('refuses a file over the size limit, giving its size rounded up', async () => {
    const big = refused(await cleanPhoto(new Uint8Array(Math.floor(14.2 * MIB)), 'pump.jpg'));
    expect(big).toEqual({
      ok: false,
      code: 'TOO_LARGE',
      message: '"pump.jpg" is 14.2 MB; the limit is 10 MB per file — send a smaller photo.',
    });
    // Valid bytes do not matter once the size is over.
    const justOver = Buffer.concat([minimalPdf(), Buffer.alloc(MAX_PHOTO_BYTES + 1 - minimalPdf().length)]);
    expect(refused(await cleanPhoto(justOver, 'survey.pdf')).message).toBe(
      '"survey.pdf" is 10.1 MB; the limit is 10 MB per file — send a smaller photo.',
    );
  });

  it('refuses a decompression bomb (huge dimensions in a tiny file) before decoding it', async () => {
    const bomb = decompressionBombPng(20_000, 20_000);
    expect(bomb.length).toBeLessThan(100 * 1024);
    expect(20_000 * 20_000).toBeGreaterThan(MAX_PHOTO_PIXELS);
    expect(refused(await cleanPhoto(bomb, 'tamsin-creek-roof.png'))).toEqual({
      ok: false,
      code: 'TOO_MANY_PIXELS',
      message: '"tamsin-creek-roof.png" is 20000 × 20000 pixels, more than our limit of 64 megapixels; send a smaller copy of the photo.',
    });
  });

  it('speaks of "This file" when no name came with it', async () => {
    expect(refused(await cleanPhoto(new Uint8Array(0))).message).toBe('This file is empty; choose the photo again, or take a new one.');
    expect(refused(await cleanPhoto(new Uint8Array(0), ' \u202e ')).message).toMatch(/^This file is empty/);
  });
});

describe('displayFileName', () => {
  it('drops folders, control and direction characters', () => {
    expect(displayFileName('C:\\fakepath\\tamsin-creek-boiler-room.jpg')).toBe('tamsin-creek-boiler-room.jpg');
    expect(displayFileName('photos/2025/valve.jpg')).toBe('valve.jpg');
    expect(displayFileName('invoice\u202Egpj.exe')).toBe('invoicegpj.exe');
    expect(displayFileName('pump\n\t  room.jpg')).toBe('pump room.jpg');
    expect(displayFileName('   ')).toBeUndefined();
    expect(displayFileName(undefined)).toBeUndefined();
  });

  it('shortens a long name to 120 characters and keeps its extension', () => {
    const name = displayFileName(`${'steam-main-'.repeat(20)}.jpeg`);
    expect(name).toHaveLength(120);
    expect(name).toMatch(/^steam-main-.*…\.jpeg$/);
  });
});

describe('checkPhotoCount and photoRefusalError', () => {
  it(`accepts up to ${MAX_PHOTOS} photos and refuses more with a sentence`, () => {
    expect(checkPhotoCount(0)).toEqual({ ok: true });
    expect(checkPhotoCount(MAX_PHOTOS)).toEqual({ ok: true });
    expect(checkPhotoCount(MAX_PHOTOS + 2)).toEqual({
      ok: false,
      code: 'TOO_MANY_PHOTOS',
      message: `You attached ${MAX_PHOTOS + 2} files; an assessment takes at most ${MAX_PHOTOS} — remove 2 and send again.`,
    });
  });

  it('maps an over-size file to PAYLOAD_TOO_LARGE and other refusals to UPLOAD_REFUSED, keeping the field', async () => {
    const tooLarge = refused(await cleanPhoto(new Uint8Array(MAX_PHOTO_BYTES + 1), 'pump.jpg'));
    const error = photoRefusalError(tooLarge, 'photos.run-1');
    expect(error).toBeInstanceOf(DomainError);
    expect([error.code, error.field, error.message]).toEqual(['PAYLOAD_TOO_LARGE', 'photos.run-1', tooLarge.message]);

    const empty = refused(await cleanPhoto(new Uint8Array(0), 'pump.jpg'));
    expect(photoRefusalError(empty).code).toBe('UPLOAD_REFUSED');
    const tooMany = checkPhotoCount(MAX_PHOTOS + 1);
    if (tooMany.ok) throw new Error('expected a refusal');
    expect(photoRefusalError(tooMany, 'photos').code).toBe('UPLOAD_REFUSED');
  });
});
