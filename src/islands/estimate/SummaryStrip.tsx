/**
 * The live summary shown above the runs and the contact step, and the polite announcement
 * of each new result for people using a screen reader.
 */
import { useEffect, useRef, useState } from 'react';
import type { PlantResult } from '../../engine';
import { formatMoney, formatRange, formatYears } from '../../lib/units-display';
import type { LiveEstimate } from './store';

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

function headline(result: PlantResult) {
  const money = (value: number) => formatMoney(value, result.currency);
  const moneyRange = (value: number) => formatMoney(value, result.currency, { significant: 2 });
  return {
    lost: money(result.range.currentAnnualCost.likely),
    lostRange: formatRange(result.range.currentAnnualCost.low, result.range.currentAnnualCost.high, moneyRange),
    saved: money(result.range.annualCostSaving.likely),
    payback: formatYears(result.totals.simplePaybackYears),
  };
}

export function SummaryStrip({ live, onShowResults }: Props) {
  const status = liveStatus(live);
  const figures = live.result ? headline(live.result) : null;
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
  const [text, setText] = useState('');
  const announcedFor = useRef<string | null>(null);
  useEffect(() => {
    if (!live.result || live.loading || live.resultFor === announcedFor.current) return;
    const first = announcedFor.current === null;
    announcedFor.current = live.resultFor;
    const figures = headline(live.result);
    setText(
      `${first ? 'Estimate ready' : 'Estimate updated'}: about ${figures.lost} a year lost, likely ${figures.lostRange}; insulating would save about ${figures.saved} a year.`,
    );
  }, [live]);
  return (
    <div className="sr-only" aria-live="polite" aria-atomic="true">
      {text}
    </div>
  );
}
