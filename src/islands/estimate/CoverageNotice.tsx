/**
 * Whether a consultant covers the plant's postal code, said at the plant step as soon as the
 * country and a well-formed code are in — honestly, either way; the owner may still send.
 */
import { useEffect, useState } from 'react';
import { useWatch } from 'react-hook-form';
import { requestCoverage, type CoverageAnswer } from '../../lib/api-client';
import { isCountryCode, normalisePostalCode } from '../../lib/routing/postal-code';
import type { DraftValues } from './draft';

/** Asked once typing pauses, so a code is not asked about letter by letter. */
const PAUSE_MS = 400;

type Coverage = { state: 'idle' } | { state: 'asking' } | { state: 'known'; answer: CoverageAnswer } | { state: 'unknown' };

export function CoverageNotice() {
  const [country, postalCode] = useWatch<DraftValues>({ name: ['plant.countryCode', 'plant.postalCode'] }) as [unknown, unknown];
  const [coverage, setCoverage] = useState<Coverage>({ state: 'idle' });
  const code = typeof postalCode === 'string' ? postalCode : '';
  const wellFormed = typeof country === 'string' && isCountryCode(country) && normalisePostalCode(country, code).ok;

  useEffect(() => {
    if (!wellFormed || typeof country !== 'string') {
      setCoverage({ state: 'idle' });
      return;
    }
    const controller = new AbortController();
    const timer = setTimeout(() => {
      setCoverage({ state: 'asking' });
      void requestCoverage(country, code, controller.signal).then((result) => {
        if (controller.signal.aborted) return;
        setCoverage(result.ok ? { state: 'known', answer: result.data } : { state: 'unknown' });
      });
    }, PAUSE_MS);
    return () => {
      clearTimeout(timer);
      controller.abort();
    };
  }, [wellFormed, country, code]);

  if (coverage.state === 'idle' || coverage.state === 'asking') {
    return <p className="coverage-notice" role="status" aria-live="polite" data-coverage={coverage.state} />;
  }
  if (coverage.state === 'unknown') {
    return (
      <p className="coverage-notice" role="status" aria-live="polite" data-coverage="unknown">
        We could not check just now who covers this postal code; you can carry on and send as usual.
      </p>
    );
  }
  const { answer } = coverage;
  return (
    <p className={`coverage-notice ${answer.covered ? 'coverage-yes' : 'coverage-no'}`} role="status" aria-live="polite" data-coverage={answer.covered ? 'covered' : 'not-covered'}>
      {answer.covered ? (
        <>A consultant covers {answer.regionName}: once you send, they can follow up on your plant.</>
      ) : (
        <>
          No consultant covers postal code {answer.postalCode} yet. The figures work all the same, and you can still send
          them: we then look for a consultant by hand and let you know who takes it on.
        </>
      )}
    </p>
  );
}
