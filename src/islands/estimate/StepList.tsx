/**
 * The visible list of steps. A step can be opened once every step before it is complete;
 * the current one is marked with aria-current="step".
 */
import { useStore } from '@nanostores/react';
import { $stepsWithProblems } from './store';
import { STEPS, stepIndex, type StepId } from './draft';

interface Props {
  current: StepId;
  onGo: (step: StepId) => void;
}

export function StepList({ current, onGo }: Props) {
  const problems = useStore($stepsWithProblems);
  const currentIndex = stepIndex(current);
  // A step opens when all steps before it are complete; results need nothing of their own.
  const firstIncomplete = STEPS.findIndex((s) => problems.has(s.id));
  const lastOpen = firstIncomplete === -1 ? STEPS.length - 1 : firstIncomplete;
  return (
    <nav aria-label="Steps of the estimate">
      <ol className="step-list">
        {STEPS.map((s, i) => {
          const isCurrent = s.id === current;
          const open = i <= lastOpen || i <= currentIndex;
          const done = i < currentIndex && !problems.has(s.id);
          const state = isCurrent ? 'current' : done ? 'done' : open ? 'open' : 'locked';
          return (
            <li key={s.id} className="step-item" data-state={state}>
              <button
                type="button"
                className="step-button"
                aria-current={isCurrent ? 'step' : undefined}
                disabled={!open || isCurrent}
                onClick={() => onGo(s.id)}
              >
                <span className="step-number" aria-hidden="true">
                  {i + 1}
                </span>
                <span className="step-title">{s.title}</span>
                <span className="sr-only">
                  {isCurrent ? ' (this step)' : done ? ' (complete)' : open ? '' : ' (complete the steps before it first)'}
                </span>
              </button>
            </li>
          );
        })}
      </ol>
    </nav>
  );
}
