/**
 * Photos and PDFs a plant owner attaches to an assessment. Every file is judged by its bytes,
 * never by its name or declared type, and every image is decoded and encoded afresh so that
 * nothing but pixels leaves the plant: no GPS position, camera serial or editing history.
 */
import { createRequire } from 'node:module';
import { Worker } from 'node:worker_threads';
import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { MAX_PHOTOS, MAX_PHOTO_BYTES } from '../../schemas/assessment';
import { DomainError } from '../errors';
import { cleanPdf } from './pdf-clean';

/** Longest side of a stored image: plenty for a consultant to read a pipe label or a gauge. */
export const MAX_PHOTO_SIDE_PX = 3200;

/**
 * Above this many pixels a file is refused before it is decoded, so a small file claiming huge
 * dimensions cannot exhaust the server's memory. 64 MP leaves room for 48- and 50-MP phone cameras.
 */
export const MAX_PHOTO_PIXELS = 64_000_000;

const JPEG_QUALITY = 82;
const WEBP_QUALITY = 82;
const MIB = 1024 * 1024;

export type PhotoRefusalCode = 'EMPTY' | 'TOO_LARGE' | 'UNSUPPORTED_TYPE' | 'UNREADABLE' | 'TOO_MANY_PIXELS';

export interface CleanPhoto {
  /** Freshly encoded image without any metadata, or the PDF's pages rewritten without active content. */
  bytes: Buffer;
  contentType: 'image/jpeg' | 'image/png' | 'image/webp' | 'application/pdf';
  /** For our storage key: `jpg`, `png`, `webp` or `pdf`. */
  extension: 'jpg' | 'png' | 'webp' | 'pdf';
  widthPx?: number;
  heightPx?: number;
  /** The uploader's file name, reduced to something safe to show; never used as a storage key. */
  originalName?: string;
}

export interface PhotoRefusal {
  ok: false;
  code: PhotoRefusalCode;
  /** A sentence for the plant owner that names the file and says what to do. */
  message: string;
}

export type CleanPhotoResult = { ok: true; photo: CleanPhoto } | PhotoRefusal;

export type PhotoCountResult = { ok: true } | { ok: false; code: 'TOO_MANY_PHOTOS'; message: string };

type AcceptedKind = 'jpeg' | 'png' | 'webp' | 'heif' | 'pdf';

/** By the MIME type file-type reports from the bytes. */
const acceptedKinds: Readonly<Record<string, AcceptedKind>> = {
  'image/jpeg': 'jpeg',
  'image/png': 'png',
  // An animated PNG or WebP is kept as its first frame.
  'image/apng': 'png',
  'image/webp': 'webp',
  'image/heic': 'heif',
  'image/heif': 'heif',
  'image/heic-sequence': 'heif',
  'image/heif-sequence': 'heif',
  'application/pdf': 'pdf',
};

const WHAT_WE_TAKE = 'send a JPEG, PNG, WebP or HEIC photo, or a PDF';

/** What people call the files we refuse, by file-type's extension. */
const refusedTypeNames: Readonly<Record<string, string>> = {
  gif: 'a GIF image',
  avif: 'an AVIF image',
  tif: 'a TIFF image',
  bmp: 'a BMP image',
  jxl: 'a JPEG XL image',
  jp2: 'a JPEG 2000 image',
  ico: 'an icon file',
  icns: 'an icon file',
  psd: 'a Photoshop file',
  ai: 'an Illustrator file',
  eps: 'a PostScript file',
  ps: 'a PostScript file',
  cr2: 'a camera RAW file',
  cr3: 'a camera RAW file',
  nef: 'a camera RAW file',
  arw: 'a camera RAW file',
  dng: 'a camera RAW file',
  orf: 'a camera RAW file',
  rw2: 'a camera RAW file',
  raf: 'a camera RAW file',
  zip: 'a ZIP archive',
  rar: 'a RAR archive',
  '7z': 'a 7-Zip archive',
  gz: 'a compressed archive',
  tar: 'an archive',
  docx: 'a Word document',
  xlsx: 'a spreadsheet',
  pptx: 'a presentation',
  cfb: 'an Office document',
  odt: 'a text document',
  ods: 'a spreadsheet',
  exe: 'a program',
  elf: 'a program',
};

