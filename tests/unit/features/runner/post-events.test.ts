import { afterEach, describe, expect, it, vi } from 'vitest';
import { postWheelEvents, readSaveAnswer } from '@/features/runner/api/post-events';
import { KeptForRetry, keepsAndRetries } from '@/features/runner/api/send-outcome';
import type { ClientEvent } from '@/features/runner/events';

// The handler's answers, read as the outbox acts on them: saved, refused for good, kept and retried.
const json = (status: number, body: unknown) => Response.json(body, { status });
const refusal = { index: 0, clientId: 'c1', message: 'Off the ring.', fieldErrors: {} };

describe('readSaveAnswer', () => {
  it('a 200 with data is saved, with its duplicates and per-event refusals', async () => {
    const data = { saved: 1, duplicates: 1, refused: [refusal] };
    expect(await readSaveAnswer(json(200, { data }), 3)).toEqual({ ok: true, data });
    const bare = { saved: 2, duplicates: 0 };
    expect(await readSaveAnswer(json(200, { data: bare }), 2)).toEqual({ ok: true, data: bare });
  });

  it('an error answer carries its code, message and fields', async () => {
    const answer = await readSaveAnswer(
      json(400, {
        error: { code: 'invalid', message: 'The body has errors.', fields: { events: ['Empty.'] } },
      }),
      1,
    );
    expect(answer).toEqual({
      ok: false,
      code: 'invalid',
      message: 'The body has errors.',
      fieldErrors: { events: ['Empty.'] },
    });
  });

  it('signed out, rate limited and our own failure are kept and retried; forbidden and not found are not', async () => {
    const codes = [
      [401, 'unauthenticated', true],
      [429, 'rate_limited', true],
      [500, 'internal', true],
      [403, 'forbidden', false],
      [404, 'not_found', false],
      [409, 'conflict', false],
    ] as const;
    for (const [status, code, kept] of codes) {
      const answer = await readSaveAnswer(json(status, { error: { code, message: 'm' } }), 1);
      expect(answer).toEqual({ ok: false, code, message: 'm' });
      if (!answer.ok) expect(keepsAndRetries(answer.code), code).toBe(kept);
    }
  });

  it('a refused Origin is kept and retried with its message, never set aside for good', async () => {
    const answer = readSaveAnswer(
      json(403, { error: { code: 'cross_origin', message: 'Cross-origin request refused.' } }),
      1,
    );
    await expect(answer).rejects.toBeInstanceOf(KeptForRetry);
    await expect(answer).rejects.toThrow('Cross-origin request refused.');
  });

  it('an answer that is not ours throws, so the send is retried with the events kept', async () => {
    const notOurs = [
      json(413, { error: { code: 'too_large', message: 'Over 256 kB.' } }),
      new Response('<html>Bad gateway</html>', { status: 502 }),
      json(200, { ok: true }),
      json(500, { error: 'boom' }),
      // A 200 whose data is not the handler's shape (a captive portal, a proxy): never "saved".
      json(200, { data: {} }),
      json(200, { data: { saved: '1', duplicates: 0 } }),
      json(200, { data: { saved: 1, duplicates: 0, refused: {} } }),
      json(200, { data: { saved: 1, duplicates: 0, refused: [{ index: 0 }] } }),
      json(200, { data: { saved: -1, duplicates: 0 } }),
    ];
    for (const res of notOurs)
      await expect(readSaveAnswer(res, 1)).rejects.toThrow(/without a result/);
  });

  it('a 200 that does not account for every event sent throws, so none is dropped unsaved', async () => {
    const short = [
      // Two sent, none saved, none a duplicate, none refused: the batch was not stored.
      { saved: 0, duplicates: 0 },
      { saved: 1, duplicates: 0, refused: [] },
      { saved: 2, duplicates: 1 },
      // A refusal of an event that was not in the batch.
      { saved: 1, duplicates: 0, refused: [{ ...refusal, index: 2 }] },
    ];
    for (const data of short)
      await expect(readSaveAnswer(json(200, { data }), 2)).rejects.toThrow(/without a result/);
    const whole = { saved: 1, duplicates: 0, refused: [{ ...refusal, index: 1 }] };
    expect(await readSaveAnswer(json(200, { data: whole }), 2)).toEqual({ ok: true, data: whole });
  });
});

describe('postWheelEvents', () => {
  afterEach(() => vi.unstubAllGlobals());

  it("posts the batch as JSON to the wheel's events address", async () => {
    const fetch = vi.fn(async () => json(200, { data: { saved: 1, duplicates: 0, refused: [] } }));
    vi.stubGlobal('fetch', fetch);
    const events = [{ type: 'bolt_confirmed', clientId: 'c1' }] as unknown as ClientEvent[];
    expect(await postWheelEvents(null, { wheelId: 'w-1', events })).toEqual({
      ok: true,
      data: { saved: 1, duplicates: 0, refused: [] },
    });
    expect(fetch).toHaveBeenCalledWith('/api/wheels/w-1/events', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ events }),
    });
  });

  it('a dropped network rejects, as the action call did', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))),
    );
    await expect(postWheelEvents(null, { wheelId: 'w-1', events: [] })).rejects.toThrow(
      'Failed to fetch',
    );
  });
});
