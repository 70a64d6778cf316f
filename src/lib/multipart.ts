/**
 * Reads a multipart/form-data body with a ceiling on its size, so a huge upload is refused
 * before it is held in memory whole.
 */
import { errorResponse, HttpResponseError, validationFailed } from './http';

async function readCapped(request: Request, maxBytes: number): Promise<Uint8Array<ArrayBuffer>> {
  const declared = Number(request.headers.get('content-length') ?? NaN);
  const tooLarge = () =>
    new HttpResponseError(
      errorResponse(413, 'PAYLOAD_TOO_LARGE', `The upload is over ${Math.round(maxBytes / 1024 / 1024)} MB in all; send fewer or smaller photos.`),
    );
  if (Number.isFinite(declared) && declared > maxBytes) throw tooLarge();
  if (!request.body) return new Uint8Array(new ArrayBuffer(0));
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel();
      throw tooLarge();
    }
    chunks.push(value);
  }
  const body = new Uint8Array(total);
  let offset = 0;
  for (const chunk of chunks) {
    body.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return body;
}

export async function readMultipart(request: Request, maxBytes: number): Promise<FormData> {
  const type = request.headers.get('content-type') ?? '';
  const body = await readCapped(request, maxBytes);
  try {
    return await new Response(body, { headers: { 'content-type': type } }).formData();
  } catch {
    throw new HttpResponseError(validationFailed([{ path: '(body)', message: 'The form data could not be read; send it as multipart/form-data.' }]));
  }
}
