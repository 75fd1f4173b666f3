// @vitest-environment jsdom
// The sender's module is fetched after the first paint; a network drop before the service worker
// kept the file makes that fetch fail. The outbox tries again (every 5 s) until it arrives, and the
// tap that waited on the phone then goes.
import 'fake-indexeddb/auto';
import { act, renderHook, waitFor } from '@testing-library/react';
import { clear } from 'idb-keyval';
import { afterEach, beforeEach, expect, it, vi } from 'vitest';
import { useRunQueue, type SaveEvents } from '@/features/runner/api/use-run-queue';
import { stubPollFetch, tap, THEO } from '@/tests/helpers/outbox-harness';

const loads = vi.hoisted(() => ({ count: 0 }));
vi.mock('@/features/runner/api/run-sender', async (importOriginal) => {
  if (++loads.count <= 2) throw new TypeError('Failed to fetch dynamically imported module');
  return importOriginal();
});

const WHEEL = '5b7d9f1a-3c5e-4a7b-8d9f-1a3c5e7a9b1d';

beforeEach(async () => {
  await clear();
  stubPollFetch();
});
afterEach(() => vi.unstubAllGlobals());

it('when the sender fails to load twice, it is fetched again and the waiting tap is sent once', async () => {
  const save = vi.fn<SaveEvents>(async (_prev, { events }) => ({
    ok: true,
    data: { saved: events.length, duplicates: 0 },
  }));
  const hook = renderHook(() => useRunQueue(WHEEL, [], save, THEO));
  await waitFor(() => expect(hook.result.current.status.ready).toBe(true));
  await act(() => hook.result.current.record(tap(1)));
  await waitFor(() => expect(loads.count).toBe(1));
  expect(hook.result.current.status.waiting).toBe(1);
  expect(save).not.toHaveBeenCalled();

  // Tried again 5 s later (fails), and 5 s after that (arrives).
  await waitFor(() => expect(hook.result.current.status.waiting).toBe(0), { timeout: 15_000 });
  expect(loads.count).toBe(3);
  expect(save).toHaveBeenCalledTimes(1);
  hook.unmount();
}, 20_000);
