import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { BoardPage } from '../server/board';

export type BoardFilters = {
  state?: string;
  assignee?: string;
  due?: string;
  q?: string;
  sort?: string;
  dir?: string;
  page?: string;
};

export class ApiError extends Error {}

const FILTER_KEYS = ['state', 'assignee', 'due', 'q', 'sort', 'dir', 'page'] as const;

/**
 * The board's filters as the URL holds them (a technician's default is their own work), and the
 * ones sent to the API ("all" means no assignee filter). One function for the server's prefetch
 * and the browser, so both build the same query key and the prefetched page is used.
 */
export function boardFiltersFrom(
  get: (key: string) => string | null | undefined,
  defaultAssignee?: string,
): { shown: BoardFilters; api: BoardFilters } {
  const shown: BoardFilters = {};
  for (const key of FILTER_KEYS) shown[key] = get(key) ?? undefined;
  shown.assignee ??= defaultAssignee;
  return {
    shown,
    api: { ...shown, assignee: shown.assignee === 'all' ? undefined : shown.assignee },
  };
}

export async function getJobs(filters: BoardFilters, signal?: AbortSignal): Promise<BoardPage> {
  const params = new URLSearchParams(
    Object.entries(filters).filter((e): e is [string, string] => Boolean(e[1])),
  );
  const res = await fetch(`/api/jobs?${params}`, {
    signal,
    headers: { accept: 'application/json' },
  });
  const body = (await res.json().catch(() => null)) as
    (BoardPage & { error?: { message: string } }) | null;
  if (!res.ok || !body)
    throw new ApiError(body?.error?.message ?? `The board could not be loaded (${res.status}).`);
  return body;
}

/** Refreshed every 5 s while the board is open, so a lead sees progress without reloading. */
export const jobsQueryOptions = (filters: BoardFilters) =>
  queryOptions({
    queryKey: ['jobs', filters],
    queryFn: ({ signal }) => getJobs(filters, signal),
    refetchInterval: 5_000,
    placeholderData: keepPreviousData,
  });

export const useJobs = (filters: BoardFilters) => useQuery(jobsQueryOptions(filters));
