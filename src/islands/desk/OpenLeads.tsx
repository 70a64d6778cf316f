/**
 * The open leads of my regions: a TanStack table in manual mode — the server pages, sorts and
 * filters (GET /api/leads) and this island only asks for the next page. Rendered on the server
 * with the first page, its sort headers and page links are plain links and its filters a plain
 * GET form, so it works before (or without) JavaScript; with it, they load in place.
 */
import { getCoreRowModel, useReactTable, flexRender, type ColumnDef, type SortingState } from '@tanstack/react-table';
import { useMemo, useRef, useState, type FormEvent, type MouseEvent } from 'react';
import { claimLead, fetchLeads } from '../../lib/desk-client';
import type { LeadListResponse, OpenLead } from '../../schemas/leads';
import { formatMoney, formatMoneyRange } from '../../lib/presentation/money';
import { ageText, queryString, spreadPercent, type DeskQuery } from './query';

export interface Choice {
  id: string;
  name: string;
}

export interface OpenLeadsProps {
  /** The page the server rendered. */
  initial: LeadListResponse;
  /** The query that page answers, as the URL had it. */
  query: DeskQuery;
  regions: Choice[];
  plantTypes: Choice[];
  services: Choice[];
  /** The moment the server rendered, so "posted 3 days ago" reads the same on both sides. */
  now: string;
}

const sortable = new Set(['posted', 'loss', 'saving', 'spread', 'runs', 'photos']);

function SortLink({ id, label, query, onSort }: { id: string; label: string; query: DeskQuery; onSort: (q: DeskQuery) => void }) {
  const active = query.sort === id;
  const nextDir = active ? (query.dir === 'desc' ? 'asc' : 'desc') : id === 'spread' ? 'asc' : 'desc';
  const next: DeskQuery = { ...query, sort: id, dir: nextDir, page: '1' };
  return (
    <a
      href={`?${queryString(next)}`}
      className="lead-sort"
      aria-label={`${label}: sort ${nextDir === 'desc' ? 'highest or newest first' : 'lowest or oldest first'}`}
      onClick={(event: MouseEvent) => {
        event.preventDefault();
        onSort(next);
      }}
    >
      {label}
      <span aria-hidden="true" className="lead-sort-mark">
        {active ? (query.dir === 'desc' ? '▼' : '▲') : '↕'}
      </span>
    </a>
  );
}

