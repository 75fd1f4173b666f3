import { TorquePlanError } from './errors';

export type Pattern = { kind: 'cross' } | { kind: 'skip'; step: number } | { kind: 'sequential' };

export const MIN_BOLTS = 4;
export const MAX_BOLTS = 64;

/**
 * ASME PCC-1 legacy cross-pattern rows (from memory, matched by secondary copies): groups of
 * four bolts 90° apart, b, b+N/2, b+N/4, b+3N/4, whose starting bolts follow the table.
 * Only rows we could match are kept; every other N uses `spreadCross` below. Secondary copies
 * of the 20-bolt row disagree on the order of its groups; this one (starts 1, 3, 5, 2, 4) is the
 * one we recall, and it is also what `spreadCross` gives.
 */
export const PUBLISHED_CROSS: Readonly<Record<number, readonly number[]>> = {
  4: [1, 3, 2, 4],
  8: [1, 5, 3, 7, 2, 6, 4, 8],
  12: [1, 7, 4, 10, 2, 8, 5, 11, 3, 9, 6, 12],
  16: [1, 9, 5, 13, 3, 11, 7, 15, 2, 10, 6, 14, 4, 12, 8, 16],
  20: [1, 11, 6, 16, 3, 13, 8, 18, 5, 15, 10, 20, 2, 12, 7, 17, 4, 14, 9, 19],
  24: [1, 13, 7, 19, 4, 16, 10, 22, 2, 14, 8, 20, 5, 17, 11, 23, 3, 15, 9, 21, 6, 18, 12, 24],
};

function assertInteger(value: unknown, field: string, label: string): asserts value is number {
  if (typeof value !== 'number' || !Number.isInteger(value)) {
    throw new TorquePlanError(`${label} must be a whole number.`, field);
  }
}

export function assertBoltCount(n: unknown): asserts n is number {
  assertInteger(n, 'boltCount', 'The bolt count');
  if (n < MIN_BOLTS || n > MAX_BOLTS) {
    throw new TorquePlanError(
      `The bolt count must be from ${MIN_BOLTS} to ${MAX_BOLTS}; got ${n}.`,
      'boltCount',
    );
  }
}

/** Bolt b moved on by `by` positions clockwise, kept in 1..n. */
const wrap = (b: number, by: number, n: number) => ((((b - 1 + by) % n) + n) % n) + 1;

/**
 * Every `step`-th bolt from `start`; when the lap comes back to a bolt already done, the next lap
 * starts on the bolt after the previous lap's start.
 */
function skipOrder(n: number, step: number, start: number): number[] {
  const done = new Set<number>();
  const order: number[] = [];
  let lapStart = start;
  let bolt = start;
  while (order.length < n) {
    order.push(bolt);
    done.add(bolt);
    if (order.length === n) break;
    const next = wrap(bolt, step, n);
    if (!done.has(next)) {
      bolt = next;
      continue;
    }
    do lapStart = wrap(lapStart, 1, n);
    while (done.has(lapStart));
    bolt = lapStart;
  }
  return order;
}

/**
 * Our generalisation where the table has no row (N ≥ 28, and N not divisible by 4):
 * - q = ⌈N/4⌉ groups; the groups' starting bolts 1..q are taken every ⌊q/2⌋-th (skip order), so
 *   each group starts about 45° from the one before. This rule reproduces every row above.
 * - Each group aims at its start and the points ½, ¼ and ¾ of the way round from it, taking the
 *   nearest bolt not yet done (ties go to the lower number). When 4 divides N these are exactly
 *   b, b+N/2, b+N/4, b+3N/4; otherwise they are the nearest bolts, and every bolt is still
 *   visited exactly once because each aim takes some bolt while any is left.
 */
export function spreadCross(n: number): number[] {
  const q = Math.ceil(n / 4);
  const starts = q === 1 ? [1] : skipOrder(q, Math.max(1, Math.floor(q / 2)), 1);
  const done = new Set<number>();
  const order: number[] = [];
  const distance = (bolt: number, aim: number) => {
    const d = Math.abs(bolt - aim) % n;
    return Math.min(d, n - d);
  };
  for (const s of starts) {
    for (const fraction of [0, 1 / 2, 1 / 4, 3 / 4]) {
      if (order.length === n) break;
      const aim = s + fraction * n;
      let best = 0;
      for (let b = 1; b <= n; b++) {
        if (done.has(b)) continue;
        if (best === 0 || distance(b, aim) < distance(best, aim) - 1e-9) best = b;
      }
      order.push(best);
      done.add(best);
    }
  }
  return order;
}

function crossOrder(n: number): number[] {
  return [...(PUBLISHED_CROSS[n] ?? spreadCross(n))];
}

/**
 * The tightening order for a bolt circle of `boltCount` bolts, numbered 1..N clockwise from the
 * first bolt past the valve notch. The sequence begins at `start` (default 1): a cross pattern is
 * turned round the circle so that its first bolt is `start`.
 */
export function tighteningSequence(
  boltCount: number,
  pattern: Pattern,
  options: { start?: number } = {},
): number[] {
  assertBoltCount(boltCount);
  const start = options.start ?? 1;
  assertInteger(start, 'start', 'The starting bolt');
  if (start < 1 || start > boltCount) {
    throw new TorquePlanError(
      `The starting bolt must be from 1 to ${boltCount}; got ${start}.`,
      'start',
    );
  }
  switch (pattern?.kind) {
    case 'cross':
      return crossOrder(boltCount).map((b) => wrap(b, start - 1, boltCount));
    case 'skip': {
      assertInteger(pattern.step, 'pattern.step', 'The skip step');
      if (pattern.step < 1 || pattern.step >= boltCount) {
        throw new TorquePlanError(
          `The skip step must be from 1 to ${boltCount - 1} for ${boltCount} bolts; got ${pattern.step}.`,
          'pattern.step',
        );
      }
      return skipOrder(boltCount, pattern.step, start);
    }
    case 'sequential':
      return Array.from({ length: boltCount }, (_, i) => wrap(start, i, boltCount));
    default:
      throw new TorquePlanError(
        'The pattern must be cross, skip (with a step) or sequential.',
        'pattern',
      );
  }
}

/**
 * The order to start the bolts by hand: the first bolt past the valve notch (`start`, default 1),
 * then the one opposite, then the quarters — the cross pattern's spread (the published rows, else
 * `spreadCross` for any N), so the ring is drawn down evenly. Every bolt appears exactly once.
 */
export function handStartOrder(boltCount: number, start = 1): number[] {
  return tighteningSequence(boltCount, { kind: 'cross' }, { start });
}
