import { createAssessmentSchema, MAX_PHOTO_BYTES, MAX_PHOTOS, PHOTO_FIELD } from '../../../schemas/assessment';
import { submitAssessmentAnswerSchema } from '../../../schemas/assessment-answer';
import { submissionFingerprint, submitAssessment, type SubmittedPhoto } from '../../../lib/assessments/submit';
import { answer, endpoint, HttpResponseError, parseJsonBody, parseValue, validationFailed } from '../../../lib/http';
import { readMultipart } from '../../../lib/multipart';
import { checkPhotoCount, cleanPhoto, photoRefusalError } from '../../../lib/uploads/photos';

export const prerender = false;

const MAX_BODY_BYTES = MAX_PHOTOS * MAX_PHOTO_BYTES + 2 * 1024 * 1024;

function idempotencyKeyOf(request: Request): string | undefined {
  const key = request.headers.get('idempotency-key')?.trim();
  if (!key) return undefined;
  if (!/^[A-Za-z0-9_\-:.]{8,128}$/.test(key)) {
    throw new HttpResponseError(
      validationFailed([{ path: 'Idempotency-Key', message: 'The Idempotency-Key header must be 8–128 letters, digits, - _ : or . (a UUID is ideal).' }]),
    );
  }
  return key;
}

async function photosOf(form: FormData): Promise<SubmittedPhoto[]> {
  const files = [...form.entries()].filter(
    (entry): entry is [string, File] =>
      (entry[0] === PHOTO_FIELD || entry[0].startsWith(`${PHOTO_FIELD}.`)) && typeof entry[1] !== 'string',
  );
  const count = checkPhotoCount(files.length);
  if (!count.ok) throw photoRefusalError(count, PHOTO_FIELD);
  const photos: SubmittedPhoto[] = [];
  for (const [field, file] of files) {
    const checked = await cleanPhoto(new Uint8Array(await file.arrayBuffer()), file.name || undefined);
    if (!checked.ok) throw photoRefusalError(checked, field);
    photos.push({ runId: field === PHOTO_FIELD ? null : field.slice(PHOTO_FIELD.length + 1), photo: checked.photo });
  }
  return photos;
}

/**
 * Submits an assessment: JSON (no photos) or multipart/form-data with the JSON in the part
 * `assessment` and photos as `photos.<runId>` (or `photos` for the whole plant).
 */
export const POST = endpoint(async ({ request, clientAddress }) => {
  const idempotencyKey = idempotencyKeyOf(request);
  const type = (request.headers.get('content-type') ?? '').toLowerCase();
  let input;
  let photos: SubmittedPhoto[] = [];
  if (type.startsWith('multipart/form-data')) {
    const form = await readMultipart(request, MAX_BODY_BYTES);
    const raw = form.get('assessment');
    if (typeof raw !== 'string') {
      throw new HttpResponseError(validationFailed([{ path: 'assessment', message: 'Send the assessment as JSON in the form part "assessment".' }]));
    }
    let parsed: unknown;
    try {
      parsed = JSON.parse(raw);
    } catch {
      throw new HttpResponseError(validationFailed([{ path: 'assessment', message: 'The part "assessment" is not valid JSON.' }]));
    }
    input = parseValue(createAssessmentSchema, parsed);
    photos = await photosOf(form);
  } else {
    input = await parseJsonBody(request, createAssessmentSchema);
  }
  const fingerprint = submissionFingerprint(input, photos);
  const outcome = await submitAssessment(input, photos, { idempotencyKey, fingerprint, clientAddress });
  return answer(submitAssessmentAnswerSchema, { assessment: outcome.assessment }, outcome.replayed ? 200 : 201);
});
