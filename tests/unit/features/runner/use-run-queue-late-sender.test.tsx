// @vitest-environment jsdom
// The outbox's sender (TanStack Query, ./run-sender) loads after the first paint. Taps made before
// it arrives are written to the phone and go once it has loaded; a reload before then loses
// nothing; offline, they wait for the network. The sender's module is held back by a gate.
import 'fake-indexeddb/auto';
import { act, renderHook, waitFor } from '@testing-library/react';
import { clear, get } from 'idb-keyval';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { outboxKey, useRunQueue, type SaveEvents } from '@/features/runner/api/use-run-queue';
import type * as GetWheelEvents from '@/features/runner/api/get-wheel-events';
import { network, stubPhone, tap, THEO, unstubPhone } from '@/tests/helpers/outbox-harness';

// The gate holds back a module only the sender imports (not the sender itself: while a mock's
// factory runs, vitest gives other imports of that path the original, so a second runner would
// get the sender at once). `starts` counts the senders started (each asks for the poll's query
// options), so "nothing was sent" is checked after a sender was there and asked to send.
const gate = vi.hoisted(() => {
  let open = () => {};
  const opened = new Promise<void>((resolve) => (open = resolve));
  const state = { opened, loads: 0, starts: 0 };
  return { state, open: () => open() };
});
vi.mock('@/features/runner/api/get-wheel-events', async (importOriginal) => {
  gate.state.loads++;
  await gate.state.opened;
  const mod = await importOriginal<typeof GetWheelEvents>();
  return {
    ...mod,
    wheelEventsQueryOptions: (...args: Parameters<typeof mod.wheelEventsQueryOptions>) => {
      gate.state.starts++;
      return mod.wheelEventsQueryOptions(...args);
    },
  };
});

const WHEEL = '9a2e4c6d-3b1f-4e8a-a7c5-0d9e8f7a6b5c';
const KEY = outboxKey(THEO.id, WHEEL);
const saved = { ok: true as const, data: { saved: 1, duplicates: 0 } };
const held = async () => ((await get(KEY)) as { pending: { clientId: string }[] }).pending;
const mount = (action: SaveEvents) => renderHook(() => useRunQueue(WHEEL, [], action, THEO));

describe('the outbox before its sender has loaded', () => {
  beforeEach(async () => {
    await clear();
    stubPhone();
  });
  afterEach(unstubPhone);

  // One test: the module loads once per file, so the gate opens once.
  it('keeps taps on the phone, across a reload and offline, and sends each once when it arrives', async () => {
    const action = vi.fn<SaveEvents>(async () => saved);
    const first = mount(action);
    await waitFor(() => expect(first.result.current.status.ready).toBe(true));
    await act(() => first.result.current.record(tap(1)));
    await act(() => first.result.current.record(tap(2)));
    // Asked for, not arrived: the taps are on screen and on the phone, nothing has been sent.
    await waitFor(() => expect(gate.state.loads).toBe(1));
    expect(first.result.current.status.waiting).toBe(2);
    expect(await held()).toHaveLength(2);
    expect(action).not.toHaveBeenCalled();

    // A reload before the sender arrived: the page goes, the phone keeps the taps.
    first.unmount();
    network(false);
    const second = mount(action);
    await waitFor(() => expect(second.result.current.status.waiting).toBe(2));
    await act(() => second.result.current.record(tap(3)));
    expect(await held()).toHaveLength(3);

    // The sender arrives offline and is asked to send: still nothing goes.
    expect(gate.state.starts).toBe(0); // held back for both runners until now
    gate.open();
    // The sender starts and at once asks for a send (paused offline).
    await waitFor(() => expect(gate.state.starts).toBe(1));
    await new Promise((r) => setTimeout(r, 300));
    expect(action).not.toHaveBeenCalled();
    expect(second.result.current.status.waiting).toBe(3);

    // Back online: all three go, once each, in the order tapped.
    act(() => network(true));
    await waitFor(() => expect(second.result.current.status.waiting).toBe(0));
    const sent = action.mock.calls.flatMap(([, input]) =>
      input.events.map((e) => (e.payload as { bolt: number }).bolt),
    );
    expect(sent).toEqual([1, 2, 3]);
    expect(await held()).toHaveLength(0);
    second.unmount();
  });
});
