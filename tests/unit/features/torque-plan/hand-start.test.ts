import { describe, expect, it } from 'vitest';
import { handStartOrder, tighteningSequence } from '@/features/torque-plan';

const opposite = (b: number, n: number) => ((b - 1 + n / 2) % n) + 1;

describe('handStartOrder: first bolt past the valve notch, then the opposite one, then the quarters', () => {
  for (const n of [4, 8, 12, 16, 20, 32, 6]) {
    it(`${n} bolts: every bolt exactly once, starting at bolt 1${n % 2 === 0 ? ' then its opposite' : ''}`, () => {
      const order = handStartOrder(n);
      expect(order).toHaveLength(n);
      expect([...order].sort((a, b) => a - b)).toEqual(Array.from({ length: n }, (_, i) => i + 1));
      expect(order[0]).toBe(1);
      expect(order[1]).toBe(opposite(1, n));
    });
  }

  it('the quarters come third and fourth where 4 divides the count (8 bolts: 1, 5, 3, 7)', () => {
    // ASME PCC-1 legacy cross pattern, 8 bolts (from memory, as in PUBLISHED_CROSS).
    expect(handStartOrder(8).slice(0, 4)).toEqual([1, 5, 3, 7]);
    expect(handStartOrder(32).slice(0, 4)).toEqual([1, 17, 9, 25]);
  });

  it('6 bolts (not a multiple of 4) follow the cross generalisation: 1, 4, then the nearest quarters', () => {
    expect(handStartOrder(6)).toEqual(tighteningSequence(6, { kind: 'cross' }));
    expect(handStartOrder(6).slice(0, 2)).toEqual([1, 4]);
  });

  it('a later start turns the whole order round the circle', () => {
    expect(handStartOrder(8, 3)).toEqual([3, 7, 5, 1, 4, 8, 6, 2]);
  });

  it('refuses a count off the engine’s range', () => {
    expect(() => handStartOrder(3)).toThrow(/bolt count/);
  });
});
