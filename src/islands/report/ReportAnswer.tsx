/**
 * The owner's answer to the latest report version: go ahead (the consultant is asked to get in
 * touch) or decline, with an optional reason. Large targets; works on a phone.
 */
import { useState } from 'react';
import { answerReport } from '../../lib/report-client';

export interface ReportAnswerProps {
  reportId: string;
  consultantName: string;
}

export default function ReportAnswer({ reportId, consultantName }: ReportAnswerProps) {
  const [reason, setReason] = useState('');
  const [state, setState] = useState<{ kind: 'idle' } | { kind: 'busy' } | { kind: 'done'; accept: boolean } | { kind: 'failed'; message: string }>({ kind: 'idle' });

  async function answer(accept: boolean) {
    setState({ kind: 'busy' });
    const result = await answerReport(reportId, { accept, ...(reason.trim() ? { reason: reason.trim() } : {}) });
    if (result.ok) setState({ kind: 'done', accept });
    else setState({ kind: 'failed', message: result.issues[0]?.message ?? result.message });
  }

  if (state.kind === 'done') {
    return (
      <p role="status" className="notice notice-good mt-3" data-answer={state.accept ? 'accepted' : 'declined'}>
        {state.accept
          ? `Thank you. ${consultantName} has been told you want to go ahead and will get in touch.`
          : `Thank you. ${consultantName} has been told you are not going ahead.`}
      </p>
    );
  }
  return (
    <div className="action-form mt-3 space-y-3">
      <p>Tell {consultantName} whether to go ahead with the work in this report.</p>
      <label className="block">
        <span className="font-semibold">Anything to add (optional)</span>
        <textarea className="mt-1 block w-full" rows={3} maxLength={1000} value={reason} onChange={(e) => setReason(e.target.value)} />
      </label>
      <div className="flex flex-wrap gap-3">
        <button type="button" className="btn btn-primary min-h-12" disabled={state.kind === 'busy'} onClick={() => void answer(true)}>
          Go ahead: ask them to contact me
        </button>
        <button type="button" className="btn btn-quiet min-h-12" disabled={state.kind === 'busy'} onClick={() => void answer(false)}>
          Not now: decline
        </button>
      </div>
      {state.kind === 'failed' && (
        <p role="alert" className="notice notice-error">
          {state.message}
        </p>
      )}
    </div>
  );
}
