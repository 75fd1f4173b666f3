/**
 * Where bolt i of n sits: bolts are numbered clockwise from the first bolt past the valve notch,
 * which is at 12 o'clock, so bolt 1 sits half a pitch clockwise of the notch.
 */
export function boltPosition(i: number, n: number, radius: number) {
  const angle = ((i - 0.5) / n) * 2 * Math.PI;
  return { x: radius * Math.sin(angle), y: -radius * Math.cos(angle) };
}

export type BoltState = 'done' | 'next' | 'pending' | 'started' | 'not-started';

/** Words for a screen reader, e.g. "bolt 7, pass 2, done" or "bolt 3, next, 5th in order". */
export function boltLabel(
  bolt: number,
  state: BoltState,
  passLabel: string,
  step?: number,
): string {
  const ordinal = step ? `, ${ordinalOf(step)} in order` : '';
  switch (state) {
    case 'done':
      return `bolt ${bolt}, ${passLabel}, done`;
    case 'next':
      return `bolt ${bolt}, ${passLabel}, next${ordinal}`;
    case 'pending':
      return `bolt ${bolt}, ${passLabel}, to do${ordinal}`;
    case 'started':
      return `bolt ${bolt}, started by hand`;
    case 'not-started':
      return `bolt ${bolt}, not started yet`;
  }
}

function ordinalOf(n: number) {
  const s = ['th', 'st', 'nd', 'rd'];
  const v = n % 100;
  return `${n}${s[(v - 20) % 10] ?? s[v] ?? s[0]}`;
}
