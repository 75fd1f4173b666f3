import { describe, expect, it } from 'vitest';
import { newEventId } from '@/features/runner/event-id';
import { clientEventSchema } from '@/features/runner/events';

describe('newEventId', () => {
  it('lays out RFC 9562 §5.7 (UUIDv7): 48-bit ms timestamp, version 7, variant 10', () => {
    // Check value from RFC 9562 Appendix A.6 ("Example of a UUIDv7 Value"): Tuesday, February 22,
    // 2022 2:22:22.00 PM GMT-05:00 = 0x017F22E279B0 ms, rand_a 0xCC3, rand_b 0x18C4DC0C0C07398F.
    const randomBits = (b: Uint8Array) => {
      b.set([0, 0, 0, 0, 0, 0, 0x0c, 0xc3, 0x18, 0xc4, 0xdc, 0x0c, 0x0c, 0x07, 0x39, 0x8f]);
      return b;
    };
    expect(newEventId(0x017f22e279b0, randomBits)).toBe('017f22e2-79b0-7cc3-98c4-dc0c0c07398f');
  });

  it('overwrites the version and variant bits whatever the random source gives', () => {
    const ones = (b: Uint8Array) => b.fill(0xff);
    expect(newEventId(0, ones)).toBe('00000000-0000-7fff-bfff-ffffffffffff');
  });

  it('sorts by time: a later millisecond gives a larger id (as text and as PostgreSQL compares uuids)', () => {
    const t = Date.UTC(2026, 11, 2, 10, 0, 0);
    const ids = [t, t + 1, t + 1000, t + 86_400_000].map((ms) => newEventId(ms));
    expect([...ids].sort()).toEqual(ids);
    expect(
      ids.every((id) =>
        /^[0-9a-f]{8}-[0-9a-f]{4}-7[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/.test(id),
      ),
    ).toBe(true);
    expect(new Set(Array.from({ length: 1000 }, () => newEventId(t))).size).toBe(1000);
  });

  it('is taken by the event schema, as an old phone’s v4 id still is', () => {
    const event = (clientId: string) => ({
      clientId,
      clientAt: '2026-12-02T10:00:00.000Z',
      type: 'step_done',
      payload: { step: 'safety', checklist: [] },
    });
    expect(clientEventSchema.safeParse(event(newEventId())).success).toBe(true);
    expect(clientEventSchema.safeParse(event(crypto.randomUUID())).success).toBe(true);
  });
});