export default function OpenLeads({ initial, query: initialQuery, regions, plantTypes, services, now }: OpenLeadsProps) {
  const [data, setData] = useState<LeadListResponse>(initial);
  const [query, setQuery] = useState<DeskQuery>(initialQuery);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ tone: 'error' | 'info'; text: string } | null>(null);
  const [claiming, setClaiming] = useState<string | null>(null);
  const formRef = useRef<HTMLFormElement>(null);
  const renderedAt = useMemo(() => new Date(now), [now]);

  async function load(next: DeskQuery) {
    setBusy(true);
    setMessage(null);
    const search = queryString(next);
    const answer = await fetchLeads(`view=open&${search}`);
    setBusy(false);
    if (!answer.ok) {
      const field = answer.issues[0];
      setMessage({ tone: 'error', text: field ? `${field.message}` : answer.message });
      return;
    }
    setData(answer.data);
    setQuery(next);
    window.history.replaceState(null, '', search ? `?${search}` : window.location.pathname);
  }

  async function claim(lead: OpenLead) {
    setClaiming(lead.id);
    setMessage(null);
    const answer = await claimLead(lead.id);
    if (answer.ok) {
      window.location.assign(`/desk/leads/${lead.id}?claimed=1`);
      return;
    }
    setClaiming(null);
    setMessage({ tone: 'error', text: `${lead.reference}: ${answer.message}` });
    if (answer.status === 409 || answer.status === 404) await load(query);
  }

  const columns = useMemo<ColumnDef<OpenLead>[]>(
    () => [
      {
        id: 'lead',
        header: 'Lead',
        cell: ({ row: { original: lead } }) => (
          <div>
            <a href={`/desk/leads/${lead.id}`} className="font-extrabold">
              {lead.plantType.name}
            </a>
            <p className="text-sm text-graphite-soft">
              {lead.reference} · {lead.region?.name ?? 'no region'} · area {lead.area}
            </p>
          </div>
        ),
      },
      {
        id: 'services',
        header: 'Lines',
        cell: ({ row: { original: lead } }) => (
          <ul className="flex flex-wrap gap-1">
            {lead.services.map((s) => (
              <li key={s.id} className="service-chip">
                {s.name}
              </li>
            ))}
          </ul>
        ),
      },
      { id: 'runs', header: 'Runs', cell: ({ row: { original: lead } }) => <span className="figure-num">{lead.runCount}</span> },
      {
        id: 'photos',
        header: 'Photos',
        cell: ({ row: { original: lead } }) => <span className="figure-num">{lead.photoCount === 0 ? 'none' : lead.photoCount}</span>,
      },
      {
        id: 'loss',
        header: 'Lost a year',
        cell: ({ row: { original: lead } }) => (
          <div>
            <span className="figure-num font-extrabold text-ember">{formatMoney(lead.annualLoss.likely, lead.currency)}</span>
            <p className="figure-num text-sm text-graphite-soft">{formatMoneyRange(lead.annualLoss.low, lead.annualLoss.high, lead.currency).text}</p>
          </div>
        ),
      },
      {
        id: 'spread',
        header: 'Range',
        cell: ({ row: { original: lead } }) => <span className="figure-num">±{spreadPercent(lead)} %</span>,
      },
      {
        id: 'saving',
        header: 'Saving a year',
        cell: ({ row: { original: lead } }) => (
          <span className="figure-num font-extrabold text-mineral">{formatMoney(lead.annualSaving, lead.currency)}</span>
        ),
      },
      {
        id: 'posted',
        header: 'Posted',
        cell: ({ row: { original: lead } }) => (
          <time dateTime={lead.postedAt} title={new Date(lead.postedAt).toUTCString()}>
            {ageText(new Date(lead.postedAt), renderedAt)}
          </time>
        ),
      },
      {
        id: 'act',
        header: () => <span className="sr-only">Take it on</span>,
        cell: ({ row: { original: lead } }) => (
          <button
            type="button"
            className="btn btn-primary lead-claim"
            disabled={claiming !== null}
            onClick={() => void claim(lead)}
            aria-label={`Claim ${lead.reference}, ${lead.plantType.name}`}
          >
            {claiming === lead.id ? 'Claiming…' : 'Claim'}
          </button>
        ),
      },
    ],
    // Re-made when a claim starts or ends, so every row's button sees the same `claiming`.
    [claiming, renderedAt],
  );

  const sorting: SortingState = [{ id: query.sort ?? 'posted', desc: (query.dir ?? 'desc') === 'desc' }];
  const table = useReactTable({
    data: data.items as OpenLead[],
    columns,
    getCoreRowModel: getCoreRowModel(),
    manualPagination: true,
    manualSorting: true,
    manualFiltering: true,
    pageCount: data.pageCount,
    rowCount: data.total,
    state: { sorting, pagination: { pageIndex: data.page - 1, pageSize: data.pageSize } },
    getRowId: (lead) => lead.id,
  });

  function submitFilters(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const next: DeskQuery = { sort: query.sort, dir: query.dir, pageSize: query.pageSize, page: '1' };
    for (const [key, value] of form.entries()) {
      if (typeof value !== 'string' || value === '') continue;
      if (key === 'service') next.service = [...(next.service ?? []), value];
      else (next as Record<string, string>)[key] = value;
    }
    void load(next);
  }

  const first = (data.page - 1) * data.pageSize + 1;
  const last = first + data.items.length - 1;
  const pageLink = (page: number) => `?${queryString({ ...query, page: String(page) })}`;

  return (
    <div className="space-y-6">
      <details className="filter-panel" open={Boolean(query.plantType || query.service?.length || query.lossMin || query.region)}>
        <summary className="btn btn-quiet">Narrow the list</summary>
        <form ref={formRef} method="get" action="/desk" onSubmit={submitFilters} className="filter-grid">
          <input type="hidden" name="sort" value={query.sort ?? ''} />
          <input type="hidden" name="dir" value={query.dir ?? ''} />
          <label>
            <span>Region</span>
            <select name="region" defaultValue={query.region ?? ''}>
              <option value="">All my regions</option>
              {regions.map((r) => (
                <option key={r.id} value={r.id}>
                  {r.name}
                </option>
              ))}
            </select>
          </label>
          <label>
            <span>Kind of plant</span>
            <select name="plantType" defaultValue={query.plantType ?? ''}>
              <option value="">Any</option>
              {plantTypes.map((t) => (
                <option key={t.id} value={t.id}>
                  {t.name}
                </option>
              ))}
            </select>
          </label>
          <fieldset className="filter-services">
            <legend>Has these lines</legend>
            {services.map((s) => (
              <label key={s.id} className="filter-check">
                <input type="checkbox" name="service" value={s.id} defaultChecked={query.service?.includes(s.id)} />
                <span>{s.name}</span>
              </label>
            ))}
          </fieldset>
          <label>
            <span>Lost a year, at least</span>
            <input type="number" name="lossMin" min={0} step="any" inputMode="decimal" defaultValue={query.lossMin ?? ''} />
          </label>
          <label>
            <span>Lost a year, at most</span>
            <input type="number" name="lossMax" min={0} step="any" inputMode="decimal" defaultValue={query.lossMax ?? ''} />
          </label>
          <label>
            <span>Range no wider than</span>
            <select name="spreadMax" defaultValue={query.spreadMax ?? ''}>
              <option value="">Any</option>
              <option value="15">±15 % (firm figures)</option>
              <option value="30">±30 %</option>
              <option value="50">±50 %</option>
            </select>
          </label>
          <label>
            <span>Runs, at least</span>
            <input type="number" name="runsMin" min={0} step={1} inputMode="numeric" defaultValue={query.runsMin ?? ''} />
          </label>
          <label>
            <span>Runs, at most</span>
            <input type="number" name="runsMax" min={0} step={1} inputMode="numeric" defaultValue={query.runsMax ?? ''} />
          </label>
          <label>
            <span>Photos</span>
            <select name="photos" defaultValue={query.photos ?? ''}>
              <option value="">With or without</option>
              <option value="yes">With photos</option>
              <option value="no">Without photos</option>
            </select>
          </label>
          <label>
            <span>Posted within</span>
            <select name="maxAgeDays" defaultValue={query.maxAgeDays ?? ''}>
              <option value="">Any time</option>
              <option value="1">The last day</option>
              <option value="7">The last week</option>
              <option value="30">The last 30 days</option>
            </select>
          </label>
          <div className="filter-actions">
            <button type="submit" className="btn btn-primary" disabled={busy}>
              Show leads
            </button>
            <a
              href="/desk"
              className="btn btn-quiet"
              onClick={(event) => {
                event.preventDefault();
                formRef.current?.reset();
                void load({ page: '1' });
              }}
            >
              Clear
            </a>
          </div>
        </form>
      </details>

      <p role="status" aria-live="polite" className="text-graphite-soft">
        {busy
          ? 'Loading…'
          : data.total === 0
            ? 'No open leads match. New ones arrive by e-mail as owners send them.'
            : `${first}–${last} of ${data.total} open lead${data.total === 1 ? '' : 's'}`}
      </p>
      {message && (
        <p role="alert" className={message.tone === 'error' ? 'notice notice-error' : 'notice'}>
          {message.text}
        </p>
      )}

      {data.items.length > 0 && (
        <div className="lead-table-box" tabIndex={0} role="region" aria-label="Open leads, as a table">
        <table className="lead-table" aria-busy={busy}>
          <caption className="sr-only">Open leads in my regions; column headers sort the list</caption>
          <thead>
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const label = typeof header.column.columnDef.header === 'string' ? header.column.columnDef.header : '';
                  const id = header.column.id;
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={query.sort === id || (!query.sort && id === 'posted') ? ((query.dir ?? 'desc') === 'desc' ? 'descending' : 'ascending') : undefined}
                      className={`lead-col-${id}`}
                    >
                      {sortable.has(id) ? (
                        <SortLink id={id} label={label} query={{ ...query, sort: query.sort ?? 'posted', dir: query.dir ?? 'desc' }} onSort={(q) => void load(q)} />
                      ) : (
                        flexRender(header.column.columnDef.header, header.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id}>
                {row.getVisibleCells().map((cell) => (
                  <td
                    key={cell.id}
                    className={`lead-col-${cell.column.id}`}
                    data-label={typeof cell.column.columnDef.header === 'string' ? cell.column.columnDef.header : undefined}
                  >
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        </div>
      )}

      {data.pageCount > 1 && (
        <nav aria-label="Pages of open leads" className="flex flex-wrap items-center gap-3">
          {table.getCanPreviousPage() ? (
            <a
              className="btn btn-quiet"
              href={pageLink(data.page - 1)}
              onClick={(e) => {
                e.preventDefault();
                void load({ ...query, page: String(data.page - 1) });
              }}
            >
              Previous page
            </a>
          ) : null}
          <span className="text-graphite-soft">
            Page {data.page} of {data.pageCount}
          </span>
          {table.getCanNextPage() ? (
            <a
              className="btn btn-quiet"
              href={pageLink(data.page + 1)}
              onClick={(e) => {
                e.preventDefault();
                void load({ ...query, page: String(data.page + 1) });
              }}
            >
              Next page
            </a>
          ) : null}
        </nav>
      )}
    </div>
  );
}
