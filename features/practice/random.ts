/**
 * Small helpers over an injected random source (`() => number` in [0, 1)), so every drawn attempt
 * can be replayed in a test from its seed.
 */
export type Random = () => number;

/** A whole number from `lo` to `hi`, both included. */
export function int(random: Random, lo: number, hi: number): number {
  return lo + Math.floor(random() * (hi - lo + 1));
}

export function pick<T>(random: Random, list: readonly T[]): T {
  const item = list[Math.floor(random() * list.length)] ?? list[0];
  if (item === undefined) throw new Error('pick() needs a non-empty list.');
  return item;
}

export function chance(random: Random, p: number): boolean {
  return random() < p;
}

/** A version-4 UUID made from the random source (event schemas take wrench ids as UUIDs). */
export function uuidFrom(random: Random): string {
  const hex = Array.from({ length: 32 }, () => Math.floor(random() * 16).toString(16));
  hex[12] = '4';
  hex[16] = pick(random, ['8', '9', 'a', 'b']);
  const s = hex.join('');
  return `${s.slice(0, 8)}-${s.slice(8, 12)}-${s.slice(12, 16)}-${s.slice(16, 20)}-${s.slice(20)}`;
}

/** A seeded source for tests and replays (mulberry32: small, fast, well spread). */
export function seededRandom(seed: number): Random {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