function describeRefusedType(ext: string, mime: string): string {
  const known = refusedTypeNames[ext];
  if (known) return known;
  if (mime.startsWith('video/')) return 'a video';
  if (mime.startsWith('audio/')) return 'a sound recording';
  return `a file of type ${ext.toUpperCase()}`;
}

// Bidirectional overrides could make "gpj.exe" look like "exe.jpg" on the consultant's screen.
const INVISIBLE_OR_CONTROL = /[\p{Cc}\p{Cf}\u2028\u2029]/gu;
const MAX_NAME_CHARS = 120;

/**
 * The uploader's file name, fit to show in a sentence or a list: no folders (some browsers send
 * `C:\fakepath\…`), no control or formatting characters, at most 120 characters with the
 * extension kept. Undefined when nothing printable is left.
 */
export function displayFileName(originalName: string | undefined): string | undefined {
  if (originalName === undefined) return undefined;
  const base = originalName.split(/[/\\]/).pop() ?? '';
  const cleaned = base.replace(INVISIBLE_OR_CONTROL, '').replace(/\s+/g, ' ').trim();
  if (!cleaned) return undefined;
  const chars = Array.from(cleaned);
  if (chars.length <= MAX_NAME_CHARS) return cleaned;
  const dot = cleaned.lastIndexOf('.');
  const extension = dot > 0 && cleaned.length - dot <= 10 ? cleaned.slice(dot) : '';
  const keep = MAX_NAME_CHARS - 1 - Array.from(extension).length;
  return `${chars.slice(0, keep).join('')}…${extension}`;
}

function refuse(code: PhotoRefusalCode, message: string): PhotoRefusal {
  return { ok: false, code, message };
}

/** Rounded up, so a file just over the limit never reads as "10.0 MB" next to a 10 MB limit. */
function megabytes(bytes: number): string {
  return (Math.ceil((bytes / MIB) * 10) / 10).toFixed(1);
}

function megapixels(pixels: number): string {
  return String(Math.round(pixels / 1_000_000));
}

/**
 * Checks one uploaded file and returns what may be stored: JPEG, PNG and WebP re-encoded in
 * their own format, HEIC/HEIF re-encoded as JPEG, a PDF rewritten with its pages only (no scripts or attachments). Images are turned upright
 * from their EXIF orientation, shrunk to at most {@link MAX_PHOTO_SIDE_PX} on the long side and
 * written without any metadata (EXIF with GPS, XMP, IPTC, ICC; colors converted to sRGB).
 * Never throws for anything in the file; a refusal carries a sentence naming the file.
 */
