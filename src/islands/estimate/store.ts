/**
 * Shared state of the estimate island. The draft (form values, current step, the
 * submission's idempotency key) is kept in localStorage so a reload finds it; photos,
 * the live estimate and the submission's progress live in memory only.
 */
import { atom, map } from 'nanostores';
import { persistentAtom, persistentMap } from '@nanostores/persistent';
import { NO_ANSWER, requestEstimate, submitAssessment, type ApiFailure, type SubmittedAssessment } from '../../lib/api-client';
import type { PlantInput, PlantResult } from '../../engine';
import { MAX_PHOTO_BYTES, MAX_PHOTOS, PHOTO_FIELD } from '../../schemas/assessment-lists';
import {
  freshValues,
  isStepId,
  migrateDraft,
  newIdempotencyKey,
  type DraftValues,
  type StepId,
} from './draft';

const KEY = 'lagwise:estimate:v1:';

function decodeValues(encoded: string): Partial<DraftValues> {
  try {
    const value: unknown = JSON.parse(encoded);
    if (typeof value === 'object' && value !== null && 'estimate' in value) return migrateDraft(value as Partial<DraftValues>);
  } catch {
    // A damaged entry is dropped: the person starts a fresh draft rather than a broken one.
  }
  return freshValues();
}

/**
 * The form's values at full precision (SI). Consent and the honeypot are never kept:
 * consent is given afresh, and the honeypot is for bots only.
 */
export const $draftValues = persistentAtom<Partial<DraftValues>>(`${KEY}values`, freshValues(), {
  encode: (values) => {
    const { consent: _consent, website: _website, ...kept } = values;
    return JSON.stringify(kept);
  },
  decode: decodeValues,
  // Two tabs editing one draft would overwrite each other's typing; each keeps its own.
  listen: false,
});

export const $step = persistentAtom<StepId>(`${KEY}step`, 'plant', {
  encode: (step: StepId) => step,
  decode: (encoded: string): StepId => (isStepId(encoded) ? encoded : 'plant'),
  listen: false,
});

/** Made when the draft starts and replaced after a successful submission, so a double click stores one assessment. */
export const $idempotencyKey = persistentAtom<string>(`${KEY}idempotency-key`, newIdempotencyKey(), { listen: false });

/**
 * What the person typed in each number box, with the unit system and the SI value it stood
 * for (`US|30.48|100`): a box shows exactly that again while it is in the same units, and a
 * sensible rounding of the converted value in the other (131 ft reads 39.9 m, then 131 ft).
 */
export const $typedFigures = persistentMap<Record<string, string | undefined>>(`${KEY}typed:`, {}, { listen: false });

/** What was typed at a path, if it still stands for `valueSI` in `system`. */
export function typedFigure(path: string, system: string, valueSI: unknown): string | undefined {
  const entry = $typedFigures.get()[path];
  if (!entry || typeof valueSI !== 'number') return undefined;
  const [typedSystem, typedSI, ...text] = entry.split('|');
  return typedSystem === system && Number(typedSI) === valueSI ? text.join('|') : undefined;
}

/** Whether the value at a path is one the person typed (in whichever units), not one the form filled in. */
export function wasTyped(path: string, valueSI: unknown): boolean {
  const entry = $typedFigures.get()[path];
  if (!entry || typeof valueSI !== 'number') return false;
  return Number(entry.split('|')[1]) === valueSI;
}

export function rememberTyped(path: string, system: string, valueSI: number, text: string): void {
  $typedFigures.setKey(path, `${system}|${valueSI}|${text}`);
}

/** Steps that still have a problem (from the assessment schema), for the step list. */
export const $stepsWithProblems = atom<ReadonlySet<StepId>>(new Set());

let keyKept = false;

export function saveDraftValues(values: Partial<DraftValues>): void {
  $draftValues.set(values);
  // The key is only an initial value until written; write it with the draft's first save.
  if (!keyKept) {
    $idempotencyKey.set($idempotencyKey.get());
    keyKept = true;
  }
}

