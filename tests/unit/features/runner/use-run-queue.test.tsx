// @vitest-environment jsdom
// The device's IndexedDB in memory (fake-indexeddb), under the real idb-keyval the runner uses.
import 'fake-indexeddb/auto';
import { act, renderHook, waitFor } from '@testing-library/react';
import { clear, get, set } from 'idb-keyval';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { readSaveAnswer } from '@/features/runner/api/post-events';
import {
  outboxKey,
  useRunQueue,
  type QueuePerson,
  type SaveEvents,
} from '@/features/runner/api/use-run-queue';

const WHEEL = '6d3a0f7e-1c1b-4c55-9f3e-2a7d1f0c9b11';
const confirm = { type: 'bolt_confirmed', payload: { pass: 1, bolt: 1 } } as const;
const saved = { ok: true as const, data: { saved: 1, duplicates: 0 } };
const THEO: QueuePerson = { id: '0b6f9a52-56a4-4c6e-8a39-8d3c3f1e0a01', name: 'Theo Tech' };
const LENA: QueuePerson = { id: '7c1e2d33-9f0a-4b1e-b2c4-5a6d7e8f9a02', name: 'Lena Lead' };
const KEY = outboxKey(THEO.id, WHEEL);

function setUp(save: SaveEvents, person = THEO) {
  const action = vi.fn(save);
  const hook = renderHook(() => useRunQueue(WHEEL, [], action, person));
  return { action, hook };
}

// The outbox as the phone holds it.
const held = async () => (await get(KEY)) as Record<string, unknown> & { pending: unknown[] };

