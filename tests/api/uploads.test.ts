import sharp from 'sharp';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '../../src/db/client';
import { assessments } from '../../src/db/schema';
import { MAX_PHOTO_BYTES, MAX_PHOTOS } from '../../src/schemas/assessment';
import { ensureTestRegion, submissionForm, validSubmission } from '../support/fixtures';
import { appFetch } from '../support/stack';

type Upload = { field: string; name: string; type: string; bytes: Uint8Array<ArrayBuffer> };

async function submitWith(files: Upload[]) {
  const input = validSubmission();
  const response = await appFetch('/api/assessments', { method: 'POST', body: submissionForm(input, files) });
  const body = (await response.json()) as { error?: { issues?: { path: string; message: string }[] } };
  const stored = await getDb().select({ id: assessments.id }).from(assessments).where(eq(assessments.contactEmail, input.contact.email));
  return { status: response.status, issues: body.error?.issues ?? [], stored: stored.length };
}

describe('photos refused by POST /api/assessments', () => {
  let jpeg: Uint8Array<ArrayBuffer>;
  let gif: Uint8Array<ArrayBuffer>;
  beforeAll(async () => {
    await ensureTestRegion();
    jpeg = new Uint8Array(await sharp({ create: { width: 40, height: 30, channels: 3, background: '#2c6a90' } }).jpeg().toBuffer());
    gif = new Uint8Array(await sharp({ create: { width: 40, height: 30, channels: 3, background: '#2e6a4d' } }).gif().toBuffer());
  });
  afterAll(async () => {
    await closeDb();
  });

  it.each([
    ['a GIF (judged by its bytes, though named .jpg)', () => ({ field: 'photos.steam-1', name: 'boiler-room.jpg', type: 'image/jpeg', bytes: gif }), 400, 'photos.steam-1', /GIF image/],
    ['bytes that are no picture', () => ({ field: 'photos.hw-1', name: 'notes.jpg', type: 'image/jpeg', bytes: new Uint8Array(Buffer.from('dairy notes, not a photo '.repeat(40))) }), 400, 'photos.hw-1', /not a picture we can read/],
    ['an empty file', () => ({ field: 'photos', name: 'blank.png', type: 'image/png', bytes: new Uint8Array(0) }), 400, 'photos', /is empty/],
    ['a file over the size limit', () => ({ field: 'photos', name: 'huge.jpg', type: 'image/jpeg', bytes: new Uint8Array(MAX_PHOTO_BYTES + 1024) }), 413, 'photos', /limit is 10 MB/],
    ['a photo of a run that is not in the assessment', () => ({ field: 'photos.no-such-run', name: 'pump.jpg', type: 'image/jpeg', bytes: jpeg }), 400, 'photos.no-such-run', /not in this assessment/],
  ] as const)('%s', async (_name, make, status, path, message) => {
    const outcome = await submitWith([make()]);
    expect(outcome.status).toBe(status);
    expect(outcome.issues.map((i) => i.path)).toEqual([path]);
    expect(outcome.issues[0]!.message).toMatch(message);
    expect(outcome.stored).toBe(0);
  });

  it('more photos than an assessment takes', async () => {
    const files = Array.from({ length: MAX_PHOTOS + 1 }, (_, i) => ({ field: 'photos', name: `shot-${i}.jpg`, type: 'image/jpeg', bytes: jpeg }));
    const outcome = await submitWith(files);
    expect(outcome.status).toBe(400);
    expect(outcome.issues[0]).toMatchObject({ path: 'photos' });
    expect(outcome.issues[0]!.message).toMatch(new RegExp(`at most ${MAX_PHOTOS}`));
    expect(outcome.stored).toBe(0);
  });
});
