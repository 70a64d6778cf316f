import { describe, expect, it } from 'vitest';
import { ACCOUNT_POLICY, CLIENT_POLICY, pauseSeconds } from './password-guard';

describe('wrong-password pauses', () => {
  it('allow five tries per account, then pause 30 s, doubling to an hour', () => {
    expect([1, 2, 3, 4].map((n) => pauseSeconds(ACCOUNT_POLICY, n))).toEqual([0, 0, 0, 0]);
    expect([5, 6, 7, 8].map((n) => pauseSeconds(ACCOUNT_POLICY, n))).toEqual([30, 60, 120, 240]);
    expect(pauseSeconds(ACCOUNT_POLICY, 50)).toBe(3600);
  });

  it('allow twenty tries per client address before pausing', () => {
    expect(pauseSeconds(CLIENT_POLICY, 19)).toBe(0);
    expect(pauseSeconds(CLIENT_POLICY, 20)).toBe(30);
  });
});
