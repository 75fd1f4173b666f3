// @vitest-environment jsdom
// A tap made before the runner has read this phone's queue (the first moments after the page
// opens): it shows at once, never replaces what already waits on the phone, and goes with it.
// The read is held back by a gate so the tap lands before it, every run.
import 'fake-indexeddb/auto';
import { act, renderHook, waitFor } from '@testing-library/react';
import { clear, set } from 'idb-keyval';
import { StrictMode, type ReactNode } from 'react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { outboxKey, useRunQueue, type SaveEvents } from '@/features/runner/api/use-run-queue';
import type { ClientEvent } from '@/features/runner/events';
import type * as OutboxStore from '@/features/runner/api/outbox-store';
import {
  boltOf,
  heldBolts as heldOn,
  network,
  stubPhone,
  tap,
  THEO,
  unstubPhone,
} from '@/tests/helpers/outbox-harness';

const read = vi.hoisted(() => ({ gate: Promise.resolve() }));
vi.mock('@/features/runner/api/outbox-store', async (importOriginal) => {
  const mod = await importOriginal<typeof OutboxStore>();
  return {
    ...mod,
    readOutbox: async (...args: Parameters<typeof mod.readOutbox>) => {
      await read.gate;
      return mod.readOutbox(...args);
    },
  };
});

const WHEEL = '6d3a0f7e-1c1b-4c55-9f3e-2a7d1f0c9b11';
const KEY = outboxKey(THEO.id, WHEEL);
const heldBolts = () => heldOn(KEY);
const sentBolts = (action: ReturnType<typeof vi.fn<SaveEvents>>) =>
  action.mock.calls.flatMap(([, input]) => input.events.map(boltOf));
const saveAll = vi.fn<SaveEvents>(async (_prev, { events }) => ({
  ok: true,
  data: { saved: events.length, duplicates: 0 },
}));

describe('a tap before the phone’s queue is read', () => {
  beforeEach(async () => {
    await clear();
    saveAll.mockClear();
    read.gate = Promise.resolve();
    stubPhone();
  });
  afterEach(unstubPhone);

  it('keeps bolt 1 that waited on the phone and the new bolt 2, on screen and on the phone, and sends each once', async () => {
    const earlier: ClientEvent = {
      ...tap(1),
      clientId: '01890000-0000-7000-8000-000000000001',
      clientAt: new Date().toISOString(),
      deviceId: 'phone-a',
    };
    await set(KEY, { owner: THEO, pending: [earlier], saved: [], attention: [], generation: null });
    network(false);
    let openRead = () => {};
    read.gate = new Promise((resolve) => (openRead = resolve));
    const hook = renderHook(() => useRunQueue(WHEEL, [], saveAll, THEO));

    expect(hook.result.current.status.ready).toBe(false);
    await act(() => hook.result.current.record(tap(2)));
    expect(hook.result.current.events.map(boltOf)).toEqual([2]);
    // Not written over what waits on the phone before it was read.
    expect(await heldBolts()).toEqual([1]);

    act(() => openRead());
    await waitFor(() => expect(hook.result.current.status.ready).toBe(true));
    expect(hook.result.current.events.map(boltOf)).toEqual([1, 2]);
    expect(hook.result.current.status.waiting).toBe(2);
    await waitFor(async () => expect(await heldBolts()).toEqual([1, 2]));
    expect(saveAll).not.toHaveBeenCalled();

    act(() => network(true));
    await waitFor(() => expect(hook.result.current.status.waiting).toBe(0));
    expect(sentBolts(saveAll)).toEqual([1, 2]);
    expect(await heldBolts()).toEqual([]);
    hook.unmount();
  });

  it('under StrictMode (effects run twice, as in development) each tap is sent once', async () => {
    const hook = renderHook(() => useRunQueue(WHEEL, [], saveAll, THEO), {
      wrapper: ({ children }: { children: ReactNode }) => <StrictMode>{children}</StrictMode>,
    });
    await waitFor(() => expect(hook.result.current.status.ready).toBe(true));
    await act(() => hook.result.current.record(tap(1)));
    await act(() => hook.result.current.record(tap(5)));
    await waitFor(() => expect(hook.result.current.status.waiting).toBe(0));
    // A moment more for any second send to show.
    await new Promise((resolve) => setTimeout(resolve, 200));
    expect(sentBolts(saveAll)).toEqual([1, 5]);
    expect(hook.result.current.events.map(boltOf)).toEqual([1, 5]);
    hook.unmount();
  });
});
