/**
 * The consultant's price grid: a price per meter for each pipe size (rows) and insulation
 * thickness (columns), and one removable fitting cover per pipe size, in one currency. Starts
 * from the demo grid until the consultant saves their own; saved whole with PUT.
 */
import { useState } from 'react';
import { savePrices } from '../../lib/report-client';
import type { PriceTableResponse } from '../../schemas/reports';

type Grid = PriceTableResponse['demo']['priceTable'];

function inches(meters: number): string {
  return `${Number((meters / 0.0254).toFixed(2))} in`;
}

export default function PriceTableEditor({ initial }: { initial: PriceTableResponse }) {
  const [currency, setCurrency] = useState(initial.prices?.currency ?? 'USD');
  const [grid, setGrid] = useState<Grid>(initial.prices?.priceTable ?? { ...initial.demo.priceTable, label: 'My installed prices' });
  const [state, setState] = useState<{ kind: 'idle' } | { kind: 'busy' } | { kind: 'saved' } | { kind: 'failed'; message: string; path: string | null }>({ kind: 'idle' });

  const setCell = (row: number, column: number, text: string) =>
    setGrid((g) => ({ ...g, costPerMetre: g.costPerMetre.map((cells, r) => (r === row ? cells.map((v, c) => (c === column ? Number(text) : v)) : cells)) }));
  const setCover = (row: number, text: string) => setGrid((g) => ({ ...g, fittingCoverCostEach: g.fittingCoverCostEach.map((v, r) => (r === row ? Number(text) : v)) }));

  async function save() {
    setState({ kind: 'busy' });
    const answer = await savePrices({ currency, priceTable: grid });
    if (answer.ok) setState({ kind: 'saved' });
    else setState({ kind: 'failed', message: answer.issues[0] ? `${answer.issues[0].path}: ${answer.issues[0].message}` : answer.message, path: answer.issues[0]?.path ?? null });
  }

  return (
    <div className="action-form space-y-4">
      {!initial.prices && <p className="notice">{initial.demo.note}</p>}
      <div className="grid gap-3 sm:grid-cols-[1fr_10rem]">
        <label>
          <span>Name of this price list (shown in reports)</span>
          <input type="text" value={grid.label} maxLength={120} onChange={(e) => setGrid((g) => ({ ...g, label: e.target.value }))} />
        </label>
        <label>
          <span>Currency</span>
          <input type="text" value={currency} maxLength={3} onChange={(e) => setCurrency(e.target.value.toUpperCase())} />
        </label>
      </div>
      <div className="overflow-x-auto rounded-plate border border-line bg-surface" tabIndex={0} role="region" aria-label="Price grid, scrolls sideways">
        <table className="price-grid w-full text-sm">
          <caption className="p-2 text-left text-graphite-soft">Price per meter of pipe, installed, by pipe outside diameter and insulation thickness</caption>
          <thead className="bg-sunken">
            <tr>
              <th scope="col" className="px-2 py-1 text-left">
                Pipe OD
              </th>
              {grid.thicknessesM.map((t) => (
                <th key={t} scope="col" className="px-2 py-1 text-right">
                  {Math.round(t * 1000)} mm
                  <span className="block font-normal text-graphite-soft">{inches(t)}</span>
                </th>
              ))}
              <th scope="col" className="px-2 py-1 text-right">
                Fitting cover, each
              </th>
            </tr>
          </thead>
          <tbody>
            {grid.pipeOuterDiametersM.map((od, row) => (
              <tr key={od} className="border-t border-line">
                <th scope="row" className="px-2 py-1 text-left">
                  {Number((od * 1000).toFixed(1))} mm <span className="font-normal text-graphite-soft">({inches(od)})</span>
                </th>
                {grid.thicknessesM.map((t, column) => (
                  <td key={t} className="px-1 py-1">
                    <input
                      type="number"
                      min={0}
                      step="any"
                      aria-label={`Price per meter, ${Number((od * 1000).toFixed(1))} mm pipe, ${Math.round(t * 1000)} mm thick`}
                      className="w-20 text-right"
                      value={Number.isFinite(grid.costPerMetre[row]?.[column]) ? grid.costPerMetre[row]?.[column] : ''}
                      onChange={(e) => setCell(row, column, e.target.value)}
                    />
                  </td>
                ))}
                <td className="px-1 py-1">
                  <input
                    type="number"
                    min={0}
                    step="any"
                    aria-label={`Fitting cover, ${Number((od * 1000).toFixed(1))} mm pipe`}
                    className="w-20 text-right"
                    value={Number.isFinite(grid.fittingCoverCostEach[row]) ? grid.fittingCoverCostEach[row] : ''}
                    onChange={(e) => setCover(row, e.target.value)}
                  />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <button type="button" className="btn btn-primary" onClick={() => void save()} disabled={state.kind === 'busy'}>
          Save my prices
        </button>
        {state.kind === 'saved' && (
          <p role="status" className="notice notice-good">
            Saved. New drafts and every draft’s next change use these prices.
          </p>
        )}
        {state.kind === 'failed' && (
          <p role="alert" className="notice notice-error">
            Not saved: {state.message}
          </p>
        )}
      </div>
    </div>
  );
}
