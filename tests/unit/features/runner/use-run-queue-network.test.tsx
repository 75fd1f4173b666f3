// @vitest-environment jsdom
// The outbox's network side (Query): offline it waits, a refusal that may pass is retried after a
// pause, and another phone's confirmations arrive by the poll. IndexedDB is fake-indexeddb.
import 'fake-indexeddb/auto';
import { act, renderHook, waitFor } from '@testing-library/react';
import { clear, get } from 'idb-keyval';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { ClientEvent } from '@/features/runner/events';
import { outboxKey, useRunQueue, type SaveEvents } from '@/features/runner/api/use-run-queue';
import { network, stubPhone, THEO, unstubPhone } from '@/tests/helpers/outbox-harness';

const WHEEL = '3f1c2b7a-8d4e-4a6b-9c0d-1e2f3a4b5c6d';
const KEY = outboxKey(THEO.id, WHEEL);
const confirm = { type: 'bolt_confirmed', payload: { pass: 1, bolt: 1 } } as const;
const saved = { ok: true as const, data: { saved: 1, duplicates: 0 } };

function setUp(save: SaveEvents) {
  const action = vi.fn(save);
  const hook = renderHook(() => useRunQueue(WHEEL, [], action, THEO));
  return { action, hook };
}

describe('the runner outbox on the network', () => {
  beforeEach(async () => {
    await clear();
    stubPhone();
  });
  afterEach(unstubPhone);

  it('offline, a confirmation waits on the phone and nothing is sent; back online it goes by itself', async () => {
    network(false);
    const { action, hook } = setUp(async () => saved);
    await waitFor(() => expect(hook.result.current.status.ready).toBe(true));
    expect(hook.result.current.status.online).toBe(false);
    await act(() => hook.result.current.record(confirm));
    await new Promise((r) => setTimeout(r, 100));
    expect(hook.result.current.status.waiting).toBe(1);
    expect(action).not.toHaveBeenCalled();
    expect(((await get(KEY)) as { pending: unknown[] }).pending).toHaveLength(1);

    act(() => network(true));
    await waitFor(() => expect(hook.result.current.status.waiting).toBe(0));
    expect(hook.result.current.status.online).toBe(true);
    expect(action).toHaveBeenCalledTimes(1);
    expect(((await get(KEY)) as { pending: unknown[] }).pending).toHaveLength(0);
  });

  it('a rate limit keeps the confirmation, says so, and the send is tried again after a pause', async () => {
    let calls = 0;
    const { action, hook } = setUp(async () =>
      ++calls === 1
        ? { ok: false, code: 'rate_limited', message: 'Too many saves at once; trying again.' }
        : saved,
    );
    await waitFor(() => expect(hook.result.current.status.ready).toBe(true));
    await act(() => hook.result.current.record(confirm));
    await waitFor(() =>
      expect(hook.result.current.status.error).toBe('Too many saves at once; trying again.'),
    );
    const refusedAt = Date.now();
    expect(hook.result.current.status.waiting).toBe(1);
    await waitFor(() => expect(hook.result.current.status.waiting).toBe(0), { timeout: 5_000 });
    // The first pause is 2 s (then 4, 8 … at most 30), not an immediate hammering.
    expect(Date.now() - refusedAt).toBeGreaterThanOrEqual(1_500);
    expect(action).toHaveBeenCalledTimes(2);
    const [first, second] = action.mock.calls.map(([, input]) => input.events[0]!.clientId);
    expect(second).toBe(first);
  });

  it("another phone's confirmation on the same wheel shows by the next poll and is kept on this phone", async () => {
    const other: ClientEvent = {
      type: 'bolt_confirmed',
      payload: { pass: 1, bolt: 5 },
      clientId: crypto.randomUUID(),
      clientAt: '2026-01-01T09:00:00.000Z',
    };
    const fetchMock = vi.fn(async () => Response.json({ data: { events: [] } }));
    fetchMock
      .mockImplementationOnce(async () => Response.json({ data: { events: [] } }))
      .mockImplementation(async () => Response.json({ data: { events: [other] } }));
    vi.stubGlobal('fetch', fetchMock);
    const { hook } = setUp(async () => saved);
    await waitFor(() => expect(fetchMock).toHaveBeenCalledTimes(1));
    expect(hook.result.current.events).toEqual([]);
    // Polled every 5 s.
    await waitFor(
      () => expect(hook.result.current.events.map((e) => e.clientId)).toEqual([other.clientId]),
      { timeout: 7_000 },
    );
    expect(fetchMock).toHaveBeenCalledWith(`/api/wheels/${WHEEL}/events`, expect.anything());
    await waitFor(async () =>
      expect(await get(KEY)).toMatchObject({
        saved: [expect.objectContaining({ clientId: other.clientId })],
      }),
    );
  }, 10_000);
});
