/**
 * The estimate wizard: plant → energy → pipe runs → results → contact, one form over the
 * assessment schema, the draft kept in the store so a reload finds it.
 */
import { lazy, Suspense, useEffect, useRef, useState, type ReactNode } from 'react';
import { FormProvider, useForm, type FieldErrors, type UseFormReturn } from 'react-hook-form';
import { useStore } from '@nanostores/react';
import { fieldContextOf, loadValidation, wordedResolver } from './resolver';
import {
  $draftValues,
  $estimate,
  $photoMessages,
  $step,
  $stepsWithProblems,
  $submission,
  goToStep,
  saveDraftValues,
  sendAssessment,
  startNewDraft,
  updateLiveEstimate,
  wasTyped,
} from './store';
import {
  freshValues,
  STEP_FIELDS,
  STEPS,
  stepIndex,
  stepOfPath,
  type DraftValues,
  type StepId,
} from './draft';
import { StepList } from './StepList';
import { UnitSwitch } from './UnitSwitch';
import { PlantStep } from './PlantStep';
import { errorMessageAt, inPageOrder, type Name } from './fields';

/** The results view is the largest step; it loads once the runs step opens, before anyone needs it. */
const loadResultsStep = () => import('./ResultsStep');
const ResultsStep = lazy(() => loadResultsStep().then((module) => ({ default: module.ResultsStep })));
/** The runs step (the form's largest part) loads while the person answers the plant step. */
const loadRunsStep = () => import('./RunsStep');
const RunsStep = lazy(() => loadRunsStep().then((module) => ({ default: module.RunsStep })));
/** The later steps, the figures strip and the confirmation load with the runs step: the plant step is all a first visit needs. */
const loadLaterSteps = () =>
  Promise.all([import('./EnergyStep'), import('./ContactStep'), import('./Confirmation'), import('./SummaryStrip'), import('./ErrorSummary')]);
/** The list of what needs a look: nothing does before the first check, so it comes with the later steps. */
const ErrorSummary = lazy(() => import('./ErrorSummary').then((module) => ({ default: module.ErrorSummary })));
const EnergyStep = lazy(() => import('./EnergyStep').then((module) => ({ default: module.EnergyStep })));
const ContactStep = lazy(() => import('./ContactStep').then((module) => ({ default: module.ContactStep })));
const SummaryStrip = lazy(() => import('./SummaryStrip').then((module) => ({ default: module.SummaryStrip })));
const ResultAnnouncer = lazy(() => import('./SummaryStrip').then((module) => ({ default: module.ResultAnnouncer })));
const Confirmation = lazy(() => import('./Confirmation').then((module) => ({ default: module.Confirmation })));

interface Props {
  /** The site's cautions (rendered by the page), shown with the results. */
  cautions?: ReactNode;
}

/**
 * The form is only built in the browser: the draft comes from localStorage, so the server
 * renders nothing here (the page's noscript sentence covers browsers without JavaScript).
 */
export default function EstimateWizard({ cautions }: Props) {
  const [inBrowser, setInBrowser] = useState(false);
  useEffect(() => setInBrowser(true), []);
  const submission = useStore($submission);
  if (!inBrowser) return null;
  if (submission.state === 'sent') {
    return (
      <Suspense fallback={<p className="summary-status">Opening your confirmation…</p>}>
        <Confirmation assessment={submission.assessment} onStartAgain={startNewDraft} />
      </Suspense>
    );
  }
  return <Wizard cautions={cautions} />;
}

const STEPS_WITH_LIVE_RESULTS: readonly StepId[] = ['runs', 'results', 'contact'];

/** Keeps the store in step with the form: saves the draft, marks steps with problems, asks for the estimate. */
function syncStore(values: unknown, step: StepId): void {
  saveDraftValues(values as Partial<DraftValues>);
  // Checks in the order the changes came: every call waits on the one import of the checks.
  void loadValidation().then(({ stepsWithProblems, validPlantInput }) => {
    $stepsWithProblems.set(stepsWithProblems(values));
    if (STEPS_WITH_LIVE_RESULTS.includes(step)) {
      updateLiveEstimate(validPlantInput((values as Partial<DraftValues>).estimate, (values as Partial<DraftValues>).plant?.countryCode, wasTyped));
    }
  });
}

