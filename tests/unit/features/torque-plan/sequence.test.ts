import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  PUBLISHED_CROSS,
  spreadCross,
  tighteningSequence,
  TorquePlanError,
  type Pattern,
} from '@/features/torque-plan';

const boltCount = fc.integer({ min: 4, max: 64 });
const patternFor = (n: number) =>
  fc.oneof(
    fc.constant<Pattern>({ kind: 'cross' }),
    fc.constant<Pattern>({ kind: 'sequential' }),
    fc.integer({ min: 1, max: n - 1 }).map<Pattern>((step) => ({ kind: 'skip', step })),
  );
const case_ = boltCount.chain((n) =>
  fc.record({ n: fc.constant(n), pattern: patternFor(n), start: fc.integer({ min: 1, max: n }) }),
);

describe('tighteningSequence: every bolt once', () => {
  it('is a permutation of 1..N that begins at the chosen start, for every pattern and N', () => {
    fc.assert(
      fc.property(case_, ({ n, pattern, start }) => {
        const seq = tighteningSequence(n, pattern, { start });
        expect(seq[0]).toBe(start);
        expect([...seq].sort((a, b) => a - b)).toEqual(Array.from({ length: n }, (_, i) => i + 1));
      }),
      { numRuns: 500 },
    );
  });
});

describe('cross pattern', () => {
  // ASME PCC-1 legacy cross-pattern sequences (from memory, matched by secondary copies).
  it.each([
    [4, '1-3-2-4'],
    [8, '1-5-3-7-2-6-4-8'],
    [12, '1-7-4-10-2-8-5-11-3-9-6-12'],
    [16, '1-9-5-13-3-11-7-15-2-10-6-14-4-12-8-16'],
    // Beyond 16 (from memory; secondary copies agree on 24 and disagree among themselves on 20).
    [20, '1-11-6-16-3-13-8-18-5-15-10-20-2-12-7-17-4-14-9-19'],
    [24, '1-13-7-19-4-16-10-22-2-14-8-20-5-17-11-23-3-15-9-21-6-18-12-24'],
  ])('%i bolts follow the published legacy table: %s', (n, expected) => {
    expect(tighteningSequence(n, { kind: 'cross' }).join('-')).toBe(expected);
  });

  it('makes groups of four 90° apart (b, b+N/2, b+N/4, b+3N/4) whenever 4 divides N', () => {
    for (let n = 4; n <= 64; n += 4) {
      const seq = tighteningSequence(n, { kind: 'cross' });
      for (let g = 0; g < n; g += 4) {
        const b = seq[g]!;
        const at = (k: number) => ((b - 1 + k) % n) + 1;
        expect(seq.slice(g, g + 4)).toEqual([b, at(n / 2), at(n / 4), at((3 * n) / 4)]);
      }
    }
  });

  it('uses a generalisation that reproduces every table row it replaces', () => {
    for (const [n, row] of Object.entries(PUBLISHED_CROSS))
      expect(spreadCross(Number(n))).toEqual(row);
  });

  it('follows each bolt with the one nearest opposite it, also when 4 does not divide N', () => {
    for (const n of [5, 6, 7, 9, 10, 14, 18, 30, 62]) {
      const seq = tighteningSequence(n, { kind: 'cross' });
      const gap = Math.abs(seq[1]! - seq[0]!);
      expect(Math.min(gap, n - gap)).toBe(Math.floor(n / 2));
    }
  });

  it('turns the whole pattern round when started elsewhere', () => {
    expect(tighteningSequence(8, { kind: 'cross' }, { start: 3 })).toEqual([
      3, 7, 5, 1, 4, 8, 6, 2,
    ]);
  });
});

describe('skip pattern', () => {
  it('20 bolts, every fifth bolt: 1-6-11-16, 2-7-12-17, … (common practice, no source)', () => {
    expect(tighteningSequence(20, { kind: 'skip', step: 5 })).toEqual([
      1, 6, 11, 16, 2, 7, 12, 17, 3, 8, 13, 18, 4, 9, 14, 19, 5, 10, 15, 20,
    ]);
  });

  it('moves k bolts on, or starts the next lap on the bolt after the last lap start', () => {
    fc.assert(
      fc.property(
        boltCount.chain((n) =>
          fc.tuple(
            fc.constant(n),
            fc.integer({ min: 1, max: n - 1 }),
            fc.integer({ min: 1, max: n }),
          ),
        ),
        ([n, step, start]) => {
          const seq = tighteningSequence(n, { kind: 'skip', step }, { start });
          let lapStart = start;
          for (let i = 1; i < n; i++) {
            const prev = seq[i - 1]!;
            const stepped = ((prev - 1 + step) % n) + 1;
            if (!seq.slice(0, i).includes(stepped)) expect(seq[i]).toBe(stepped);
            else {
              lapStart = (lapStart % n) + 1;
              expect(seq[i]).toBe(lapStart);
            }
          }
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('sequential pattern', () => {
  it('goes round clockwise from the start', () => {
    expect(tighteningSequence(6, { kind: 'sequential' }, { start: 5 })).toEqual([5, 6, 1, 2, 3, 4]);
  });
});

describe('refuses nonsense with a clear error', () => {
  it.each<[string, () => unknown, RegExp]>([
    ['3 bolts', () => tighteningSequence(3, { kind: 'cross' }), /from 4 to 64/],
    ['65 bolts', () => tighteningSequence(65, { kind: 'cross' }), /from 4 to 64/],
    ['8.5 bolts', () => tighteningSequence(8.5, { kind: 'cross' }), /whole number/],
    [
      'step 0',
      () => tighteningSequence(8, { kind: 'skip', step: 0 }),
      /skip step must be from 1 to 7/,
    ],
    [
      'step N',
      () => tighteningSequence(8, { kind: 'skip', step: 8 }),
      /skip step must be from 1 to 7/,
    ],
    [
      'start 0',
      () => tighteningSequence(8, { kind: 'cross' }, { start: 0 }),
      /starting bolt must be from 1 to 8/,
    ],
    ['start N+1', () => tighteningSequence(8, { kind: 'cross' }, { start: 9 }), /starting bolt/],
    [
      'unknown pattern',
      () => tighteningSequence(8, { kind: 'zigzag' } as unknown as Pattern),
      /cross, skip/,
    ],
  ])('%s', (_, call, message) => {
    expect(call).toThrow(TorquePlanError);
    expect(call).toThrow(message);
  });
});
