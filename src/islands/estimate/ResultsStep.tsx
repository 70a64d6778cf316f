/**
 * Step 4: the results from the engine — totals with their ranges, what insulating saves,
 * hazards, run by run, the charts and the cautions — as the shared presentation words and
 * rounds them (the same strings as the owner's page and the e-mails).
 */
import { useMemo, useState, type ReactNode } from 'react';
import { useWatch } from 'react-hook-form';
import type { DraftValues } from './draft';
import type { PlantResult, RunEstimate } from '../../engine';
import { presentOptions, presentResult, type DisplayFormat, type PresentedFigure, type PresentedResult, type PresentedRun } from '../../lib/presentation';
import type { LiveEstimate } from './store';
import { liveStatus } from './SummaryStrip';
import { useUnitSystem } from './fields';
import { ChartPanel } from './charts/ChartPanel';
import { cashFlow, lossByRun, temperatureProfile } from './charts/series';

interface Props {
  live: LiveEstimate;
  cautions?: ReactNode;
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

/** A presented figure as Figure's props; `label` may be shortened to fit the block's heading. */
function shown(figure: PresentedFigure, label = figure.label): FigureProps {
  return {
    label,
    value: figure.text,
    ...(figure.per ? { per: figure.per } : {}),
    ...(figure.range ? { range: figure.range.text } : {}),
    ...(figure.note ? { note: figure.note } : {}),
  };
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
  const presented = useMemo(() => (result ? presentResult(result, { system }) : null), [result, system]);
  if (!result || !presented) {
    return (
      <div className="step-body">
        <p className="summary-status">{status ?? 'Complete the pipe runs and the results appear here.'}</p>
      </div>
    );
  }
  return (
    <div className="step-body results" aria-busy={live.loading}>
      {status && <p className="summary-status">{status}</p>}
      <Totals presented={presented} />
      <Savings presented={presented} />
      <Hazards presented={presented} />
      <RunTable presented={presented} />
      <RunCards presented={presented} result={result} />
      <Charts result={result} presented={presented} />
      <Notes presented={presented} />
      {cautions && <div className="results-cautions">{cautions}</div>}
    </div>
  );
}

function Totals({ presented }: { presented: PresentedResult }) {
  const { lossCost, lossEnergy, steam, co2, boilerFuel, chillerElectricity } = presented.headline;
  return (
    <section aria-labelledby="totals-heading" className="result-block">
      <h3 id="totals-heading" className="block-title">
        Lost every year as things are
      </h3>
      <dl className="figures">
        <Figure {...shown(lossCost, 'Money')} tone="heat" />
        <Figure {...shown(lossEnergy)} tone="heat" />
        {steam && <Figure {...shown(steam)} tone="heat" />}
        <Figure {...shown(co2, 'CO₂')} />
      </dl>
      <p className="block-note">
        {boilerFuel.label}: {boilerFuel.text} {boilerFuel.per} {boilerFuel.note}
        {chillerElectricity && `; ${chillerElectricity.label.toLowerCase()}: ${chillerElectricity.text} ${chillerElectricity.per}`}.
      </p>
    </section>
  );
}

function Savings({ presented }: { presented: PresentedResult }) {
  const { saving, energySaving, co2Saving, installedCost, payback } = presented.headline;
  return (
    <section aria-labelledby="savings-heading" className="result-block result-block-save">
      <h3 id="savings-heading" className="block-title">
        What insulating would save
      </h3>
      <dl className="figures">
        <Figure {...shown(saving, 'Saved')} tone="save" />
        <Figure {...shown(energySaving)} tone="save" note={`${co2Saving.text} ${co2Saving.per} less`} />
        <Figure {...shown(installedCost)} />
        <Figure {...shown(payback)} tone="save" />
      </dl>
      <p className="block-note">
        {presented.basis.lifeCycle}
        {presented.basis.pricesIllustrative && ` ${presented.basis.prices}`}
      </p>
    </section>
  );
}

function Hazards({ presented }: { presented: PresentedResult }) {
  return (
    <section aria-labelledby="hazards-heading" className="result-block">
      <h3 id="hazards-heading" className="block-title">
        Hazards today
      </h3>
      {presented.hazards.length === 0 ? (
        <p>No run is above the touch limit or below the dew point on these answers.</p>
      ) : (
        <ul className="hazard-list">
          {presented.hazards.map((hazard) => (
            <li key={`${hazard.runId}-${hazard.code}`} className={`hazard hazard-${hazard.tone}`}>
              <span className="hazard-flag">
                <span aria-hidden="true" className="hazard-mark">
                  {hazard.tone === 'cold' ? '❄' : '▲'}
                </span>
                {hazard.flag}
              </span>
              <span>
                <strong>{hazard.runLabel}.</strong> {hazard.sentence}
              </span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

/** Each run's flags, as a short list. */
function Flags({ run }: { run: PresentedRun }) {
  if (run.hazards.length === 0) return <>None</>;
  return (
    <ul className="flag-list">
      {run.hazards.map((h) => (
        <li key={h.code} className={`flag flag-${h.tone}`}>
          {h.flag}
        </li>
      ))}
    </ul>
  );
}

/** Where a run is, as the reader named it: one of their areas, or the plant's own indoor or outdoor air. */
function placeWords(areaId: string | undefined, areas: readonly { id: string; label?: string }[] | undefined): string {
  const area = areas?.find((a) => a.id === areaId);
  if (area) return area.label?.trim() || area.id;
  return areaId === 'outdoor' ? 'outdoors' : 'indoors';
}

/**
 * On a phone each run is a card with the figures that matter, in reading order; the wide
 * table below stands in for it from a laptop's width up (one of the two is shown).
 */
function RunCards({ presented, result }: { presented: PresentedResult; result: PlantResult }) {
  const areas = useWatch<DraftValues, 'estimate.areas'>({ name: 'estimate.areas' });
  const areaOf = new Map(result.runs.map((run) => [run.id, run.areaId]));
  return (
    <section aria-labelledby="run-cards-heading" className="result-block run-cards-block">
      <h3 id="run-cards-heading" className="block-title">
        Run by run
      </h3>
      <ol className="run-cards">
        {presented.runs.map((run) => (
          <li key={run.id} className={`run-result ${run.cold ? 'run-result-cold' : 'run-result-hot'}`} data-run={run.id}>
            <p className="run-result-name">{run.label}</p>
            <p className="run-result-what">
              {run.service}
              {run.cold ? ' · cold line' : ''} · {run.length} · {run.state.toLowerCase()} ·{' '}
              <span className="run-result-place">{placeWords(areaOf.get(run.id), areas)}</span>
            </p>
            <dl className="run-result-figures">
              <div>
                <dt>{run.today.heatLabel} now</dt>
                <dd>
                  {run.today.heatPerLength}
                  <span className="run-result-sub">{run.today.cost} a year</span>
                </dd>
              </div>
              <div>
                <dt>Surface now</dt>
                <dd>{run.today.surface}</dd>
              </div>
              <div className="run-result-wide">
                <dt>What to do</dt>
                <dd>
                  {run.proposed.summary}
                  <span className="run-result-sub">{run.choice.reason}</span>
                </dd>
              </div>
              <div>
                <dt>Saves a year</dt>
                <dd className="run-result-save">{run.saving}</dd>
              </div>
              <div>
                <dt>Payback</dt>
                <dd>{run.payback}</dd>
              </div>
              <div>
                <dt>Installed cost</dt>
                <dd>{run.installedCost}</dd>
              </div>
              <div>
                <dt>Hazards</dt>
                <dd>
                  <Flags run={run} />
                </dd>
              </div>
            </dl>
          </li>
        ))}
      </ol>
    </section>
  );
}

function RunTable({ presented }: { presented: PresentedResult }) {
  return (
    <section aria-labelledby="runs-table-heading" className="result-block run-table-block">
      <h3 id="runs-table-heading" className="block-title">
        Run by run
      </h3>
      <div className="table-scroll" tabIndex={0} role="region" aria-label="Run by run, as a table that scrolls sideways">
        <table className="run-table">
          <thead>
            <tr>
              <th scope="col">Run</th>
              <th scope="col">Today</th>
              <th scope="col">Heat {presented.hasColdLines ? 'lost or gained' : 'lost'} now</th>
              <th scope="col">Surface now</th>
              <th scope="col">Hazards</th>
              <th scope="col">What to do</th>
              <th scope="col">Thickness that costs least</th>
              <th scope="col">Saves a year</th>
              <th scope="col">Installed cost</th>
              <th scope="col">Payback</th>
            </tr>
          </thead>
          <tbody>
            {presented.runs.map((run) => (
              <tr key={run.id} className={run.cold ? 'row-cold' : 'row-hot'}>
                <th scope="row">
                  <span className="block font-extrabold">{run.label}</span>
                  <span className="block text-graphite-soft">
                    {run.service}
                    {run.cold ? ' · cold line' : ''}, {run.length}
                  </span>
                </th>
                <td>{run.state}</td>
                <td>
                  <span className="block">
                    {run.cold ? 'gains ' : ''}
                    {run.today.heatPerLength}
                  </span>
                  <span className="block text-graphite-soft">{run.today.cost} a year</span>
                </td>
                <td>{run.today.surface}</td>
                <td>
                  <Flags run={run} />
                </td>
                <td>
                  <span className="block">{run.proposed.summary}</span>
                  {run.proposed.work && <span className="block text-graphite-soft">surface {run.proposed.surface}</span>}
                  <span className="block text-graphite-soft">{run.choice.reason}</span>
                </td>
                <td>{run.economicThickness ?? '—'}</td>
                <td className="text-mineral font-extrabold">{run.saving}</td>
                <td>{run.installedCost}</td>
                <td>{run.payback}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}

function Charts({ result, presented }: { result: PlantResult; presented: PresentedResult }) {
  const [chosenId, setChosenId] = useState<string | undefined>(undefined);
  const f = presented.format;
  const index = Math.max(0, result.runs.findIndex((r) => r.id === chosenId));
  const run = result.runs[index];
  const shownRun = presented.runs[index];
  const touchLimitC = run?.personnelProtection.touchLimitC ?? 60;
  const years = result.totals.cashFlow;
  const breakEven = years.find((y) => y.cumulative >= 0);
  const horizon = result.assumptions.horizonYears;
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
  const biggest = presented.runs.reduce<{ label: string; heat: number; text: string } | undefined>((a, shownOne, i) => {
    const heat = result.runs[i]?.current.annualHeatGJ ?? 0;
    return !a || heat > a.heat ? { label: shownOne.label, heat, text: shownOne.today.heatPerYear } : a;
  }, undefined);
  return (
    <section aria-labelledby="charts-heading" className="result-block">
      <h3 id="charts-heading" className="block-title">
        Charts
      </h3>
      <div className="chart-grid">
        <ChartPanel
          id="chart-loss"
          title="Heat by run"
          reading={biggest ? `${biggest.label} loses the most: ${biggest.text} a year now.` : ''}
          spec={lossByRun(result, f)}
        />
        <ChartPanel
          id="chart-cash"
          title="Cash flow of insulating"
          reading={
            breakEven
              ? `Paid back within year ${breakEven.year}; ${f.money(years[years.length - 1]?.cumulative ?? 0)} ahead after ${horizon} years before discounting.`
              : `Not paid back within ${horizon} years on these answers.`
          }
          spec={cashFlow(result, f)}
        />
        {run && shownRun && (
          <>
            {chooser}
            <ChartPanel
              id="chart-profile"
              title="Temperature from the inside out"
              reading={`${shownRun.label}: the surface is ${shownRun.today.surface} now and would be ${shownRun.proposed.surface} with the proposed insulation.`}
              spec={temperatureProfile(run, f, touchLimitC)}
            />
            <RunChoices run={run} label={shownRun.label} reason={shownRun.choice.reason} format={f} horizon={horizon} />
          </>
        )}
      </div>
    </section>
  );
}

/** The run's choices side by side, money and safety for each; the chosen one marked. */
function RunChoices({ run, label, reason, format, horizon }: { run: RunEstimate; label: string; reason: string; format: DisplayFormat; horizon: number }) {
  const options = presentOptions(run, format);
  return (
    <section className="run-choices" aria-labelledby="run-choices-heading">
      <h3 id="run-choices-heading" className="chart-title">
        The choices for {label}
      </h3>
      <p className="chart-reading">{reason}</p>
      <ul className="choice-cards">
        {options.map((option) => (
          <li key={option.kind} className={`choice-card ${option.chosen ? 'choice-card-chosen' : ''}`} data-option={option.kind}>
            <p className="choice-card-name">
              {option.label}
              {option.chosen && <span className="choice-card-badge">Recommended</span>}
            </p>
            <dl className="choice-card-figures">
              <div>
                <dt>To do it</dt>
                <dd>{option.installedCost}</dd>
              </div>
              <div>
                <dt>Still costs a year</dt>
                <dd>{option.yearlyCost}</dd>
              </div>
              <div>
                <dt>Over {horizon} years, all in</dt>
                <dd>{option.lifeCycleCost}</dd>
              </div>
              <div>
                <dt>Pays back in</dt>
                <dd>{option.payback}</dd>
              </div>
              <div>
                <dt>Safety</dt>
                <dd className={option.safe ? 'choice-safe' : 'choice-unsafe'}>{option.safety}</dd>
              </div>
            </dl>
          </li>
        ))}
      </ul>
    </section>
  );
}

function Notes({ presented }: { presented: PresentedResult }) {
  if (presented.notes.length === 0) return null;
  return (
    <section aria-labelledby="notes-heading" className="result-block">
      <h3 id="notes-heading" className="block-title">
        Notes on these figures
      </h3>
      <ul className="note-list">
        {presented.notes.map((note) => (
          <li key={note}>{note}</li>
        ))}
      </ul>
    </section>
  );
}
