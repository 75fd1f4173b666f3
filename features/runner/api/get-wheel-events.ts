import { queryOptions } from '@tanstack/react-query';
import type { ClientEvent } from '../events';

/** The events the server holds for the wheel (or a practice attempt), every phone's. */
export async function getWheelEvents(eventsUrl: string, signal?: AbortSignal) {
  const res = await fetch(eventsUrl, { signal });
  if (!res.ok) throw new Error(`The wheel's events could not be read (${res.status}).`);
  const body = (await res.json()) as { data: { events: ClientEvent[] } };
  return body.data.events;
}

/**
 * Another phone on the same wheel: pull the server's events every 5 s so both converge. Query
 * pauses it offline and pulls again on reconnect; a failed pull waits for the next one. Observed
 * by the runner's sender (./run-sender), which loads after the first paint.
 */
export const wheelEventsQueryOptions = (eventsUrl: string) =>
  queryOptions({
    queryKey: ['runner', 'events', eventsUrl],
    queryFn: ({ signal }) => getWheelEvents(eventsUrl, signal),
    refetchInterval: 5_000,
    retry: false,
    networkMode: 'online',
  });
