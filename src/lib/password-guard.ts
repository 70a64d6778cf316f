/**
 * Password sign-in, held against guessing: wrong tries are counted in PostgreSQL per account and
 * per client address (so every server counts together), each earning a longer pause, and while
 * a pause runs further tries are refused without the password being checked. Checking a
 * password is deliberately slow (scrypt), so only a few run at once in a process; the rest wait
 * their turn briefly or are told to come back.
 */
import pLimit from 'p-limit';
import { getDb } from '../db/client';
import { clearThrottle, readThrottles, recordFailure } from '../db/queries/sign-in-throttles';
import { DomainError } from './errors';

export interface ThrottlePolicy {
  /** Wrong tries allowed before pauses begin. */
  freeFailures: number;
  /** The first pause, in seconds; each further wrong try doubles it. */
  firstPauseSeconds: number;
  maxPauseSeconds: number;
}

/** Per account: five tries, then 30 s, 1 min, 2 min … up to an hour. */
export const ACCOUNT_POLICY: ThrottlePolicy = { freeFailures: 5, firstPauseSeconds: 30, maxPauseSeconds: 3600 };
/** Per client address: a shared office may mistype more, across accounts. */
export const CLIENT_POLICY: ThrottlePolicy = { freeFailures: 20, firstPauseSeconds: 30, maxPauseSeconds: 3600 };
/** A run of wrong tries is forgotten a day after the last one. */
export const FORGET_AFTER_SECONDS = 24 * 3600;

/** The pause earned by the n-th wrong try in a row. */
export function pauseSeconds(policy: ThrottlePolicy, failures: number): number {
  if (failures < policy.freeFailures) return 0;
  return Math.min(policy.maxPauseSeconds, policy.firstPauseSeconds * 2 ** (failures - policy.freeFailures));
}

const accountKey = (email: string) => `account:${email}`;
const clientKey = (address: string) => `client:${address}`;

function pausedMessage(seconds: number): string {
  const wait = seconds < 90 ? `${Math.max(1, Math.ceil(seconds))} seconds` : `${Math.ceil(seconds / 60)} minutes`;
  return `Too many wrong passwords. For your account's safety, sign-in is paused; try again in ${wait}, or ask your Lagwise admin to reset your password.`;
}

/** Refuses (RATE_LIMITED, with Retry-After) while the account or the client is paused. */
export async function assertMayTryPassword(email: string, clientAddress: string, now = new Date()): Promise<void> {
  const states = await readThrottles(getDb(), [accountKey(email), clientKey(clientAddress)]);
  const until = Math.max(0, ...states.map((s) => s.lockedUntil?.getTime() ?? 0));
  if (until > now.getTime()) {
    const seconds = (until - now.getTime()) / 1000;
    throw new DomainError('RATE_LIMITED', pausedMessage(seconds)).withRetryAfter(seconds);
  }
}

/** Counts a wrong password against both keys. */
export async function recordWrongPassword(email: string, clientAddress: string): Promise<void> {
  const db = getDb();
  await recordFailure(db, accountKey(email), (n) => pauseSeconds(ACCOUNT_POLICY, n), FORGET_AFTER_SECONDS);
  await recordFailure(db, clientKey(clientAddress), (n) => pauseSeconds(CLIENT_POLICY, n), FORGET_AFTER_SECONDS);
}

export async function recordRightPassword(email: string): Promise<void> {
  await clearThrottle(getDb(), accountKey(email));
}

/** Password checks running at once in this process; scrypt takes a core each. */
export const HASHING_CONCURRENCY = 2;
/** Beyond this many waiting, a try is turned away at once rather than queued. */
export const HASHING_QUEUE_LIMIT = 16;
const hashing = pLimit(HASHING_CONCURRENCY);

/** Runs a password check in its turn, or refuses when too many are waiting. */
export function withHashingSlot<T>(work: () => Promise<T>): Promise<T> {
  if (hashing.pendingCount >= HASHING_QUEUE_LIMIT) {
    return Promise.reject(
      new DomainError('RATE_LIMITED', 'Sign-in is busy just now; please try again in a few seconds.').withRetryAfter(5),
    );
  }
  return hashing(work);
}
