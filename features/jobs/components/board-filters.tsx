'use client';

import { useEffect, useId, useState, useSyncExternalStore } from 'react';
import { JOB_STATES } from '../schemas';
import { STATE_LABELS } from '../transitions';
import type { BoardFilters as Filters } from '../api/get-jobs';

const control = 'min-h-touch rounded-lg border-2 border-ink-soft bg-paper px-3 text-base';

// Tailwind's `sm` breakpoint: below it the filters fold behind one button so cards come first.
const WIDE = '(min-width: 640px)';
// Without matchMedia (a test DOM) the answer stays unknown and the CSS decides.
const media = () => (typeof window.matchMedia === 'function' ? window.matchMedia(WIDE) : null);
const subscribeWide = (onChange: () => void) => {
  const query = media();
  query?.addEventListener('change', onChange);
  return () => query?.removeEventListener('change', onChange);
};

/** Wide screen or not; the server does not know, so it renders CSS that decides until hydration. */
function useWide(): boolean | null {
  return useSyncExternalStore(
    subscribeWide,
    () => media()?.matches ?? null,
    () => null,
  );
}

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

  const panelId = useId();
  const wide = useWide();
  // Null until the person toggles it: open on wide screens, folded on phones.
  const [chosen, setChosen] = useState<boolean | null>(null);
  const open = chosen ?? wide;
  const active = [
    filters.state,
    filters.due,
    filters.q,
    filters.assignee && filters.assignee !== 'all' ? filters.assignee : undefined,
  ].filter(Boolean).length;
  const visibility = open === null ? 'hidden sm:grid' : open ? 'grid' : 'hidden';

  return (
    <div className="mb-4">
      <button
        type="button"
        aria-expanded={open ?? undefined}
        aria-controls={panelId}
        onClick={() => setChosen(!(open ?? false))}
        className="min-h-touch border-ink mb-3 inline-flex items-center gap-2 rounded-lg border-2 px-4 font-semibold"
      >
        Filter{active ? ` (${active} on)` : ''}
        <span aria-hidden>{open ? '▲' : '▼'}</span>
      </button>
      <form
        id={panelId}
        role="search"
        aria-label="Filter the board"
        className={`${visibility} gap-3 sm:grid-cols-2 lg:grid-cols-4`}
        onSubmit={(e) => e.preventDefault()}
      >
        <label className="flex flex-col gap-1 font-semibold">
          Search
          <input
            type="search"
            value={q}
            onChange={(e) => setQ(e.target.value)}
            placeholder="Customer, vehicle, VIN or job number"
            className={control}
          />
        </label>
        <label className="flex flex-col gap-1 font-semibold">
          State
          <select
            value={filters.state ?? ''}
            onChange={(e) => onChange({ state: e.target.value || undefined, page: undefined })}
            className={control}
          >
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
          <select
            value={filters.assignee ?? ''}
            onChange={(e) => onChange({ assignee: e.target.value || 'all', page: undefined })}
            className={control}
          >
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
          <select
            value={filters.due ?? ''}
            onChange={(e) => onChange({ due: e.target.value || undefined, page: undefined })}
            className={control}
          >
            <option value="">Any time</option>
            <option value="overdue">Overdue</option>
            <option value="today">Today</option>
            <option value="week">Next 7 days</option>
          </select>
        </label>
      </form>
    </div>
  );
}
