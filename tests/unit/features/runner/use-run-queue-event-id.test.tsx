// @vitest-environment jsdom
// The ids the runner gives its events are time-ordered (UUIDv7): the server keys its event tables by
// them, and an id that grows with time keeps each insert in the index's newest page.
import 'fake-indexeddb/auto';
import { act, renderHook, waitFor } from '@testing-library/react';
import { clear } from 'idb-keyval';
import { beforeEach, expect, it, vi } from 'vitest';
import { useRunQueue, type SaveEvents } from '@/features/runner/api/use-run-queue';
import { tap as bolt, THEO } from '@/tests/helpers/outbox-harness';

const WHEEL = '9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d';
// RFC 9562 §5.7: version 7 nibble, variant 10, the first 48 bits the Unix time in ms.
const V7 = /^[0-9a-f]{8}-[0-9a-f]{4}-7[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;
const msOf = (id: string) => parseInt(id.replace(/-/g, '').slice(0, 12), 16);

beforeEach(async () => {
  await clear();
  sessionStorage.clear();
});

it('a tap gets a UUIDv7 of the moment it was made, later taps larger ids', async () => {
  const action = vi.fn<SaveEvents>(async () => ({ ok: true, data: { saved: 1, duplicates: 0 } }));
  const hook = renderHook(() => useRunQueue(WHEEL, [], action, THEO));
  await waitFor(() => expect(hook.result.current.status.ready).toBe(true));
  const before = Date.now();
  await act(() => hook.result.current.record(bolt(1)));
  await new Promise((resolve) => setTimeout(resolve, 5));
  await act(() => hook.result.current.record(bolt(2)));
  const after = Date.now();
  await waitFor(() => expect(hook.result.current.status.waiting).toBe(0));

  const ids = action.mock.calls.flatMap(([, input]) => input.events.map((e) => e.clientId));
  expect(ids).toHaveLength(2);
  for (const id of ids) {
    expect(id).toMatch(V7);
    expect(msOf(id)).toBeGreaterThanOrEqual(before);
    expect(msOf(id)).toBeLessThanOrEqual(after);
  }
  expect(ids[0]! < ids[1]!).toBe(true);
});