export async function cleanPhoto(bytes: Uint8Array, originalName?: string): Promise<CleanPhotoResult> {
  const name = displayFileName(originalName);
  const theFile = name === undefined ? 'This file' : `"${name}"`;

  if (bytes.byteLength === 0) {
    return refuse('EMPTY', `${theFile} is empty; choose the photo again, or take a new one.`);
  }
  if (bytes.byteLength > MAX_PHOTO_BYTES) {
    return refuse(
      'TOO_LARGE',
      `${theFile} is ${megabytes(bytes.byteLength)} MB; the limit is ${MAX_PHOTO_BYTES / MIB} MB per file — send a smaller photo.`,
    );
  }

  const unreadable = refuse(
    'UNREADABLE',
    `${theFile} is not a picture we can read; it may be damaged — open it on your device to check, then send it again.`,
  );

  let sniffed: Awaited<ReturnType<typeof fileTypeFromBuffer>>;
  try {
    sniffed = await fileTypeFromBuffer(bytes);
  } catch {
    return unreadable;
  }
  if (!sniffed) return unreadable;
  const kind = acceptedKinds[sniffed.mime];
  if (!kind) {
    return refuse('UNSUPPORTED_TYPE', `${theFile} is ${describeRefusedType(sniffed.ext, sniffed.mime)}; ${WHAT_WE_TAKE}.`);
  }

  const tooManyPixels = (width: number, height: number) =>
    refuse(
      'TOO_MANY_PIXELS',
      `${theFile} is ${width} × ${height} pixels, more than our limit of ${megapixels(MAX_PHOTO_PIXELS)} megapixels; send a smaller copy of the photo.`,
    );

  const withName = (photo: Omit<CleanPhoto, 'originalName'>): CleanPhotoResult => ({
    ok: true,
    photo: name === undefined ? photo : { ...photo, originalName: name },
  });

  if (kind === 'pdf') {
    if (!looksLikeWholePdf(bytes)) {
      return refuse(
        'UNREADABLE',
        `${theFile} does not look like a complete PDF; it may be damaged or cut off — save it again and send the new copy.`,
      );
    }
    const cleaned = await cleanPdf(bytes);
    if (!cleaned.ok) {
      return refuse(
        'UNREADABLE',
        cleaned.reason === 'encrypted'
          ? `${theFile} is password-protected; save a copy without the password and send that.`
          : cleaned.reason === 'empty'
            ? `${theFile} has no pages; send the PDF that shows the plant.`
            : `${theFile} could not be read as a PDF; save it again (for example with "Print to PDF") and send the new copy.`,
      );
    }
    return withName({ contentType: 'application/pdf', extension: 'pdf', bytes: Buffer.from(cleaned.bytes) });
  }

  if (kind === 'heif') {
    const decoded = await decodeHeif(bytes);
    if (decoded === 'unreadable') return unreadable;
    if (decoded.kind === 'too-many-pixels') return tooManyPixels(decoded.width, decoded.height);
    const encoded = await encode(
      sharp(decoded.rgba, { raw: { width: decoded.width, height: decoded.height, channels: 4 } })
        // A JPEG has no transparency; white is what a photo's empty area looks like on paper.
        .flatten({ background: '#ffffff' }),
      'jpeg',
    );
    return encoded ? withName(encoded) : unreadable;
  }

  let header: sharp.Metadata;
  try {
    // Reads the header only, so the pixel count is known before anything is decoded.
    header = await sharp(bytes, { limitInputPixels: false }).metadata();
  } catch {
    return unreadable;
  }
  if (header.width === undefined || header.height === undefined) return unreadable;
  if (header.width * header.height > MAX_PHOTO_PIXELS) return tooManyPixels(header.width, header.height);

  const encoded = await encode(sharp(bytes, { limitInputPixels: MAX_PHOTO_PIXELS }).autoOrient(), kind);
  return encoded ? withName(encoded) : unreadable;
}

/**
 * Encodes in the given format. sharp writes no metadata unless asked to (no `keepMetadata`,
 * `withMetadata`, `withExif` or `withIccProfile` here), and converts to sRGB on the way.
 * Undefined when the pixels cannot be decoded.
 */
async function encode(
  pipeline: sharp.Sharp,
  format: 'jpeg' | 'png' | 'webp',
): Promise<Omit<CleanPhoto, 'originalName'> | undefined> {
  const resized = pipeline.resize({
    width: MAX_PHOTO_SIDE_PX,
    height: MAX_PHOTO_SIDE_PX,
    fit: 'inside',
    withoutEnlargement: true,
  });
  const encoder =
    format === 'jpeg'
      ? resized.jpeg({ quality: JPEG_QUALITY })
      : format === 'png'
        ? resized.png()
        : resized.webp({ quality: WEBP_QUALITY });
  try {
    const { data, info } = await encoder.toBuffer({ resolveWithObject: true });
    const size = { bytes: data, widthPx: info.width, heightPx: info.height };
    if (format === 'jpeg') return { contentType: 'image/jpeg', extension: 'jpg', ...size };
    if (format === 'png') return { contentType: 'image/png', extension: 'png', ...size };
    return { contentType: 'image/webp', extension: 'webp', ...size };
  } catch {
    return undefined;
  }
}

/**
 * A PDF starts with `%PDF-` and ends with `%%EOF`, which readers look for within the last
 * kilobyte; a file without it was most likely cut off on the way.
 */
function looksLikeWholePdf(bytes: Uint8Array): boolean {
  const text = (from: number, to: number) => Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('latin1', from, to);
  if (text(0, 5) !== '%PDF-') return false;
  return text(Math.max(0, bytes.byteLength - 1024), bytes.byteLength).includes('%%EOF');
}

type DecodedHeif =
  | { kind: 'pixels'; width: number; height: number; rgba: Uint8Array }
  | { kind: 'too-many-pixels'; width: number; height: number };

/** A photo that takes longer than this to decode is treated as unreadable rather than waited on. */
const HEIF_DECODE_TIMEOUT_MS = 60_000;

