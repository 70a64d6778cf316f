/**
 * The live summary shown above the runs and the contact step, and the polite announcement
 * of each new result for people using a screen reader.
 */
import { useEffect, useRef, useState } from 'react';
import type { PlantResult } from '../../engine';
import type { UnitSystem } from '../../lib/presentation';
import { useUnitSystem } from './fields';
import type { LiveEstimate } from './store';

type Presentation = typeof import('../../lib/presentation');
let presentation: Presentation | null = null;

/**
 * The shared presentation, imported with the first result rather than with the page: nothing
 * is shown before an estimate arrives, and the page's first load stays light. A failed
 * import (a dropped connection) is tried again with the next result.
 */
function usePresentation(result: PlantResult | null): Presentation | null {
  const [loaded, setLoaded] = useState<Presentation | null>(presentation);
  useEffect(() => {
    if (loaded || !result) return;
    let current = true;
    import('../../lib/presentation')
      .then((module) => {
        presentation = module;
        if (current) setLoaded(module);
      })
      .catch(() => undefined);
    return () => {
      current = false;
    };
  }, [loaded, result]);
  return loaded;
}

interface Props {
  live: LiveEstimate;
  onShowResults: () => void;
}

/** How current the figures on screen are, in a few words. */
export function liveStatus(live: LiveEstimate): string | null {
  if (live.loading) return live.result ? 'Updating…' : 'Working out your estimate…';
  if (live.failure) return live.failure.message;
  if (live.result && live.inputFor === null) return 'These figures are from your last complete answers; finish the marked answers to update them.';
  return null;
}

/** The strip's few figures, from the shared presentation (the same strings as the results step). */
function headline(p: Presentation, result: PlantResult, system: UnitSystem) {
  const { lossCost, saving, payback } = p.headlineFor(result, { system });
  return {
    lost: lossCost.value,
    lostRange: lossCost.range?.text ?? lossCost.value,
    saved: saving.value,
    payback: payback.value,
  };
}

export function SummaryStrip({ live, onShowResults }: Props) {
  const status = liveStatus(live);
  const system = useUnitSystem();
  const p = usePresentation(live.result);
  const figures = live.result && p ? headline(p, live.result, system) : null;
  return (
    <section className="summary-strip" aria-labelledby="summary-strip-heading" aria-busy={live.loading}>
      <h2 id="summary-strip-heading" className="summary-strip-title">
        Live estimate
      </h2>
      {figures ? (
        <dl className="summary-figures">
          <div>
            <dt>Lost a year now</dt>
            <dd>
              <span className="summary-value text-ember">{figures.lost}</span>
              <span className="summary-range">likely {figures.lostRange}</span>
            </dd>
          </div>
          <div>
            <dt>Insulating saves a year</dt>
            <dd>
              <span className="summary-value text-mineral">{figures.saved}</span>
            </dd>
          </div>
          <div>
            <dt>Pays back in</dt>
            <dd>
              <span className="summary-value">{figures.payback}</span>
            </dd>
          </div>
        </dl>
      ) : (
        !status && <p className="summary-empty">The estimate appears here as soon as every run has its answers.</p>
      )}
      {status && <p className="summary-status">{status}</p>}
      {figures && (
        <button type="button" className="link-button summary-link" onClick={onShowResults}>
          See the full results
        </button>
      )}
    </section>
  );
}

/** Says each new result once, politely, without moving focus. */
export function ResultAnnouncer({ live }: { live: LiveEstimate }) {
  const system = useUnitSystem();
  const p = usePresentation(live.result);
  const [text, setText] = useState('');
  const announcedFor = useRef<string | null>(null);
  useEffect(() => {
    if (!p || !live.result || live.loading || live.resultFor === announcedFor.current) return;
    const first = announcedFor.current === null;
    announcedFor.current = live.resultFor;
    const figures = headline(p, live.result, system);
    setText(
      `${first ? 'Estimate ready' : 'Estimate updated'}: about ${figures.lost} a year lost, likely ${figures.lostRange}; insulating would save about ${figures.saved} a year.`,
    );
  }, [p, live, system]);
  return (
    <div className="sr-only" aria-live="polite" aria-atomic="true">
      {text}
    </div>
  );
}
