/** After a successful submission: the reference, the sign-in e-mail, and who covers the region. */
import { useEffect, useRef } from 'react';
import type { SubmittedAssessment } from '../../lib/api-client';

interface Props {
  assessment: SubmittedAssessment;
  onStartAgain: () => void;
}

export function Confirmation({ assessment, onStartAgain }: Props) {
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => heading.current?.focus(), []);
  return (
    <section className="confirmation" aria-labelledby="confirmation-heading">
      <p className="eyebrow text-mineral">Sent</p>
      <h2 id="confirmation-heading" ref={heading} tabIndex={-1} className="step-heading">
        Your assessment is in
      </h2>
      <p className="confirmation-reference">
        Reference <strong className="figure-num">{assessment.reference}</strong>
      </p>
      <p>Check your inbox for a sign-in link: it opens your assessment, its status and, later, the consultant’s report.</p>
      {assessment.regionName ? (
        <p>
          Consultants covering <strong>{assessment.regionName}</strong> have been told about it. The first to take it on
          will contact you.
        </p>
      ) : (
        <p>
          No consultant covers your postal code yet; we will route it by hand and let you know who takes it on.
        </p>
      )}
      <p className="text-graphite-soft">Your draft has been cleared from this browser.</p>
      <button type="button" className="btn btn-quiet" onClick={onStartAgain}>
        Start another estimate
      </button>
    </section>
  );
}
