// @vitest-environment jsdom
// The runner's rule: an event is in IndexedDB before any network. idb-keyval's `set` is held back
// here (a gate around the real one, on fake-indexeddb) to show that nothing is sent in that gap,
// neither by the tap itself nor by a retry that was already waiting.
import 'fake-indexeddb/auto';
import { act, renderHook, waitFor } from '@testing-library/react';
import type * as idb from 'idb-keyval';
import { clear, get } from 'idb-keyval';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import type { RunEvent } from '@/features/runner/events';
import {
  outboxKey,
  useRunQueue,
  type QueuePerson,
  type SaveEvents,
} from '@/features/runner/api/use-run-queue';

const gate = vi.hoisted(() => ({ closed: null as Promise<void> | null }));
vi.mock('idb-keyval', async (importOriginal) => {
  const real = await importOriginal<typeof idb>();
  return {
    ...real,
    set: vi.fn(async (...args: Parameters<typeof real.set>) => {
      await gate.closed; // the write as the phone's storage is slow to commit it
      return real.set(...args);
    }),
  };
});

/** Holds every IndexedDB write started from now on until the returned function is called. */
function holdWrites() {
  let open = () => {};
  gate.closed = new Promise<void>((resolve) => (open = resolve));
  return () => {
    gate.closed = null;
    open();
  };
}

const WHEEL = '9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d';
const THEO: QueuePerson = { id: '0b6f9a52-56a4-4c6e-8a39-8d3c3f1e0a01', name: 'Theo Tech' };
const KEY = outboxKey(THEO.id, WHEEL);
const bolt = (n: number): RunEvent => ({ type: 'bolt_confirmed', payload: { pass: 1, bolt: n } });
const saved = { ok: true as const, data: { saved: 1, duplicates: 0 } };

function setUp(save: SaveEvents) {
  const action = vi.fn(save);
  const hook = renderHook(() => useRunQueue(WHEEL, [], action, THEO));
  return { action, hook };
}

const boltsSent = (action: ReturnType<typeof setUp>['action']) =>
  action.mock.calls.map(([, input]) =>
    input.events.map((e) => (e.payload as { bolt: number }).bolt),
  );

describe('the runner outbox writes to the phone before the network', () => {
  beforeEach(async () => {
    gate.closed = null;
    await clear();
    sessionStorage.clear();
  });

  it('a tap shows at once as waiting, and is sent only once IndexedDB has it', async () => {
    const { action, hook } = setUp(async () => saved);
    await waitFor(() => expect(hook.result.current.status.ready).toBe(true));
    const release = holdWrites();
    let recorded!: Promise<void>;
    act(() => {
      recorded = hook.result.current.record(bolt(1));
    });
    expect(hook.result.current.status.waiting).toBe(1);
    expect(hook.result.current.events).toHaveLength(1);
    await new Promise((r) => setTimeout(r, 200));
    expect(action).not.toHaveBeenCalled();

    release();
    await act(() => recorded);
    await waitFor(() => expect(hook.result.current.status.waiting).toBe(0));
    expect(boltsSent(action)).toEqual([[1]]);
  });

  it('a retry due while a tap is being written sends only what the phone already holds', async () => {
    let calls = 0;
    const { action, hook } = setUp(async () =>
      ++calls === 1
        ? { ok: false, code: 'rate_limited', message: 'Too many saves at once; trying again.' }
        : saved,
    );
    await waitFor(() => expect(hook.result.current.status.ready).toBe(true));
    await act(() => hook.result.current.record(bolt(1)));
    await waitFor(() => expect(hook.result.current.status.error).toMatch(/too many saves/i));

    // Bolt 2 is tapped; its write hangs across the retry (2 s after the refusal).
    const release = holdWrites();
    let recorded!: Promise<void>;
    act(() => {
      recorded = hook.result.current.record(bolt(2));
    });
    expect(hook.result.current.status.waiting).toBe(2);
    await waitFor(() => expect(action).toHaveBeenCalledTimes(2), { timeout: 5_000 });
    expect(boltsSent(action)).toEqual([[1], [1]]);

    release();
    await act(() => recorded);
    await waitFor(() => expect(hook.result.current.status.waiting).toBe(0));
    expect(boltsSent(action)).toEqual([[1], [1], [2]]);
    expect(((await get(KEY)) as { pending: unknown[] }).pending).toHaveLength(0);
  }, 10_000);
});