/**
 * Runs in a worker thread for each file. heic-decode is libheif compiled to WebAssembly (sharp's
 * prebuilt libvips reads HEIF containers but cannot decode the HEVC inside them) and decodes
 * synchronously: a 12 MP phone photo takes seconds, which on the main thread would stall every
 * other request. The worker also gives the WebAssembly memory back when it exits. It checks the
 * size the container states before decoding, so a crafted file is refused without being decoded,
 * and decodes the pixels only, with rotation and mirroring applied by libheif, never the EXIF.
 */
const HEIF_WORKER_SOURCE = `
const { parentPort, workerData } = require('node:worker_threads');
const decode = require(workerData.modulePath);
(async () => {
  const images = await decode.all({ buffer: new Uint8Array(workerData.bytes) });
  try {
    const first = images[0];
    if (!first) return parentPort.postMessage({ kind: 'unreadable' });
    if (first.width * first.height > workerData.maxPixels) {
      return parentPort.postMessage({ kind: 'too-many-pixels', width: first.width, height: first.height });
    }
    const { width, height, data } = await first.decode();
    const rgba = new Uint8Array(data.buffer, data.byteOffset, data.byteLength);
    parentPort.postMessage({ kind: 'pixels', width, height, rgba }, [data.buffer]);
  } finally {
    images.dispose();
  }
})().catch(() => parentPort.postMessage({ kind: 'unreadable' }));
`;

let heicDecodePath: string | undefined;

async function decodeHeif(bytes: Uint8Array): Promise<DecodedHeif | 'unreadable'> {
  // heic-decode ships no type declarations; the worker only needs to know where it is.
  heicDecodePath ??= createRequire(import.meta.url).resolve('heic-decode');
  const copy = new Uint8Array(bytes).buffer;
  const worker = new Worker(HEIF_WORKER_SOURCE, {
    eval: true,
    workerData: { modulePath: heicDecodePath, bytes: copy, maxPixels: MAX_PHOTO_PIXELS },
    transferList: [copy],
    // libheif prints its parse errors; the refusal already says the file is unreadable.
    stdout: true,
    stderr: true,
  });
  worker.stdout.resume();
  worker.stderr.resume();
  try {
    const answer = await new Promise<unknown>((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error('HEIF decoding timed out')), HEIF_DECODE_TIMEOUT_MS);
      worker.once('message', (message: unknown) => {
        clearTimeout(timer);
        resolve(message);
      });
      worker.once('error', (error) => {
        clearTimeout(timer);
        reject(error);
      });
      worker.once('exit', () => {
        clearTimeout(timer);
        reject(new Error('HEIF worker exited without an answer'));
      });
    });
    return heifAnswer(answer);
  } catch {
    return 'unreadable';
  } finally {
    await worker.terminate();
  }
}

/** What came back from the worker, checked rather than trusted. */
function heifAnswer(message: unknown): DecodedHeif | 'unreadable' {
  if (typeof message !== 'object' || message === null) return 'unreadable';
  const { kind, width, height, rgba } = message as Record<string, unknown>;
  if (typeof width !== 'number' || typeof height !== 'number' || !(width > 0 && height > 0)) return 'unreadable';
  if (kind === 'too-many-pixels') return { kind, width, height };
  if (kind === 'pixels' && rgba instanceof Uint8Array && rgba.length === width * height * 4) {
    return { kind, width, height, rgba };
  }
  return 'unreadable';
}

/** Refuses more than {@link MAX_PHOTOS} files with one assessment, in a sentence. */
export function checkPhotoCount(count: number): PhotoCountResult {
  if (count <= MAX_PHOTOS) return { ok: true };
  const extra = count - MAX_PHOTOS;
  return {
    ok: false,
    code: 'TOO_MANY_PHOTOS',
    message: `You attached ${count} files; an assessment takes at most ${MAX_PHOTOS} — remove ${extra} and send again.`,
  };
}

/**
 * The refusal as the domain error an endpoint maps to a status: a file over the size limit is
 * PAYLOAD_TOO_LARGE (413), anything else UPLOAD_REFUSED (400).
 */
export function photoRefusalError(
  refusal: PhotoRefusal | Extract<PhotoCountResult, { ok: false }>,
  field?: string,
): DomainError {
  return new DomainError(refusal.code === 'TOO_LARGE' ? 'PAYLOAD_TOO_LARGE' : 'UPLOAD_REFUSED', refusal.message, field);
}
