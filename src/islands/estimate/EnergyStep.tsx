/** Step 2: what the boiler burns, what it costs in the person's own unit, and how efficiently. */
import { useFormContext, useWatch } from 'react-hook-form';
import { FUELS, type FuelId } from '../../engine';
import { formatNumber } from '../../lib/presentation/rounding';
import { PRICE_UNIT_NAMES } from './price-units';
import { CURRENCIES, defaultPriceUnit, draftMarket, fuelById, type DraftValues } from './draft';
import { NumberField, SelectField, SureChoice, useUnitSystem } from './fields';
import { efficiencyConfidence } from './confidence';


/** Short names of the emission-factor sources for the drop-down; the full citation shows with the results. */
const SOURCE_NAMES: Record<string, string> = {
  'us-epa-2024': 'US EPA (2024)',
  'uk-desnz-2023': 'UK government, DESNZ (2023)',
  'ipcc-2006': 'IPCC guidelines (2006)',
};

export function EnergyStep() {
  const { setValue, getValues } = useFormContext<DraftValues>();
  const system = useUnitSystem();
  const fuelId = useWatch<DraftValues, 'estimate.energy.fuel'>({ name: 'estimate.energy.fuel' });
  const efficiency = useWatch<DraftValues, 'estimate.energy.boilerEfficiency'>({ name: 'estimate.energy.boilerEfficiency' });
  const fuel = fuelById(fuelId) ?? FUELS[0];
  const efficiencyPercent = formatNumber(fuel.defaultBoilerEfficiency * 100);

  return (
    <div className="step-body">
      <p className="step-lead">
        Heat lost from the pipes is made up by the boiler, so it costs what the boiler burns. A recent
        bill has everything this step asks for.
      </p>

      <div className="field-grid">
        <SelectField
          name="estimate.energy.fuel"
          label="What the boiler burns"
          options={FUELS.map((f) => ({ value: f.id, label: f.name }))}
          onChosen={(id) => {
            const chosen = fuelById(id);
            if (!chosen) return;
            const unit = getValues('estimate.energy.priceUnit');
            if (!unit || !(chosen.priceUnits as readonly string[]).includes(unit)) {
              setValue('estimate.energy.priceUnit', defaultPriceUnit(chosen.id as FuelId, draftMarket(getValues('plant.countryCode'), system)), { shouldDirty: true });
            }
            const source = getValues('estimate.energy.emissionFactorSource');
            if (source && !chosen.emissionFactors.some((f) => f.source === source)) {
              setValue('estimate.energy.emissionFactorSource', undefined, { shouldDirty: true });
            }
          }}
        />
        <SelectField
          name="estimate.energy.currency"
          label="Currency"
          options={CURRENCIES.map((c) => ({ value: c.code, label: `${c.name} (${c.code})` }))}
        />
      </div>

      <fieldset className="group">
        <legend className="group-legend">Price you pay</legend>
        <div className="field-grid">
          <div className="field-with-guess">
            <NumberField
              name="estimate.energy.price"
              hint="The bill’s total divided by the quantity, with delivery charges and taxes."
            />
            <SureChoice name="estimate.energy.priceConfidence" about="the price" auto="estimated" />
          </div>
          <SelectField
            name="estimate.energy.priceUnit"
            label="Priced per"
            options={fuel.priceUnits.map((u) => ({ value: u, label: PRICE_UNIT_NAMES[u] }))}
          />
        </div>
      </fieldset>

      <div className="field-with-guess max-w-xl">
        <NumberField
          name="estimate.energy.boilerEfficiency"
          optional
          placeholder={efficiencyPercent}
          hint={`Fuel turned into useful heat over a season. Leave it empty and Lagwise uses ${efficiencyPercent} %, usual for ${fuel.name.toLowerCase()}.`}
        />
        <SureChoice name="estimate.energy.boilerEfficiencyConfidence" about="the efficiency" auto={efficiencyConfidence(efficiency)} />
      </div>

      {fuel.id !== 'electricity' && (
        <NumberField
          name="estimate.energy.electricityPricePerKWh"
          optional
          hint="Only for chilled-water and glycol lines: heat they gain from the room is pumped out again by the chillers. Leave it empty and that heat is shown but not priced."
          className="max-w-xl"
        />
      )}

      <SelectField
        name="estimate.energy.emissionFactorSource"
        label="CO₂ factors from"
        optional
        emptyLabel={`Lagwise’s default: ${SOURCE_NAMES[fuel.emissionFactors[0]?.source ?? ''] ?? fuel.emissionFactors[0]?.label ?? 'US EPA'}`}
        options={fuel.emissionFactors.map((f) => ({ value: f.source, label: SOURCE_NAMES[f.source] ?? f.label }))}
        className="max-w-xl"
      />

      <fieldset className="group">
        <legend className="group-legend">Money over time</legend>
        <p className="field-hint">For the life-cycle cost and the cash flow of insulating. The defaults suit most plants.</p>
        <div className="field-grid">
          <NumberField name="estimate.economics.horizonYears" whole />
          <NumberField name="estimate.economics.discountRatePercent" />
          <NumberField
            name="estimate.economics.fuelEscalationPercent"
            signed
          />
        </div>
      </fieldset>
    </div>
  );
}
