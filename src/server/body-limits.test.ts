import { describe, expect, it } from 'vitest';
import { MAX_PHOTO_BYTES, MAX_PHOTOS } from '../schemas/assessment';
import { DEFAULT_MAX_BODY_BYTES, maxBodyBytesFor, SUBMISSION_MAX_BODY_BYTES } from './body-limits';

describe('maxBodyBytesFor', () => {
  it('lets a submission carry every photo the form allows, and nothing else more than 1 MB', () => {
    expect(SUBMISSION_MAX_BODY_BYTES).toBe(MAX_PHOTOS * MAX_PHOTO_BYTES + 2 * 1024 * 1024);
    expect(maxBodyBytesFor('/api/assessments')).toBe(SUBMISSION_MAX_BODY_BYTES);
    for (const route of ['/api/estimate', '/api/sign-in/password', '/api/auth/sign-out', '/api/assessments/x/notes', '/']) {
      expect(maxBodyBytesFor(route)).toBe(DEFAULT_MAX_BODY_BYTES);
    }
  });
});
