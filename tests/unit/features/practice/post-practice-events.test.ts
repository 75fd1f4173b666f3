import { afterEach, describe, expect, it, vi } from 'vitest';
import { postPracticeEvents } from '@/features/practice/api/post-practice-events';
import type { ClientEvent } from '@/features/runner/events';

const json = (status: number, body: unknown) => Response.json(body, { status });
const events = [{ type: 'hand_started', clientId: 'c1' }] as unknown as ClientEvent[];

// Practice's outbox sends to the attempt's route and reads the answer as a real wheel's does.
describe('postPracticeEvents', () => {
  afterEach(() => vi.unstubAllGlobals());

  it("posts the batch as JSON to the attempt's events address, never a wheel's", async () => {
    const fetch = vi.fn(async () => json(200, { data: { saved: 1, duplicates: 0, refused: [] } }));
    vi.stubGlobal('fetch', fetch);
    expect(await postPracticeEvents(null, { wheelId: 'a-1', events })).toEqual({
      ok: true,
      data: { saved: 1, duplicates: 0, refused: [] },
    });
    expect(fetch).toHaveBeenCalledWith('/api/practice/attempts/a-1/events', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ events }),
    });
  });

  it('a refusal comes back with its code; an answer of another shape throws (kept, retried)', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => json(404, { error: { code: 'not_found', message: 'No such attempt.' } })),
    );
    expect(await postPracticeEvents(null, { wheelId: 'a-1', events })).toEqual({
      ok: false,
      code: 'not_found',
      message: 'No such attempt.',
    });
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => json(200, { data: {} })),
    );
    await expect(postPracticeEvents(null, { wheelId: 'a-1', events })).rejects.toThrow(
      /without a result/,
    );
  });
});
