/** Step 5: who a consultant should contact, consent, and the field only bots fill in. */
import { useEffect } from 'react';
import { useFormContext } from 'react-hook-form';
import type { DraftValues } from './draft';
import { CheckField, TextField } from './fields';

export function ContactStep({ sending }: { sending: boolean }) {
  const { register, getValues, setValue } = useFormContext<DraftValues>();
  // The plant's name, given at the first step, is the likeliest answer here; the person may change it.
  useEffect(() => {
    const plantName = getValues('plant.plantName')?.trim();
    if (plantName && !getValues('contact.company')?.trim()) setValue('contact.company', plantName, { shouldDirty: true });
  }, [getValues, setValue]);
  return (
    <div className="step-body">
      <p className="step-lead">
        Your contact details go only to the consultant who takes on your assessment. Consultants in your
        region see the plant and its pipe runs first, without your name or how to reach you.
      </p>
      <fieldset className="group" disabled={sending}>
        <legend className="group-legend">How to reach you</legend>
        <div className="field-grid">
          <TextField name="contact.name" label="Your name" autoComplete="name" />
          <TextField name="contact.company" label="Company or plant" autoComplete="organization" />
          <TextField
            name="contact.email"
            label="E-mail"
            type="email"
            autoComplete="email"
            hint="We send a sign-in link here, so you can follow the assessment and read the consultant’s report."
          />
          <TextField name="contact.phone" label="Phone" type="tel" autoComplete="tel" optional />
        </div>
      </fieldset>

      <CheckField
        name="consent"
        label="A consultant who covers your region may contact me about this assessment."
        hint={
          <>
            Nothing else is sent to anyone; the <a href="/privacy">privacy page</a> says what we keep and for how long.
          </>
        }
      />

      {/* Kept off screen and out of the accessibility tree: people never see it; bots fill it in. */}
      <div className="honeypot" aria-hidden="true">
        <label htmlFor="f-website">Website</label>
        <input id="f-website" type="text" tabIndex={-1} autoComplete="off" {...register('website')} />
      </div>

      <div className="next-note">
        <h3 className="block-title">What happens next</h3>
        <ol className="next-steps">
          <li>We e-mail you a link to your assessment straight away.</li>
          <li>A consultant who covers your postal code takes it on and calls or e-mails you.</li>
          <li>They walk the site, measure the runs and send you a report with prices.</li>
        </ol>
      </div>
    </div>
  );
}
