import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { BoardPage } from '../server/board';

export type BoardFilters = { state?: string; assignee?: string; due?: string; q?: string; sort?: string; dir?: string; page?: string };

export class ApiError extends Error {}

export async function getJobs(filters: BoardFilters, signal?: AbortSignal): Promise<BoardPage> {
  const params = new URLSearchParams(Object.entries(filters).filter((e): e is [string, string] => Boolean(e[1])));
  const res = await fetch(`/api/jobs?${params}`, { signal, headers: { accept: 'application/json' } });
  const body = (await res.json().catch(() => null)) as (BoardPage & { error?: { message: string } }) | null;
  if (!res.ok || !body) throw new ApiError(body?.error?.message ?? `The board could not be loaded (${res.status}).`);
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