export function goToStep(step: StepId): void {
  $step.set(step);
}

// Photos ---------------------------------------------------------------------------------

/** Photos per run id. File objects cannot be kept in localStorage, so these go on reload. */
export const $photos = map<Record<string, readonly File[]>>({});
/** A sentence per run id about photos refused here or by the server. */
export const $photoMessages = map<Record<string, string | undefined>>({});

const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'image/heic', 'image/heif', 'application/pdf'];
/** Some systems give HEIC photos no declared type; their name is the only hint we have here. */
const HEIC_NAME = /\.(heic|heif)$/i;

function photoCount(): number {
  return Object.values($photos.get()).reduce((sum, files) => sum + files.length, 0);
}

function megabytes(bytes: number): string {
  return `${(bytes / (1024 * 1024)).toFixed(bytes < 1024 * 1024 ? 2 : 1)} MB`;
}

/**
 * Adds photos to a run, refusing obvious mistakes here (the server checks content again):
 * a type that is not JPEG, PNG, WebP, HEIC or PDF, a file over the size limit, or more
 * photos than the assessment may carry. Returns the sentence shown beside the picker.
 */
export function addPhotos(runId: string, files: readonly File[]): string | undefined {
  const refused: string[] = [];
  const accepted: File[] = [];
  let room = MAX_PHOTOS - photoCount();
  for (const file of files) {
    const typeOk = PHOTO_TYPES.includes(file.type) || (file.type === '' && HEIC_NAME.test(file.name));
    if (!typeOk) {
      refused.push(`“${file.name}” is not a JPEG, PNG, WebP, HEIC photo or a PDF.`);
    } else if (file.size > MAX_PHOTO_BYTES) {
      refused.push(`“${file.name}” is ${megabytes(file.size)}; each file may be at most ${megabytes(MAX_PHOTO_BYTES)}.`);
    } else if (room <= 0) {
      refused.push(`“${file.name}” was not added: an assessment can carry at most ${MAX_PHOTOS} photos in all.`);
    } else {
      accepted.push(file);
      room -= 1;
    }
  }
  if (accepted.length > 0) $photos.setKey(runId, [...($photos.get()[runId] ?? []), ...accepted]);
  const message = refused.length > 0 ? refused.join(' ') : undefined;
  $photoMessages.setKey(runId, message);
  return message;
}

export function removePhoto(runId: string, index: number): void {
  const files = $photos.get()[runId] ?? [];
  $photos.setKey(
    runId,
    files.filter((_, i) => i !== index),
  );
  $photoMessages.setKey(runId, undefined);
}

export function photosOfRun(runId: string): readonly File[] {
  return $photos.get()[runId] ?? [];
}

export function setRunPhotos(runId: string, files: readonly File[]): void {
  $photos.setKey(runId, files);
}

export function dropRunPhotos(runId: string): void {
  const { [runId]: _dropped, ...rest } = $photos.get();
  $photos.set(rest);
  $photoMessages.setKey(runId, undefined);
}

// The live estimate ----------------------------------------------------------------------

export interface LiveEstimate {
  /** The latest result the server gave for a valid input. */
  readonly result: PlantResult | null;
  /** The input that result belongs to (as JSON), to tell a current result from an older one. */
  readonly resultFor: string | null;
  /** The input now in the form (as JSON), or null while it is incomplete or invalid. */
  readonly inputFor: string | null;
  readonly loading: boolean;
  /** Why the latest request failed, if it did. */
  readonly failure: ApiFailure | null;
}

export const $estimate = atom<LiveEstimate>({ result: null, resultFor: null, inputFor: null, loading: false, failure: null });

const DEBOUNCE_MS = 400;
let pendingTimer: ReturnType<typeof setTimeout> | undefined;
let inFlight: AbortController | undefined;

