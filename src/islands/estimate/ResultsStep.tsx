/**
 * Step 4: the results from the engine — totals with their ranges, what insulating saves,
 * hazards, run by run, the charts and the cautions.
 */
import { useState, type ReactNode } from 'react';
import { INSULATION_MATERIALS, SERVICE_DEFAULTS, SURFACES, type PlantResult, type RunEstimate } from '../../engine';
import {
  formatCo2,
  formatFigure,
  formatMoney,
  formatQuantity,
  formatRange,
  formatYears,
  type UnitSystem,
} from '../../lib/units-display';
import type { LiveEstimate } from './store';
import { liveStatus } from './SummaryStrip';
import { useUnitSystem } from './fields';
import { ChartPanel } from './charts/ChartPanel';
import { cashFlow, lifeCycleByThickness, lossByRun, temperatureProfile } from './charts/series';

interface Props {
  live: LiveEstimate;
  cautions?: ReactNode;
}

const serviceName = (id: string) => SERVICE_DEFAULTS.find((s) => s.id === id)?.name ?? id;
const materialName = (id: string) => INSULATION_MATERIALS.find((m) => m.id === id)?.name ?? id;
const surfaceName = (id: string) => SURFACES.find((s) => s.id === id)?.name ?? id;
const STATE_NAMES = { bare: 'Bare', damaged: 'Damaged', insulated: 'Insulated' } as const;
const OPTION_WORDS = {
  leave: 'Leave as it is',
  repair: 'Repair the bare parts',
  insulate: 'Insulate',
  'add-layer': 'Add a layer',
  replace: 'Replace the insulation',
} as const;

/** A hazard as a short flag (always with words, never colour alone) and a full sentence in the person's units. */
function hazardsOf(run: RunEstimate, system: UnitSystem): { code: string; flag: string; tone: 'heat' | 'cold' | 'plain'; sentence: string }[] {
  const t = (c: number) => formatQuantity(c, 'temperature', system, { significant: 3, maxDecimals: 0 });
  return run.hazards.map((hazard) => {
    switch (hazard.code) {
      case 'SURFACE_ABOVE_TOUCH_LIMIT':
        return {
          code: hazard.code,
          flag: 'Burns on touch',
          tone: 'heat',
          sentence: `On the hottest still day the surface reaches about ${t(run.current.designSurfaceTemperatureC)}, above the ${t(run.personnelProtection.touchLimitC)} touch limit: it can burn on contact.`,
        };
      case 'SURFACE_BELOW_DEW_POINT':
        return {
          code: hazard.code,
          flag: 'Sweats: below the dew point',
          tone: 'cold',
          sentence: `In the wettest hour the surface sits at about ${t(run.current.designSurfaceTemperatureC)}, below the air’s dew point of ${t(run.condensationControl.dewPointC)}: it will sweat or frost unless insulated with a sealed vapour retarder.`,
        };
      case 'BARE_FITTINGS_ABOVE_TOUCH_LIMIT':
        return { code: hazard.code, flag: 'Bare fittings burn', tone: 'heat', sentence: hazard.message };
      case 'BARE_FITTINGS_BELOW_DEW_POINT':
        return { code: hazard.code, flag: 'Bare fittings drip', tone: 'cold', sentence: hazard.message };
      case 'MATERIAL_ABOVE_SERVICE_LIMIT':
      case 'MATERIAL_BELOW_SERVICE_LIMIT':
        return { code: hazard.code, flag: 'Insulation outside its rating', tone: 'plain', sentence: hazard.message };
      default:
        return { code: hazard.code, flag: 'Note', tone: 'plain', sentence: hazard.message };
    }
  });
}

interface FigureProps {
  label: string;
  value: string;
  /** Said after the number in smaller type: "a year". */
  per?: string;
  range?: string;
  tone?: 'heat' | 'save' | 'cold';
  note?: ReactNode;
}

function Figure({ label, value, per, range, tone, note }: FigureProps) {
  return (
    <div className={`figure figure-${tone ?? 'plain'}`}>
      <dt className="figure-label">{label}</dt>
      <dd>
        <span className="figure-value">{value}</span>
        {per && <span className="figure-per"> {per}</span>}
        {range && <span className="figure-range">likely {range}</span>}
        {note && <span className="figure-note">{note}</span>}
      </dd>
    </div>
  );
}