/** Every dotted path that carries an error message, in form order. */
function errorPaths(errors: FieldErrors<DraftValues>): string[] {
  const paths: string[] = [];
  const walk = (node: unknown, prefix: string) => {
    if (typeof node !== 'object' || node === null) return;
    if (prefix && errorMessageAt(errors, prefix)) paths.push(prefix);
    for (const [key, child] of Object.entries(node)) {
      if (key === 'ref' || key === 'message' || key === 'type' || key === 'types' || key === 'root') continue;
      walk(child, prefix ? `${prefix}.${key}` : key);
    }
  };
  walk(errors, '');
  return paths;
}

/**
 * The errors as they stand right now. `formState` is a snapshot of the last render, so just
 * after `trigger` resolves it is still empty; getFieldState reads the form's live state.
 */
function liveErrors(form: UseFormReturn<DraftValues, unknown, unknown>): FieldErrors<DraftValues> {
  const roots = ['plant', 'estimate', 'contact', 'consent', 'website'] as const;
  return Object.fromEntries(
    roots.map((root) => [root, form.getFieldState(root).error]).filter(([, error]) => error !== undefined),
  ) as FieldErrors<DraftValues>;
}

function Wizard({ cautions }: Props) {
  const step = useStore($step);
  const submission = useStore($submission);
  const form = useForm({
    resolver: wordedResolver,
    defaultValues: { ...freshValues(), ...$draftValues.get() },
    mode: 'onTouched',
    reValidateMode: 'onChange',
  });
  const headingRef = useRef<HTMLHeadingElement>(null);
  const movedByPerson = useRef(false);
  const focusAfterMove = useRef<string | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  // A field inside a closed part (the proposal) can only take focus once the render that opens it is done.
  const [focusTarget, setFocusTarget] = useState<string | null>(null);
  useEffect(() => {
    if (!focusTarget) return;
    form.setFocus(focusTarget as Name);
    setFocusTarget(null);
  }, [focusTarget, form]);

  useEffect(() => {
    syncStore(form.getValues(), $step.get());
    const subscription = form.watch((values) => syncStore(values, $step.get()));
    const unlisten = $step.listen((next) => syncStore(form.getValues(), next));
    return () => {
      subscription.unsubscribe();
      unlisten();
    };
  }, [form]);

  useEffect(() => {
    // Focus follows a step change the person asked for, not the first paint of a restored draft.
    const field = focusAfterMove.current;
    focusAfterMove.current = null;
    if (field) form.setFocus(field as Name);
    else if (movedByPerson.current) headingRef.current?.focus();
    movedByPerson.current = false;
  }, [step, form]);

  const current = STEPS[stepIndex(step)] ?? STEPS[0];
  const index = stepIndex(step);

  useEffect(() => {
    if (STEPS_WITH_LIVE_RESULTS.includes(step)) void loadResultsStep();
    else void loadRunsStep();
    void loadLaterSteps();
  }, [step]);

  function moveTo(target: StepId) {
    movedByPerson.current = true;
    setNotice(null);
    goToStep(target);
  }

  async function next() {
    const fields = STEP_FIELDS[step] as readonly Name[];
    if (fields.length > 0) {
      const valid = await form.trigger(fields as Name[], { shouldFocus: true });
      if (!valid) {
        // A rule over the whole estimate (say a price unit the fuel does not take) may belong to an earlier step.
        const paths = errorPaths(liveErrors(form));
        const owner = paths.map(stepOfPath).reduce<StepId>((a, b) => (stepIndex(b) < stepIndex(a) ? b : a), step);
        const first = paths.find((path) => stepOfPath(path) === owner);
        if (stepIndex(owner) < index) {
          focusAfterMove.current = first ?? null;
          moveTo(owner);
          setNotice('An earlier answer needs a look before the estimate can go on; it is marked below.');
          return;
        }
        setNotice('Some answers need a look before you go on; each one is marked below.');
        const active = document.activeElement;
        if (!(active instanceof HTMLElement && active.getAttribute('aria-invalid') === 'true')) {
          setFocusTarget(inPageOrder(paths.filter((path) => stepOfPath(path) === step))[0] ?? null);
        }
        return;
      }
    }
    const following = STEPS[index + 1];
    if (following) moveTo(following.id);
  }

  function back() {
    const previous = STEPS[index - 1];
    if (previous) moveTo(previous.id);
  }

  const submit = form.handleSubmit(
    async () => {
      const outcome = await sendAssessment(form.getValues());
      if (outcome.state !== 'failed') return;
      const { failure } = outcome;
      const fieldIssues = failure.issues.filter((issue) => !issue.path.startsWith('photos') && issue.path !== '(body)');
      // The server speaks SI; its range facts are said again in the units the person typed in.
      const { fieldMessage } = await import('../../lib/field-messages');
      const context = fieldContextOf(form.getValues());
      for (const issue of fieldIssues) {
        const message = fieldMessage({ ...issue, typed: form.getValues(issue.path as Name) }, context);
        form.setError(issue.path as Name, { type: 'server', message });
      }
      for (const issue of failure.issues.filter((i) => i.path.startsWith('photos'))) {
        const runId = issue.path.slice('photos.'.length);
        $photoMessages.setKey(runId || 'plant', issue.message);
      }
      const fieldPaths = fieldIssues.map((issue) => issue.path);
      if (failure.status === 400 && failure.issues.length > 0) {
        const owners = failure.issues.map((issue) => stepOfPath(issue.path));
        const earliest = owners.reduce((a, b) => (stepIndex(b) < stepIndex(a) ? b : a));
        const firstField = fieldPaths.find((path) => stepOfPath(path) === earliest);
        if (earliest !== step) {
          focusAfterMove.current = firstField ?? null;
          moveTo(earliest);
        } else if (firstField) {
          form.setFocus(firstField as Name);
        }
        setNotice('The server could not take the assessment as it is; the answers to change are marked.');
      }
    },
    () => setNotice('Some answers need a look before you send; each one is marked below.'),
  );

  const live = useStore($estimate);
  const showStrip = STEPS_WITH_LIVE_RESULTS.includes(step) && step !== 'results';

  return (
    <FormProvider {...form}>
      <div className="estimate">
        <div className="estimate-top">
          <StepList current={step} onGo={moveTo} />
          <UnitSwitch />
        </div>

        <Suspense fallback={null}>
          {showStrip && <SummaryStrip live={live} onShowResults={() => moveTo('results')} />}
          {STEPS_WITH_LIVE_RESULTS.includes(step) && <ResultAnnouncer live={live} />}
        </Suspense>

        <form
          noValidate
          onSubmit={(event) => {
            event.preventDefault();
            if (step === 'contact') void submit(event);
            else void next();
          }}
          aria-labelledby="estimate-step-heading"
        >
          <div className="step-head">
            <p className="eyebrow">
              Step {index + 1} of {STEPS.length}
            </p>
            <h2 id="estimate-step-heading" ref={headingRef} tabIndex={-1} className="step-heading">
              {current.heading}
            </h2>
          </div>

          <Suspense fallback={null}>
            <ErrorSummary step={step} notice={notice} failure={submission.state === 'failed' ? submission.failure : null} />
          </Suspense>

          {step === 'plant' && <PlantStep />}
          {step === 'energy' && (
            <Suspense fallback={<p className="summary-status">Opening the fuel questions…</p>}>
              <EnergyStep />
            </Suspense>
          )}
          {step === 'runs' && (
            <Suspense fallback={<p className="summary-status">Opening the pipe runs…</p>}>
              <RunsStep />
            </Suspense>
          )}
          {step === 'results' && (
            <Suspense fallback={<p className="summary-status">Opening the results…</p>}>
              <ResultsStep live={live} cautions={cautions} />
            </Suspense>
          )}
          {step === 'contact' && (
            <Suspense fallback={<p className="summary-status">Opening the contact step…</p>}>
              <ContactStep sending={submission.state === 'sending'} />
            </Suspense>
          )}

          <div className="step-nav">
            {index > 0 && (
              <button type="button" className="btn btn-quiet" onClick={back}>
                Back to {STEPS[index - 1]?.title.toLowerCase()}
              </button>
            )}
            {step !== 'contact' ? (
              <button type="submit" className="btn btn-primary">
                {step === 'results' ? 'Ask a consultant to follow up' : `Next: ${STEPS[index + 1]?.title.toLowerCase()}`}
              </button>
            ) : (
              <button type="submit" className="btn btn-primary" disabled={submission.state === 'sending'} aria-disabled={submission.state === 'sending'}>
                {submission.state === 'sending' ? 'Sending…' : 'Send my assessment'}
              </button>
            )}
          </div>
        </form>
      </div>
    </FormProvider>
  );
}
