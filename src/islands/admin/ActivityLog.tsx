/**
 * The activity log: a TanStack table in manual mode — the server filters and pages
 * (GET /api/admin/activity) and this island only asks for the next page. Rendered on the server
 * with the first page, its filters are a plain GET form and its page links plain links, so it
 * works before (or without) JavaScript.
 */
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef } from '@tanstack/react-table';
import { useMemo, useState, type FormEvent } from 'react';
import { fetchActivity } from '../../lib/admin-client';
import type { ActivityLogEntry, ActivityResponse } from '../../schemas/admin';

export interface ActivityLogProps {
  initial: ActivityResponse;
  /** The filters as the URL had them. */
  query: Record<string, string>;
  people: { id: string; name: string; role: string | null }[];
  families: { id: string; label: string }[];
}

const filterKeys = ['lead', 'person', 'action', 'from', 'to', 'pageSize'] as const;

function searchOf(query: Record<string, string>): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value && !(key === 'page' && value === '1')) params.set(key, value);
  return params.toString();
}

const stamp = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' });

export default function ActivityLog({ initial, query: initialQuery, people, families }: ActivityLogProps) {
  const [data, setData] = useState(initial);
  const [query, setQuery] = useState(initialQuery);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  async function load(next: Record<string, string>) {
    setBusy(true);
    const search = searchOf(next);
    const answer = await fetchActivity(search);
    setBusy(false);
    if (!answer.ok) {
      setProblem(answer.issues[0] ? `${answer.issues[0].path}: ${answer.issues[0].message}` : answer.message);
      return;
    }
    setProblem(null);
    setData(answer.data);
    setQuery(next);
    window.history.replaceState(null, '', search ? `?${search}` : window.location.pathname);
  }

  const columns = useMemo<ColumnDef<ActivityLogEntry>[]>(
    () => [
      {
        id: 'when',
        header: 'When (UTC)',
        cell: ({ row: { original: e } }) => <time dateTime={e.at}>{stamp.format(new Date(e.at))}</time>,
      },
      {
        id: 'what',
        header: 'What happened',
        cell: ({ row: { original: e } }) => (
          <div>
            <p>{e.what}</p>
            {e.note && <p className="timeline-note">{e.note}</p>}
          </div>
        ),
      },
      {
        id: 'who',
        header: 'Who',
        cell: ({ row: { original: e } }) => (e.actor ? `${e.actor.name}${e.actor.firm ? ` (${e.actor.firm})` : ''}` : 'Lagwise'),
      },
      {
        id: 'lead',
        header: 'Lead',
        cell: ({ row: { original: e } }) => (e.lead ? <a href={`/desk/leads/${e.lead.id}`}>{e.lead.reference}</a> : '—'),
      },
    ],
    [],
  );

  const table = useReactTable({
    data: data.entries,
    columns,
    getCoreRowModel: getCoreRowModel(),
    manualPagination: true,
    manualFiltering: true,
    pageCount: data.pageCount,
    rowCount: data.total,
    state: { pagination: { pageIndex: data.page - 1, pageSize: data.pageSize } },
    getRowId: (e) => String(e.id),
  });

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const next: Record<string, string> = {};
    for (const key of filterKeys) {
      const value = String(form.get(key) ?? '').trim();
      if (value) next[key] = value;
    }
    void load(next);
  }

  const pageLink = (page: number) => `?${searchOf({ ...query, page: String(page) })}`;
  const first = (data.page - 1) * data.pageSize + 1;

  return (
    <div className="space-y-6">
      <form method="get" action="/admin/activity" onSubmit={submit} className="filter-grid">
        <label>
          <span>Lead (reference or id)</span>
          <input name="lead" defaultValue={query.lead ?? ''} placeholder="LW-…" className="admin-text" />
        </label>
        <label>
          <span>Person</span>
          <select name="person" defaultValue={query.person ?? ''}>
            <option value="">Anyone</option>
            {people.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name} ({p.role})
              </option>
            ))}
          </select>
        </label>
        <label>
          <span>What</span>
          <select name="action" defaultValue={query.action ?? ''}>
            <option value="">Everything</option>
            {families.map((f) => (
              <option key={f.id} value={f.id}>
                {f.label}
              </option>
            ))}
          </select>
        </label>
        <label>
          <span>From (day)</span>
          <input type="date" name="from" defaultValue={query.from ?? ''} className="admin-text" />
        </label>
        <label>
          <span>To (day)</span>
          <input type="date" name="to" defaultValue={query.to ?? ''} className="admin-text" />
        </label>
        <div className="filter-actions">
          <button type="submit" className="btn btn-primary" disabled={busy}>
            Show entries
          </button>
          <a
            className="btn btn-quiet"
            href="/admin/activity"
            onClick={(event) => {
              event.preventDefault();
              (event.currentTarget.closest('form') as HTMLFormElement | null)?.reset();
              void load({});
            }}
          >
            Clear
          </a>
        </div>
      </form>
      <p role="status" aria-live="polite" className="text-graphite-soft">
        {busy ? 'Loading…' : data.total === 0 ? 'No entries match.' : `${first}–${first + data.entries.length - 1} of ${data.total} entries, newest first`}
      </p>
      {problem && (
        <p role="alert" className="notice notice-error">
          {problem}
        </p>
      )}
      {data.entries.length > 0 && (
        <div className="lead-table-box" tabIndex={0} role="region" aria-label="The activity log, as a table">
        <table className="lead-table activity-table" aria-busy={busy}>
          <caption className="sr-only">The activity log, newest first</caption>
          <thead>
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => (
                  <th key={header.id} scope="col" className={`lead-col-${header.column.id}`}>
                    {flexRender(header.column.columnDef.header, header.getContext())}
                  </th>
                ))}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id}>
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className={`lead-col-${cell.column.id}`} data-label={String(cell.column.columnDef.header)}>
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
        <nav aria-label="Pages of the activity log" className="flex flex-wrap items-center gap-3">
          {table.getCanPreviousPage() && (
            <a
              className="btn btn-quiet"
              href={pageLink(data.page - 1)}
              onClick={(e) => {
                e.preventDefault();
                void load({ ...query, page: String(data.page - 1) });
              }}
            >
              Newer entries
            </a>
          )}
          <span className="text-graphite-soft">
            Page {data.page} of {data.pageCount}
          </span>
          {table.getCanNextPage() && (
            <a
              className="btn btn-quiet"
              href={pageLink(data.page + 1)}
              onClick={(e) => {
                e.preventDefault();
                void load({ ...query, page: String(data.page + 1) });
              }}
            >
              Older entries
            </a>
          )}
        </nav>
      )}
    </div>
  );
}
