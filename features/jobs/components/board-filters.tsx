'use client';

import { useEffect, useState } from 'react';
import { JOB_STATES } from '../schemas';
import { STATE_LABELS } from '../transitions';
import type { BoardFilters as Filters } from '../api/get-jobs';

const control = 'min-h-touch rounded-lg border-2 border-ink-soft bg-paper px-3 text-base';

export function BoardFilters({
  filters,
  people,
  onChange,
}: {
  filters: Filters;
  people: { id: string; name: string }[];
  onChange: (next: Partial<Filters>) => void;
}) {
  const [q, setQ] = useState(filters.q ?? '');
  // Search waits for a pause in typing before it touches the URL and the server.
  useEffect(() => {
    if ((filters.q ?? '') === q) return;
    const t = setTimeout(() => onChange({ q, page: undefined }), 300);
    return () => clearTimeout(t);
  }, [q, filters.q, onChange]);

  return (
    <form role="search" aria-label="Filter the board" className="mb-4 grid gap-3 sm:grid-cols-2 lg:grid-cols-4" onSubmit={(e) => e.preventDefault()}>
      <label className="flex flex-col gap-1 font-semibold">
        Search
        <input type="search" value={q} onChange={(e) => setQ(e.target.value)} placeholder="Customer, vehicle, VIN or job number" className={control} />
      </label>
      <label className="flex flex-col gap-1 font-semibold">
        State
        <select value={filters.state ?? ''} onChange={(e) => onChange({ state: e.target.value || undefined, page: undefined })} className={control}>
          <option value="">All states</option>
          {JOB_STATES.map((s) => (
            <option key={s} value={s}>
              {STATE_LABELS[s]}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 font-semibold">
        Assigned to
        <select value={filters.assignee ?? ''} onChange={(e) => onChange({ assignee: e.target.value || 'all', page: undefined })} className={control}>
          <option value="all">Anyone</option>
          <option value="me">Me</option>
          <option value="unassigned">Nobody yet</option>
          {people.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 font-semibold">
        Due
        <select value={filters.due ?? ''} onChange={(e) => onChange({ due: e.target.value || undefined, page: undefined })} className={control}>
          <option value="">Any time</option>
          <option value="overdue">Overdue</option>
          <option value="today">Today</option>
          <option value="week">Next 7 days</option>
        </select>
      </label>
    </form>
  );
}
