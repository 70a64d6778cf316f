/** Step 1: what the plant is, where it is, how long its lines run and the air around them. */
import { lazy, Suspense } from 'react';
import { useFormContext, useWatch } from 'react-hook-form';
import { countryOptions, plantTypes } from '../../schemas/assessment-lists';
import { isCountryCode, postalFormats } from '../../lib/routing/postal-code';
import { currencyOfCountry, draftMarket, settleMarket, type DraftValues } from './draft';
import { NumberField, SelectField, SureChoice, TextField } from './fields';
import { conditionsConfidence, hoursConfidence } from './confidence';
import { wasTyped } from './store';

/** Whether a consultant covers the postal code: it speaks once a code is typed, so it loads after the form. */
const CoverageNotice = lazy(() => import('./CoverageNotice').then((module) => ({ default: module.CoverageNotice })));

export function PlantStep() {
  const { setValue, getValues } = useFormContext<DraftValues>();
  const country = useWatch<DraftValues, 'plant.countryCode'>({ name: 'plant.countryCode' });
  const example = country && isCountryCode(country) ? postalFormats[country].example : undefined;
  const [hours, conditions] = useWatch<DraftValues, ['estimate.operatingHoursPerYear', 'estimate.conditions']>({
    name: ['estimate.operatingHoursPerYear', 'estimate.conditions'],
  });
  return (
    <div className="step-body">
      <p className="step-lead">
        A few facts about the plant. Guesses are fine: the usual figures are filled in and count as
        guesses, and the range around each result widens to match.
      </p>

      <div className="field-grid">
        <TextField name="plant.plantName" label="Plant name" optional autoComplete="organization" />
        <SelectField
          name="plant.plantType"
          label="What the plant makes"
          emptyLabel="Choose the kind of plant"
          options={plantTypes.map((t) => ({ value: t.id, label: t.name }))}
        />
        <SelectField
          name="plant.countryCode"
          label="Country"
          emptyLabel="Choose the country"
          options={countryOptions.map((c) => ({ value: c.code, label: c.name }))}
          onChosen={(code) => {
            const currency = currencyOfCountry(code);
            if (currency) setValue('estimate.energy.currency', currency, { shouldDirty: true });
            // The country decides the catalogs: starting values follow it, chosen ones stay.
            const settled = settleMarket(getValues(), draftMarket(code, getValues('estimate.unitSystem') === 'US' ? 'US' : 'SI'));
            if (settled.priceUnit) setValue('estimate.energy.priceUnit', settled.priceUnit, { shouldDirty: true });
            for (const { index, pipe } of settled.runPipes) setValue(`estimate.runs.${index}.pipe`, pipe, { shouldDirty: true });
          }}
        />
        <TextField
          name="plant.postalCode"
          label="Postal code"
          autoComplete="postal-code"
          hint={example ? `Like ${example}. It decides which consultant can follow up.` : 'It decides which consultant can follow up.'}
          inputClassName="max-w-48"
        />
      </div>
      <Suspense fallback={null}>
        <CoverageNotice />
      </Suspense>

      <div className="field-with-guess">
        <NumberField
          name="estimate.operatingHoursPerYear"
          whole
          hint="Hours a year the lines are hot or cold. One shift five days a week is about 2,000 h; two shifts about 4,000 h; round the clock 8,760 h."
        />
        <SureChoice name="estimate.operatingHoursConfidence" about="the hours" auto={hoursConfidence(hours, wasTyped)} />
      </div>

      <fieldset className="group">
        <legend className="group-legend">Air inside the plant</legend>
        <p className="field-hint">Around the pipe runs while they are in use.</p>
        <div className="field-grid">
          <NumberField name="estimate.conditions.indoorAirTemperatureC" signed />
          <NumberField
            name="estimate.conditions.indoorRelativeHumidityPercent"
            hint="Sets the dew point that cold lines must stay above."
          />
          <NumberField
            name="estimate.conditions.draughtyAirSpeedMPerS"
            hint="Near doors and fans; used for runs you mark as drafty."
          />
        </div>
      </fieldset>

      <fieldset className="group">
        <legend className="group-legend">Outdoors</legend>
        <p className="field-hint">Only used for runs that go outside, such as a line across the yard to a second building.</p>
        <div className="field-grid">
          <NumberField
            name="estimate.conditions.outdoorAirTemperatureC"
            signed
          />
          <NumberField name="estimate.conditions.outdoorRelativeHumidityPercent" />
          <NumberField name="estimate.conditions.outdoorWindSpeedMPerS" />
        </div>
      </fieldset>

      <NumberField
        name="estimate.conditions.altitudeM"
        signed
        optional
        hint="Thinner air lowers the boiling point of steam a little."
        className="max-w-sm"
      />

      <SureChoice
        name="estimate.conditions.confidence"
        about="the air figures"
        auto={conditionsConfidence(conditions as Record<string, unknown> | undefined, wasTyped)}
      />
    </div>
  );
}