export function ResultsStep({ live, cautions }: Props) {
  const system = useUnitSystem();
  const status = liveStatus(live);
  const result = live.result;
  if (!result) {
    return (
      <div className="step-body">
        <p className="summary-status">{status ?? 'Complete the pipe runs and the results appear here.'}</p>
      </div>
    );
  }
  return (
    <div className="step-body results" aria-busy={live.loading}>
      {status && <p className="summary-status">{status}</p>}
      <Totals result={result} system={system} />
      <Savings result={result} system={system} />
      <Hazards result={result} system={system} />
      <RunTable result={result} system={system} />
      <Charts result={result} system={system} />
      <Notes result={result} />
      {cautions && <div className="results-cautions">{cautions}</div>}
    </div>
  );
}

function Totals({ result, system }: { result: PlantResult; system: UnitSystem }) {
  const money = (v: number) => formatMoney(v, result.currency);
  const roughMoney = (v: number) => formatMoney(v, result.currency, { significant: 2 });
  const energy = (gj: number, significant = 3) => formatQuantity(gj, 'energyPerYear', system, { significant, maxDecimals: 0 });
  const { current } = result.totals;
  const range = result.range;
  const hasCold = result.runs.some((r) => r.cold);
  return (
    <section aria-labelledby="totals-heading" className="result-block">
      <h3 id="totals-heading" className="block-title">
        Lost every year as things are
      </h3>
      <dl className="figures">
        <Figure
          label="Money"
          tone="heat"
          value={money(range.currentAnnualCost.likely)}
          per="a year"
          range={formatRange(range.currentAnnualCost.low, range.currentAnnualCost.high, roughMoney)}
        />
        <Figure
          label={hasCold ? 'Heat lost, and gained by cold lines' : 'Heat lost'}
          tone="heat"
          value={energy(range.currentAnnualHeatGJ.likely)}
          per="a year"
          range={formatRange(range.currentAnnualHeatGJ.low, range.currentAnnualHeatGJ.high, (v) => energy(v, 2))}
          note={`${formatQuantity(current.heatW, 'power', system, { significant: 3, maxDecimals: 1 })} while running`}
        />
        {current.steamKgPerHour > 0 && (
          <Figure
            label="Steam condensed"
            tone="heat"
            value={formatQuantity(current.steamKgPerHour, 'steamRate', system, { significant: 3, maxDecimals: 0 })}
            note={`${formatQuantity(current.steamKgPerYear, 'steamMass', system, { significant: 3, maxDecimals: 0 })} a year`}
          />
        )}
        <Figure
          label="CO₂"
          value={formatCo2(range.currentAnnualCo2Kg.likely)}
          per="a year"
          range={formatRange(range.currentAnnualCo2Kg.low, range.currentAnnualCo2Kg.high, (v) => formatCo2(v, { significant: 2 }))}
          note={result.assumptions.emissionFactor.label}
        />
      </dl>
      <p className="block-note">
        Boiler fuel to make up the loss: {formatQuantity(current.annualFuelGJ, 'energyPerYear', system, { significant: 3, maxDecimals: 0 })} a
        year at {formatFigure(result.assumptions.boilerEfficiency * 100)} % boiler efficiency
        {current.annualChillerElectricityKWh > 0 &&
          `; chillers: ${formatFigure(current.annualChillerElectricityKWh)} kWh of electricity a year`}
        .
      </p>
    </section>
  );
}

function Savings({ result, system }: { result: PlantResult; system: UnitSystem }) {
  const money = (v: number) => formatMoney(v, result.currency);
  const roughMoney = (v: number) => formatMoney(v, result.currency, { significant: 2 });
  const range = result.range;
  const payback = range.simplePaybackYears;
  const illustrative = result.assumptions.priceTableIllustrative;
  return (
    <section aria-labelledby="savings-heading" className="result-block result-block-save">
      <h3 id="savings-heading" className="block-title">
        What insulating would save
      </h3>
      <dl className="figures">
        <Figure
          label="Saved"
          tone="save"
          value={money(range.annualCostSaving.likely)}
          per="a year"
          range={formatRange(range.annualCostSaving.low, range.annualCostSaving.high, roughMoney)}
        />
        <Figure
          label="Energy saved"
          tone="save"
          value={formatQuantity(range.annualHeatSavingGJ.likely, 'energyPerYear', system, { significant: 3, maxDecimals: 0 })}
          per="a year"
          note={`${formatCo2(range.annualCo2SavingKg.likely)} a year less`}
        />
        <Figure
          label={illustrative ? 'Installed cost (illustrative demo prices)' : 'Installed cost'}
          value={money(range.installedCost.likely)}
          range={formatRange(range.installedCost.low, range.installedCost.high, roughMoney)}
        />
        <Figure
          label="Simple payback"
          tone="save"
          value={formatYears(result.totals.simplePaybackYears)}
          {...(payback ? { range: formatRange(payback.low, payback.high, formatYears) } : {})}
        />
      </dl>
      <p className="block-note">
        Over {formatFigure(result.assumptions.horizonYears)} years, counting fuel rising {formatFigure(result.assumptions.fuelEscalationPercent)} % a
        year and money discounted at {formatFigure(result.assumptions.discountRatePercent)} %, insulating comes out{' '}
        <strong>{money(Math.abs(result.totals.lifeCycle.netSaving))}</strong>{' '}
        {result.totals.lifeCycle.netSaving >= 0 ? 'ahead' : 'behind'}.
        {illustrative && ' Installed costs are illustrative demo prices, not a quotation; a consultant prices the real work.'}
      </p>
    </section>
  );
}

