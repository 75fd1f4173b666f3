// @vitest-environment jsdom
// The outbox when its sender stops with a send under way: a runner that closed must not write its
// stale queue over a newer runner's, and a sender replaced while its send waits offline must not
// keep the queue from sending through the new one.
import 'fake-indexeddb/auto';
import { act, renderHook, waitFor } from '@testing-library/react';
import { clear } from 'idb-keyval';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { outboxKey, useRunQueue, type SaveEvents } from '@/features/runner/api/use-run-queue';
import type * as RunSender from '@/features/runner/api/run-sender';
import {
  boltOf,
  heldBolts as heldOn,
  network,
  savedAll,
  stubPhone,
  tap,
  THEO,
  unstubPhone,
} from '@/tests/helpers/outbox-harness';

// Counts the senders started and the sends asked of them, to know a send is under way.
const seen = vi.hoisted(() => ({ starts: 0, sends: 0 }));
vi.mock('@/features/runner/api/run-sender', async (importOriginal) => {
  const mod = await importOriginal<typeof RunSender>();
  return {
    ...mod,
    startSender: (work: Parameters<typeof mod.startSender>[0]) => {
      seen.starts++;
      const sender = mod.startSender(work);
      return {
        ...sender,
        send: () => {
          seen.sends++;
          return sender.send();
        },
      };
    },
  };
});

const WHEEL = '2c4e6a8b-0d1f-4a3c-9e5b-7d9f1b3d5f7a';
const KEY = outboxKey(THEO.id, WHEEL);
const heldBolts = () => heldOn(KEY);

describe('the outbox when its sender stops mid-send', () => {
  beforeEach(async () => {
    await clear();
    seen.starts = 0;
    seen.sends = 0;
    stubPhone();
  });
  afterEach(unstubPhone);

  it('a late answer to a closed runner leaves the newer runner’s taps on the phone', async () => {
    let answerLate = () => {};
    const slow = vi.fn<SaveEvents>(
      (_prev, { events }) =>
        new Promise((resolve) => (answerLate = () => resolve(savedAll(events)))),
    );
    const first = renderHook(() => useRunQueue(WHEEL, [], slow, THEO));
    await waitFor(() => expect(first.result.current.status.ready).toBe(true));
    await act(() => first.result.current.record(tap(1)));
    await waitFor(() => expect(slow).toHaveBeenCalledTimes(1));
    first.unmount();

    // The runner opened again, offline: bolt 1 still waits, bolt 2 joins it.
    network(false);
    const save = vi.fn<SaveEvents>(async (_prev, { events }) => savedAll(events));
    const second = renderHook(() => useRunQueue(WHEEL, [], save, THEO));
    await waitFor(() => expect(second.result.current.status.waiting).toBe(1));
    await act(() => second.result.current.record(tap(2)));
    expect(await heldBolts()).toEqual([1, 2]);

    // The closed runner's answer arrives now.
    await act(async () => answerLate());
    await new Promise((resolve) => setTimeout(resolve, 100));
    expect(await heldBolts()).toEqual([1, 2]);

    act(() => network(true));
    await waitFor(() => expect(second.result.current.status.waiting).toBe(0));
    expect(save.mock.calls.flatMap(([, input]) => input.events.map(boltOf))).toEqual([1, 2]);
    second.unmount();
  });

  it('a sender replaced while its send waits offline leaves the new sender to send on reconnect', async () => {
    network(false);
    const save = vi.fn<SaveEvents>(async (_prev, { events }) => savedAll(events));
    const hook = renderHook(
      ({ generation }: { generation: string }) => useRunQueue(WHEEL, [], save, THEO, generation),
      { initialProps: { generation: 'before-send-back' } },
    );
    await waitFor(() => expect(hook.result.current.status.ready).toBe(true));
    await act(() => hook.result.current.record(tap(1)));
    // The sender has loaded and holds a send, paused offline.
    await waitFor(() => expect(seen.sends).toBe(1));
    expect(seen.starts).toBe(1);

    // A lead sends the wheel back: the outbox starts a new sender for the new generation.
    hook.rerender({ generation: 'after-send-back' });
    await waitFor(() => expect(seen.starts).toBe(2));

    act(() => network(true));
    await waitFor(() => expect(hook.result.current.status.waiting).toBe(0));
    expect(save.mock.calls.flatMap(([, input]) => input.events.map(boltOf))).toEqual([1]);
    expect(await heldBolts()).toEqual([]);
    hook.unmount();
  });
});
