// The runner outbox hook tests' shared phone: who is signed in, the browser's network state
// (navigator.onLine and its events), a fetch that answers the poll with no events, and readers of
// what the outbox holds in (fake) IndexedDB. Each test file keeps its own module mocks.
import { get } from 'idb-keyval';
import { vi } from 'vitest';
import type { QueuePerson } from '@/features/runner/api/use-run-queue';
import type { ClientEvent } from '@/features/runner/events';

export const THEO: QueuePerson = { id: '0b6f9a52-56a4-4c6e-8a39-8d3c3f1e0a01', name: 'Theo Tech' };

export const tap = (bolt: number) =>
  ({ type: 'bolt_confirmed', payload: { pass: 1, bolt } }) as const;
export const boltOf = (e: ClientEvent) => (e.payload as { bolt: number }).bolt;

/** A save that stores every event it is given. */
export const savedAll = (events: ClientEvent[]) => ({
  ok: true as const,
  data: { saved: events.length, duplicates: 0 },
});

/** The bolts waiting on the phone under `key`, in order ([] when nothing is stored). */
export const heldBolts = async (key: string) =>
  (((await get(key)) as { pending: ClientEvent[] } | undefined)?.pending ?? []).map(boltOf);

let online = true;

/** Sets the phone's network state and fires the event the browser would. */
export function network(up: boolean) {
  online = up;
  window.dispatchEvent(new Event(up ? 'online' : 'offline'));
}

/** The poll's fetch answering "no events"; the tests that never send still poll. */
export function stubPollFetch() {
  vi.stubGlobal(
    'fetch',
    vi.fn(async () => Response.json({ data: { events: [] } })),
  );
}

/** For a beforeEach: online, navigator.onLine following `network`, the poll stubbed. */
export function stubPhone() {
  Object.defineProperty(window.navigator, 'onLine', { configurable: true, get: () => online });
  network(true);
  stubPollFetch();
}

/** For an afterEach: back online, globals restored. */
export function unstubPhone() {
  network(true);
  vi.unstubAllGlobals();
}
