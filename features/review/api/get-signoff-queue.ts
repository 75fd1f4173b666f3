import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SignoffQueue } from '../server/signoff-queue';

export async function getSignoffQueue(
  signal?: AbortSignal,
  countOnly = false,
): Promise<SignoffQueue> {
  const res = await fetch(countOnly ? '/api/signoff-queue?only=count' : '/api/signoff-queue', {
    signal,
    headers: { accept: 'application/json' },
  });
  const body = (await res.json().catch(() => null)) as {
    data?: SignoffQueue;
    error?: { message: string };
  } | null;
  if (!res.ok || !body?.data)
    throw new Error(
      body?.error?.message ?? `The sign-off queue could not be loaded (${res.status}).`,
    );
  return body.data;
}

/** Polled every 20 s while the queue is open, so new submissions appear without a reload. */
export const signoffQueueOptions = () =>
  queryOptions({
    queryKey: ['signoff-queue'],
    queryFn: ({ signal }) => getSignoffQueue(signal),
    refetchInterval: 20_000,
  });

/** The number alone, polled every 20 s while a lead has any shop page open (the nav's count). */
export const signoffCountOptions = () =>
  queryOptions({
    queryKey: ['signoff-queue', 'count'],
    queryFn: ({ signal }) => getSignoffQueue(signal, true),
    refetchInterval: 20_000,
  });

export const useSignoffQueue = (initialData?: SignoffQueue) =>
  useQuery({ ...signoffQueueOptions(), initialData });
export const useSignoffCount = () => useQuery(signoffCountOptions());