describe('the runner outbox', () => {
  beforeEach(async () => {
    await clear();
    sessionStorage.clear();
    vi.useRealTimers();
  });

  it('says nothing is saved until it has read the phone, then sends and reports "saved"', async () => {
    const { action, hook } = setUp(async () => saved);
    expect(hook.result.current.status.ready).toBe(false);
    await waitFor(() => expect(hook.result.current.status.ready).toBe(true));
    await act(() => hook.result.current.record(confirm));
    await waitFor(() => expect(hook.result.current.status.waiting).toBe(0));
    expect(action).toHaveBeenCalledWith(null, {
      wheelId: WHEEL,
      events: [expect.objectContaining({ ...confirm, clientId: expect.any(String) })],
    });
    expect(hook.result.current.events).toHaveLength(1);
  });

  it('an ended session keeps the confirmation on the phone and asks to sign in again', async () => {
    const { action, hook } = setUp(async () => ({
      ok: false,
      code: 'unauthenticated',
      message: 'Your session has ended. Sign in again.',
    }));
    await waitFor(() => expect(hook.result.current.status.ready).toBe(true));
    await act(() => hook.result.current.record(confirm));
    await waitFor(() =>
      expect(hook.result.current.status.error).toMatch(/session has ended.*stays on this phone/i),
    );
    expect(hook.result.current.status.signedOut).toBe(true);
    expect(hook.result.current.status.waiting).toBe(1);
    expect(action).toHaveBeenCalledTimes(1);
    expect((await held()).pending).toHaveLength(1);
  });

  it('a refused Origin keeps the confirmation, says why, and sends it again (never set aside)', async () => {
    const answers = [
      Response.json(
        { error: { code: 'cross_origin', message: 'Cross-origin request refused.' } },
        { status: 403 },
      ),
      Response.json({ data: { saved: 1, duplicates: 0, refused: [] } }),
    ];
    // The outbox's own answer reader, as the real wheel's save uses it.
    const { action, hook } = setUp(async (_prev, { events }) =>
      readSaveAnswer(answers.shift()!, events.length),
    );
    await waitFor(() => expect(hook.result.current.status.ready).toBe(true));
    await act(() => hook.result.current.record(confirm));
    await waitFor(() =>
      expect(hook.result.current.status.error).toBe('Cross-origin request refused.'),
    );
    expect(hook.result.current.status.waiting).toBe(1);
    expect(hook.result.current.attention).toEqual([]);
    // Retried after 2 s, then saved.
    await waitFor(() => expect(hook.result.current.status.waiting).toBe(0), { timeout: 5_000 });
    expect(action).toHaveBeenCalledTimes(2);
    expect(hook.result.current.attention).toEqual([]);
    expect(hook.result.current.events).toHaveLength(1);
  });

  it('a refusal for good (bad data) leaves the queue, so what follows can go, and says why', async () => {
    const { hook } = setUp(async () => ({
      ok: false,
      code: 'invalid',
      message: 'Bolt 99 is not on this 8-bolt ring.',
    }));
    await waitFor(() => expect(hook.result.current.status.ready).toBe(true));
    await act(() => hook.result.current.record(confirm));
    await waitFor(() =>
      expect(hook.result.current.status.error).toBe('Bolt 99 is not on this 8-bolt ring.'),
    );
    expect(hook.result.current.status.waiting).toBe(0);
  });

  it('one event the server refuses for good is set aside alone: the rest of the queue is saved, nothing retries', async () => {
    const at = '2026-01-01T09:00:00.000Z';
    const queued = [1, 99, 2].map((bolt) => ({
      type: 'bolt_confirmed' as const,
      payload: { pass: 1, bolt },
      clientId: crypto.randomUUID(),
      clientAt: at,
    }));
    await set(KEY, { pending: queued, saved: [] });
    const { action, hook } = setUp(async () => ({
      ok: true,
      data: {
        saved: 2,
        duplicates: 0,
        refused: [
          {
            index: 1,
            clientId: queued[1]!.clientId,
            message: 'Bolt 99 is not on this 24-bolt ring.',
            fieldErrors: { 'payload.bolt': ['No such bolt.'] },
          },
        ],
      },
    }));
    await waitFor(() =>
      expect(hook.result.current.status.error).toMatch(
        /^One confirmation was not saved and set aside: Bolt 99 is not on this 24-bolt ring\./,
      ),
    );
    expect(hook.result.current.status.waiting).toBe(0);
    expect(hook.result.current.events.map((e) => e.clientId)).toEqual([
      queued[0]!.clientId,
      queued[2]!.clientId,
    ]);
    await new Promise((r) => setTimeout(r, 50));
    expect(action).toHaveBeenCalledTimes(1);
    expect(await held()).toMatchObject({
      pending: [],
      saved: [
        expect.objectContaining({ clientId: queued[0]!.clientId }),
        expect.objectContaining({ clientId: queued[2]!.clientId }),
      ],
    });
  });

  it("a shared phone: Theo's waiting confirmations are never sent in Lena's session; they wait, labelled, until Theo signs in again", async () => {
    const ended = setUp(async () => ({
      ok: false,
      code: 'unauthenticated',
      message: 'Your session has ended. Sign in again.',
    }));
    await waitFor(() => expect(ended.hook.result.current.status.ready).toBe(true));
    await act(() => ended.hook.result.current.record(confirm));
    await waitFor(() => expect(ended.hook.result.current.status.signedOut).toBe(true));
    ended.hook.unmount();
    const theosEvent = (await held()).pending[0] as { clientId: string };

    const lena = setUp(async () => saved, LENA);
    await waitFor(() => expect(lena.hook.result.current.status.ready).toBe(true));
    expect(lena.hook.result.current.others).toEqual([{ ownerName: 'Theo Tech', waiting: 1 }]);
    expect(lena.hook.result.current.events).toEqual([]);
    await act(() => lena.hook.result.current.record(confirm));
    await waitFor(() => expect(lena.hook.result.current.status.waiting).toBe(0));
    const sentInLenasSession = lena.action.mock.calls.flatMap(([, input]) =>
      input.events.map((e) => e.clientId),
    );
    expect(sentInLenasSession).toHaveLength(1);
    expect(sentInLenasSession).not.toContain(theosEvent.clientId);
    lena.hook.unmount();

    const theo = setUp(async () => saved);
    // "0 waiting" means something only once the phone's outbox is read.
    await waitFor(() => expect(theo.hook.result.current.status.ready).toBe(true));
    await waitFor(() => expect(theo.hook.result.current.status.waiting).toBe(0));
    expect(theo.action).toHaveBeenCalledWith(null, {
      wheelId: WHEEL,
      events: [expect.objectContaining({ clientId: theosEvent.clientId })],
    });
  });

  it('events refused for good stay on the phone under "Needs attention" with the reason, until dismissed', async () => {
    const { hook } = setUp(async (_prev, input) => ({
      ok: true,
      data: {
        saved: 0,
        duplicates: 0,
        refused: [
          {
            index: 0,
            clientId: input.events[0]!.clientId,
            message: 'This wheel was submitted; its record is closed.',
            fieldErrors: {},
          },
        ],
      },
    }));
    await waitFor(() => expect(hook.result.current.status.ready).toBe(true));
    await act(() => hook.result.current.record(confirm));
    await waitFor(() =>
      expect(hook.result.current.attention).toEqual([
        {
          event: expect.objectContaining(confirm),
          reason: 'This wheel was submitted; its record is closed.',
        },
      ]),
    );
    // Written to IndexedDB right after the screen shows it.
    await waitFor(async () =>
      expect(await held()).toMatchObject({
        owner: THEO,
        attention: [
          expect.objectContaining({ reason: 'This wheel was submitted; its record is closed.' }),
        ],
      }),
    );
    await act(() => hook.result.current.dismiss());
    expect(hook.result.current.attention).toEqual([]);
    expect(await held()).toMatchObject({ attention: [] });
  });

  it("after a lead's send-back the phone drops its copy of the superseded events, keeping what still waits", async () => {
    const old = {
      type: 'bolt_confirmed' as const,
      payload: { pass: 1, bolt: 1 },
      clientId: crypto.randomUUID(),
      clientAt: '2026-01-01T09:00:00.000Z',
    };
    const waiting = { ...old, clientId: crypto.randomUUID(), clientAt: '2026-01-01T09:05:00.000Z' };
    await set(KEY, {
      owner: THEO,
      pending: [waiting],
      saved: [old],
      attention: [],
      generation: null,
    });
    const action = vi.fn<SaveEvents>(async () => saved);
    const hook = renderHook(() => useRunQueue(WHEEL, [], action, THEO, '2026-01-02T10:00:00.000Z'));
    await waitFor(() => expect(action).toHaveBeenCalledTimes(1));
    await waitFor(() => expect(hook.result.current.status.waiting).toBe(0));
    expect(hook.result.current.events.map((e) => e.clientId)).toEqual([waiting.clientId]);
    expect(await held()).toMatchObject({ generation: '2026-01-02T10:00:00.000Z' });
  });

  it('every event it makes names this phone: the same id each time, kept in the browser for the next session', async () => {
    localStorage.clear();
    const { action, hook } = setUp(async () => saved);
    await waitFor(() => expect(hook.result.current.status.ready).toBe(true));
    await act(() => hook.result.current.record(confirm));
    await act(() =>
      hook.result.current.record({ type: 'bolt_confirmed', payload: { pass: 1, bolt: 2 } }),
    );
    await waitFor(() => expect(hook.result.current.status.waiting).toBe(0));
    const sent = action.mock.calls.flatMap(([, input]) => input.events);
    const phone = localStorage.getItem('ringpass:device');
    expect(phone).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/);
    expect(sent.map((e) => e.deviceId)).toEqual([phone, phone]);
    // Beside the event's own id and time, not inside what the technician confirmed.
    expect(sent[0]!.payload).toEqual({ pass: 1, bolt: 1 });
  });
});