function Hazards({ result, system }: { result: PlantResult; system: UnitSystem }) {
  const flagged = result.runs.map((run) => ({ run, hazards: hazardsOf(run, system) })).filter((r) => r.hazards.length > 0);
  return (
    <section aria-labelledby="hazards-heading" className="result-block">
      <h3 id="hazards-heading" className="block-title">
        Hazards today
      </h3>
      {flagged.length === 0 ? (
        <p>No run is above the touch limit or below the dew point on these answers.</p>
      ) : (
        <ul className="hazard-list">
          {flagged.map(({ run, hazards }) =>
            hazards.map((hazard) => (
              <li key={`${run.id}-${hazard.code}`} className={`hazard hazard-${hazard.tone}`}>
                <span className="hazard-flag">
                  <span aria-hidden="true" className="hazard-mark">
                    {hazard.tone === 'cold' ? '❄' : '▲'}
                  </span>
                  {hazard.flag}
                </span>
                <span>
                  <strong>{run.label}.</strong> {hazard.sentence}
                </span>
              </li>
            )),
          )}
        </ul>
      )}
    </section>
  );
}

function RunTable({ result, system }: { result: PlantResult; system: UnitSystem }) {
  const money = (v: number) => formatMoney(v, result.currency);
  const temp = (c: number) => formatQuantity(c, 'temperature', system, { significant: 3, maxDecimals: 0 });
  const thickness = (m: number) => formatQuantity(m, 'thickness', system, { significant: 3, maxDecimals: system === 'US' ? 2 : 0 });
  return (
    <section aria-labelledby="runs-table-heading" className="result-block">
      <h3 id="runs-table-heading" className="block-title">
        Run by run
      </h3>
      <div className="table-scroll" tabIndex={0} role="region" aria-label="Run by run, as a table that scrolls sideways">
        <table className="run-table">
          <thead>
            <tr>
              <th scope="col">Run</th>
              <th scope="col">Today</th>
              <th scope="col">Heat {result.runs.some((r) => r.cold) ? 'lost or gained' : 'lost'} now</th>
              <th scope="col">Surface now</th>
              <th scope="col">Hazards</th>
              <th scope="col">Proposed insulation</th>
              <th scope="col">Economic thickness</th>
              <th scope="col">Saves a year</th>
              <th scope="col">Installed cost</th>
              <th scope="col">Payback</th>
            </tr>
          </thead>
          <tbody>
            {result.runs.map((run) => {
              const hazards = hazardsOf(run, system);
              return (
                <tr key={run.id} className={run.cold ? 'row-cold' : 'row-hot'}>
                  <th scope="row">
                    <span className="block font-extrabold">{run.label}</span>
                    <span className="block text-graphite-soft">
                      {serviceName(run.service)}
                      {run.cold ? ' · cold line' : ''}, {formatQuantity(run.lengthM, 'length', system, { significant: 3, maxDecimals: 1 })}
                    </span>
                  </th>
                  <td>{STATE_NAMES[run.current.state]}</td>
                  <td>
                    <span className="block">
                      {run.cold ? 'gains ' : ''}
                      {formatQuantity(Math.abs(run.current.heatLossWPerM), 'heatPerLength', system, { significant: 3, maxDecimals: 0 })}
                    </span>
                    <span className="block text-graphite-soft">{money(run.current.annualCost)} a year</span>
                  </td>
                  <td>{temp(run.current.surfaceTemperatureC)}</td>
                  <td>
                    {hazards.length === 0 ? (
                      'None'
                    ) : (
                      <ul className="flag-list">
                        {hazards.map((h) => (
                          <li key={h.code} className={`flag flag-${h.tone}`}>
                            {h.flag}
                          </li>
                        ))}
                      </ul>
                    )}
                  </td>
                  <td>
                    {run.proposed.option === 'leave' ? (
                      <span className="block">{OPTION_WORDS.leave}</span>
                    ) : (
                      <>
                        <span className="block">
                          {OPTION_WORDS[run.proposed.option]}: {thickness(run.proposed.thicknessM)} {materialName(run.proposed.material).toLowerCase()}
                        </span>
                        <span className="block text-graphite-soft">
                          {surfaceName(run.proposed.jacket)}; surface {temp(run.proposed.surfaceTemperatureC)}
                        </span>
                      </>
                    )}
                    <span className="block text-graphite-soft">{run.choice.message}</span>
                  </td>
                  <td>{run.economicThickness ? thickness(run.economicThickness.thicknessM) : '—'}</td>
                  <td className="text-mineral font-extrabold">{money(run.savings.annualCost)}</td>
                  <td>{money(run.installedCost)}</td>
                  <td>{formatYears(run.simplePaybackYears)}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </section>
  );
}

function Charts({ result, system }: { result: PlantResult; system: UnitSystem }) {
  const [chosenId, setChosenId] = useState<string | undefined>(undefined);
  const run = result.runs.find((r) => r.id === chosenId) ?? result.runs[0];
  const touchLimitC = run?.personnelProtection.touchLimitC ?? 60;
  const years = result.totals.cashFlow;
  const breakEven = years.find((y) => y.cumulative >= 0);
  const chooser = (
    <div className="field chart-chooser">
      <label htmlFor="chart-run" className="field-label">
        Run to look at
      </label>
      <select id="chart-run" className="input select-input" value={run?.id ?? ''} onChange={(e) => setChosenId(e.target.value)}>
        {result.runs.map((r) => (
          <option key={r.id} value={r.id}>
            {r.label}
          </option>
        ))}
      </select>
    </div>
  );
  const biggest = result.runs.reduce<RunEstimate | undefined>((a, b) => (!a || b.current.annualHeatGJ > a.current.annualHeatGJ ? b : a), undefined);
  return (
    <section aria-labelledby="charts-heading" className="result-block">
      <h3 id="charts-heading" className="block-title">
        Charts
      </h3>
      <div className="chart-grid">
        <ChartPanel
          id="chart-loss"
          title="Heat by run"
          reading={biggest ? `${biggest.label} loses the most: ${formatQuantity(biggest.current.annualHeatGJ, 'energyPerYear', system, { significant: 3, maxDecimals: 0 })} a year now.` : ''}
          spec={lossByRun(result, system)}
        />
        <ChartPanel
          id="chart-cash"
          title="Cash flow of insulating"
          reading={
            breakEven
              ? `Paid back within year ${breakEven.year}; ${formatMoney(years[years.length - 1]?.cumulative ?? 0, result.currency)} ahead after ${result.assumptions.horizonYears} years before discounting.`
              : `Not paid back within ${result.assumptions.horizonYears} years on these answers.`
          }
          spec={cashFlow(result)}
        />
        {run && (
          <>
            {chooser}
            <ChartPanel
              id="chart-profile"
              title="Temperature from the inside out"
              reading={`${run.label}: the surface is ${formatQuantity(run.current.surfaceTemperatureC, 'temperature', system, { significant: 3, maxDecimals: 0 })} now and would be ${formatQuantity(run.proposed.surfaceTemperatureC, 'temperature', system, { significant: 3, maxDecimals: 0 })} with the proposed insulation.`}
              spec={temperatureProfile(run, system, touchLimitC)}
            />
            <ChartPanel
              id="chart-thickness"
              title="Cost against thickness"
              reading={
                run.economicThickness
                  ? `${run.label}: ${formatQuantity(run.economicThickness.thicknessM, 'thickness', system, { significant: 3, maxDecimals: system === 'US' ? 2 : 0 })} costs least over ${result.assumptions.horizonYears} years (${formatMoney(run.economicThickness.lifeCycleCost, result.currency)}).`
                  : `${run.label}: no stock thickness to compare.`
              }
              spec={lifeCycleByThickness(run, system, result.currency, result.assumptions.horizonYears)}
            />
          </>
        )}
      </div>
    </section>
  );
}

function Notes({ result }: { result: PlantResult }) {
  if (result.warnings.length === 0) return null;
  return (
    <section aria-labelledby="notes-heading" className="result-block">
      <h3 id="notes-heading" className="block-title">
        Notes on these figures
      </h3>
      <ul className="note-list">
        {result.warnings.map((warning) => (
          <li key={warning.code}>{warning.message}</li>
        ))}
      </ul>
    </section>
  );
}