function cancelPending(): void {
  if (pendingTimer !== undefined) clearTimeout(pendingTimer);
  pendingTimer = undefined;
  inFlight?.abort();
  inFlight = undefined;
}

/**
 * Asks for the estimate of a valid input ~400 ms after the last change, aborting any
 * request still running for an older input. Null means the input is not complete: the
 * last result stays on screen, marked as older than the form.
 */
export function updateLiveEstimate(input: PlantInput | null): void {
  const key = input === null ? null : JSON.stringify(input);
  const now = $estimate.get();
  if (key === now.inputFor && (now.loading || key === now.resultFor)) return;
  cancelPending();
  if (input === null || key === null) {
    $estimate.set({ ...now, inputFor: null, loading: false, failure: null });
    return;
  }
  if (key === now.resultFor) {
    $estimate.set({ ...now, inputFor: key, loading: false, failure: null });
    return;
  }
  $estimate.set({ ...now, inputFor: key, loading: true, failure: null });
  pendingTimer = setTimeout(() => {
    pendingTimer = undefined;
    const controller = new AbortController();
    inFlight = controller;
    void requestEstimate(input, controller.signal).then((answer) => {
      if (controller.signal.aborted || $estimate.get().inputFor !== key) return;
      inFlight = undefined;
      const latest = $estimate.get();
      $estimate.set(
        answer.ok
          ? { ...latest, result: answer.data.result, resultFor: key, loading: false, failure: null }
          : { ...latest, loading: false, failure: answer },
      );
    });
  }, DEBOUNCE_MS);
}

// Submission -----------------------------------------------------------------------------

export type Submission =
  | { readonly state: 'idle' }
  | { readonly state: 'sending' }
  | { readonly state: 'sent'; readonly assessment: SubmittedAssessment }
  | { readonly state: 'failed'; readonly failure: ApiFailure };

export const $submission = atom<Submission>({ state: 'idle' });

/** Forgets the draft after a successful submission; the next draft gets a new key. */
export function clearDraft(): void {
  cancelPending();
  $draftValues.set(freshValues());
  $step.set('plant');
  $idempotencyKey.set(newIdempotencyKey());
  keyKept = true;
  $photos.set({});
  $photoMessages.set({});
  $typedFigures.set({});
  $estimate.set({ result: null, resultFor: null, inputFor: null, loading: false, failure: null });
}

/**
 * Sends the assessment with its photos. A second call while one is on its way is
 * ignored, so a double click sends once (and the idempotency key covers retries).
 */
export async function sendAssessment(values: DraftValues): Promise<Submission> {
  const now = $submission.get();
  if (now.state === 'sending') return now;
  $submission.set({ state: 'sending' });
  let posting: typeof import('./posting');
  try {
    posting = await import('./posting');
  } catch {
    // The code that writes the body could not be fetched: as good as no answer.
    const failed: Submission = { state: 'failed', failure: NO_ANSWER };
    $submission.set(failed);
    return failed;
  }
  const form = new FormData();
  form.append('assessment', JSON.stringify(posting.toAssessmentInput(values, wasTyped)));
  const runIds = new Set(values.estimate.runs.map((run) => run.id));
  for (const [runId, files] of Object.entries($photos.get())) {
    if (!runIds.has(runId)) continue;
    for (const file of files) form.append(`${PHOTO_FIELD}.${runId}`, file, file.name);
  }
  const answer = await submitAssessment(form, $idempotencyKey.get());
  const outcome: Submission = answer.ok
    ? { state: 'sent', assessment: answer.data.assessment }
    : { state: 'failed', failure: answer };
  if (answer.ok) clearDraft();
  $submission.set(outcome);
  return outcome;
}

/** Back to a fresh form after the confirmation. */
export function startNewDraft(): void {
  clearDraft();
  $submission.set({ state: 'idle' });
}
