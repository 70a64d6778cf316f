/**
 * The storage adapter against the S3 fake that `npm test` starts (S3_* in the environment),
 * through the real SDK.
 */
import { randomBytes, randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { deleteObjects, getObject, putObject } from '../../src/lib/storage/objects';
import { cleanPhoto } from '../../src/lib/uploads/photos';

const S3_VARIABLES = ['S3_ENDPOINT', 'S3_REGION', 'S3_BUCKET', 'S3_ACCESS_KEY_ID', 'S3_SECRET_ACCESS_KEY'] as const;

beforeAll(() => {
  const missing = S3_VARIABLES.filter((name) => !process.env[name]);
  if (missing.length) {
    throw new Error(`${missing.join(', ')} not set: run these tests through \`npm test\`, which starts the S3 fake.`);
  }
});

afterEach(() => {
  vi.unstubAllEnvs();
  vi.restoreAllMocks();
});

const folder = () => `assessments/${randomUUID()}`;

/** Every byte value, then noise: an encoding slip anywhere shows up as a difference. */
function photoBytes(size: number): Buffer {
  const bytes = randomBytes(size);
  for (let i = 0; i < 256 && i < size; i++) bytes[i] = i;
  return bytes;
}

/** The adapter as a fresh module, so it builds its client from the environment as stubbed now. */
async function freshAdapter(): Promise<typeof import('../../src/lib/storage/objects')> {
  vi.resetModules();
  return import('../../src/lib/storage/objects');
}

describe('object storage', () => {
  it('stores, returns and deletes an object', async () => {
    const key = `${folder()}/${randomUUID()}.jpg`;
    const bytes = photoBytes(300_000);

    await putObject(key, bytes, 'image/jpeg');
    const stored = await getObject(key);
    expect(stored?.contentType).toBe('image/jpeg');
    expect(stored?.bytes.equals(bytes)).toBe(true);

    await deleteObjects([key]);
    expect(await getObject(key)).toBeNull();
  });

  it('stores only the bytes of a view into a larger buffer', async () => {
    const key = `${folder()}/${randomUUID()}.png`;
    const whole = photoBytes(4096);
    const view = new Uint8Array(whole.buffer, whole.byteOffset + 1000, 2000);

    await putObject(key, view, 'image/png');
    expect((await getObject(key))?.bytes.equals(whole.subarray(1000, 3000))).toBe(true);
    await deleteObjects([key]);
  });

  it('keeps a cleaned photo as cleaned: what comes back has no EXIF', async () => {
    const original = await sharp({ create: { width: 80, height: 60, channels: 3, background: '#3366cc' } })
      .withExif({ IFD0: { Make: 'Tamsin Creek Test Camera' }, IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '52/1 30/1 0/1' } })
      .jpeg()
      .toBuffer();
    expect((await sharp(original).metadata()).exif).toBeDefined();
    const cleaned = await cleanPhoto(original, 'tamsin-creek-condensate-line.jpg');
    if (!cleaned.ok) throw new Error(cleaned.message);
    const key = `${folder()}/${randomUUID()}.${cleaned.photo.extension}`;

    await putObject(key, cleaned.photo.bytes, cleaned.photo.contentType);
    const stored = await getObject(key);
    if (!stored) throw new Error('the photo was not stored');
    expect(stored.bytes.equals(cleaned.photo.bytes)).toBe(true);
    expect((await sharp(stored.bytes).metadata()).exif).toBeUndefined();
    await deleteObjects([key]);
  });

  it('deletes every photo of an assessment, and keys without an object are fine', async () => {
    const base = folder();
    const keys = Array.from({ length: 5 }, () => `${base}/${randomUUID()}.jpg`);
    for (const [index, key] of keys.entries()) await putObject(key, photoBytes(1000 + index), 'image/jpeg');
    const kept = `${folder()}/${randomUUID()}.jpg`;
    await putObject(kept, photoBytes(500), 'image/jpeg');

    await deleteObjects([...keys, `${base}/${randomUUID()}.jpg`]);
    for (const key of keys) expect(await getObject(key)).toBeNull();
    expect((await getObject(kept))?.bytes.length).toBe(500);

    await deleteObjects([]);
    await deleteObjects([kept]);
    expect(await getObject(kept)).toBeNull();
  });

  it('answers null for a key that was never stored', async () => {
    expect(await getObject(`${folder()}/${randomUUID()}.webp`)).toBeNull();
  });

  it('refuses keys that are not ours before asking storage', async () => {
    for (const key of ['../etc/passwd', '/assessments/a.jpg', 'assessments//a.jpg', 'tamsin creek.jpg', 'assessments/a/', '']) {
      await expect(putObject(key, photoBytes(10), 'image/jpeg')).rejects.toThrow(/Not a storage key of ours/);
    }
    await expect(deleteObjects(['assessments/a.jpg', 'a/../b.jpg'])).rejects.toThrow(/Not a storage key of ours/);
  });
});

describe('object storage settings and failures', () => {
  it('names the missing setting', async () => {
    vi.stubEnv('S3_BUCKET', '');
    const adapter = await freshAdapter();
    await expect(adapter.getObject('assessments/a/b.jpg')).rejects.toThrow(/^S3_BUCKET is not set/);
  });

  it('turns storage that does not answer into SERVICE_UNAVAILABLE', async () => {
    vi.stubEnv('S3_ENDPOINT', 'http://127.0.0.1:1');
    const logged = vi.spyOn(console, 'error').mockImplementation(() => {});
    const adapter = await freshAdapter();
    await expect(adapter.putObject('assessments/a/b.jpg', photoBytes(10), 'image/jpeg')).rejects.toMatchObject({
      name: 'DomainError',
      code: 'SERVICE_UNAVAILABLE',
      message: 'Photo storage is not answering just now; try again in a few minutes.',
    });
    expect(logged).toHaveBeenCalledWith('[storage] put assessments/a/b.jpg: storage unavailable', expect.anything());
  });

  it('lets a refusal by storage, such as a wrong secret, through as itself', async () => {
    vi.stubEnv('S3_SECRET_ACCESS_KEY', 'not-the-secret');
    const adapter = await freshAdapter();
    const failure = await adapter.putObject('assessments/a/b.jpg', photoBytes(10), 'image/jpeg').then(
      () => undefined,
      (error: unknown) => error,
    );
    expect(failure).toMatchObject({ name: 'SignatureDoesNotMatch' });
  });
});
