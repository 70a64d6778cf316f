/**
 * Step 3: the pipe runs — any number, added, duplicated and removed with a button each
 * (all reachable by keyboard), with an undo for the last removal.
 */
import { useEffect, useRef, useState } from 'react';
import { useFieldArray, useFormContext } from 'react-hook-form';
import { draftMarket, duplicateRun, newRun, type DraftRun, type DraftValues } from './draft';
import { dropRunPhotos, photosOfRun, setRunPhotos } from './store';
import { RunCard } from './RunCard';
import { AreasPanel } from './AreasPanel';
import { useFieldError, useUnitSystem } from './fields';

interface Removed {
  readonly index: number;
  readonly run: DraftRun;
  readonly photos: readonly File[];
}

export function RunsStep() {
  const { control, getValues } = useFormContext<DraftValues>();
  const system = useUnitSystem();
  const { fields, append, insert, remove } = useFieldArray({ control, name: 'estimate.runs', keyName: 'key' });
  const listError = useFieldError('estimate.runs');
  const [removed, setRemoved] = useState<Removed | null>(null);
  const headings = useRef(new Map<string, HTMLHeadingElement>());
  const focusRunId = useRef<string | null>(null);
  const addButton = useRef<HTMLButtonElement>(null);
  const undoButton = useRef<HTMLButtonElement>(null);

  useEffect(() => {
    const id = focusRunId.current;
    if (!id) return;
    focusRunId.current = null;
    if (id === 'add') addButton.current?.focus();
    else if (id === 'undo') undoButton.current?.focus();
    else headings.current.get(id)?.focus();
  }, [fields]);

  function add() {
    const index = fields.length;
    setRemoved(null);
    append(newRun(draftMarket(getValues('plant.countryCode'), system), index + 1), { focusName: `estimate.runs.${index}.label` });
  }

  function duplicate(index: number) {
    const run = getValues(`estimate.runs.${index}`);
    setRemoved(null);
    insert(index + 1, duplicateRun(run), { focusName: `estimate.runs.${index + 1}.label` });
  }

  function removeAt(index: number) {
    const run = getValues(`estimate.runs.${index}`);
    const photos = photosOfRun(run.id);
    setRemoved({ index, run, photos });
    dropRunPhotos(run.id);
    const neighbor = getValues(`estimate.runs.${index + 1}`) ?? getValues(`estimate.runs.${index - 1}`);
    focusRunId.current = neighbor ? neighbor.id : 'undo';
    remove(index);
  }

  function undo() {
    if (!removed) return;
    const index = Math.min(removed.index, fields.length);
    insert(index, removed.run, { focusName: `estimate.runs.${index}.label` });
    if (removed.photos.length > 0) setRunPhotos(removed.run.id, removed.photos);
    setRemoved(null);
  }

  return (
    <div className="step-body">
      <p className="step-lead">
        One entry per stretch of pipe that is alike from end to end: the same service, size and state.
        A rough length is enough; a consultant measures later.
      </p>

      {listError && (
        <p className="field-error" id="f-estimate-runs-error">
          {listError}
        </p>
      )}

      <ol className="run-list" aria-label="Pipe runs">
        {fields.map((field, index) => (
          <li key={field.key}>
            <RunCard
              index={index}
              count={fields.length}
              headingRef={(element) => {
                const id = getValues(`estimate.runs.${index}.id`);
                if (element) headings.current.set(id, element);
              }}
              onDuplicate={() => duplicate(index)}
              onRemove={() => removeAt(index)}
            />
          </li>
        ))}
      </ol>

      <div aria-live="polite" className="run-undo">
        {removed && (
          <p>
            Removed “{removed.run.label}”.{' '}
            <button ref={undoButton} type="button" className="link-button" onClick={undo}>
              Put it back
            </button>
          </p>
        )}
      </div>

      <button ref={addButton} type="button" className="btn btn-quiet add-run" onClick={add}>
        <span aria-hidden="true">+</span> Add a run
      </button>

      <AreasPanel />
    </div>
  );
}
