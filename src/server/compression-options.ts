/**
 * How the web server compresses its answers. Text, JSON, scripts and styles are compressed
 * (the `compression` package's own test of the content type); photos and PDFs are left alone,
 * being compressed already. Brotli is preferred when the client accepts it, at a middle quality:
 * its top quality costs tens of milliseconds per answer, far more than it saves on the wire.
 */
import { constants } from 'node:zlib';
import type { CompressionOptions } from 'compression';

/** Brotli quality for answers made on request (0–11); 5 compresses within a few % of 11 at a fraction of the time. */
export const BROTLI_QUALITY = 5;

/** Answers smaller than this go as they are: the encoding's own overhead would outweigh the saving. */
export const COMPRESS_THRESHOLD_BYTES = 1024;

export const compressionOptions: CompressionOptions = {
  threshold: COMPRESS_THRESHOLD_BYTES,
  brotli: { params: { [constants.BROTLI_PARAM_QUALITY]: BROTLI_QUALITY } },
};
