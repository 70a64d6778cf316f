/**
 * What needs a look on this step, in one place at its top: each problem as a link to its
 * field, plus a sentence when the server could not be reached or refused the request.
 */
import { useFormState } from 'react-hook-form';
import { useStore } from '@nanostores/react';
import type { ApiFailure } from '../../lib/api-client';
import { $photoMessages } from './store';
import { STEP_FIELDS, stepOfPath, type DraftValues, type StepId } from './draft';
import { fieldId, inPageOrder } from './fields';

interface Props {
  step: StepId;
  notice: string | null;
  failure: ApiFailure | null;
}

function ownMessage(node: unknown): string | undefined {
  const message = (node as { message?: unknown } | undefined)?.message;
  return typeof message === 'string' && message ? message : undefined;
}

/** Every error under the step's paths, as `{ path, message }`. */
function problemsOf(errors: unknown, step: StepId): { path: string; message: string }[] {
  const all: { path: string; message: string }[] = [];
  const walk = (node: unknown, path: string) => {
    if (typeof node !== 'object' || node === null) return;
    const message = ownMessage(node);
    if (path && message) all.push({ path, message });
    for (const [key, child] of Object.entries(node)) {
      if (key === 'ref' || key === 'message' || key === 'type' || key === 'types') continue;
      if (key === 'root') {
        const rootMessage = ownMessage(child);
        if (rootMessage) all.push({ path, message: rootMessage });
        continue;
      }
      walk(child, path ? `${path}.${key}` : key);
    }
  };
  walk(errors, '');
  const prefixes: readonly string[] = STEP_FIELDS[step];
  const mine = all.filter((p) => stepOfPath(p.path) === step || prefixes.some((prefix) => p.path.startsWith(prefix)));
  // Listed top to bottom as the fields stand on the page.
  const order = inPageOrder(mine.map((p) => p.path));
  return [...mine].sort((a, b) => order.indexOf(a.path) - order.indexOf(b.path));
}

export function ErrorSummary({ step, notice, failure }: Props) {
  const { errors } = useFormState<DraftValues>();
  const photoMessages = useStore($photoMessages);
  const problems = problemsOf(errors, step);
  const plantPhotoMessage = photoMessages.plant;
  const failureSentence = failure && failure.status !== 400 ? failure.message : null;
  const plantPhotos = step === 'runs' ? plantPhotoMessage : undefined;
  if (!notice && !failureSentence && !plantPhotos) return null;
  return (
    <div className="error-summary" role="alert">
      {failureSentence && <p className="font-semibold">{failureSentence} Your answers are still here.</p>}
      {notice && <p className="font-semibold">{notice}</p>}
      {notice && problems.length > 0 && (
        <ul className="error-summary-list">
          {problems.map((problem) => (
            <li key={problem.path}>
              <a href={`#${fieldId(problem.path)}`}>{problem.message}</a>
            </li>
          ))}
        </ul>
      )}
      {plantPhotos && <p>{plantPhotos}</p>}
    </div>
  );
}

