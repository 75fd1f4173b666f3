/**
 * Main-thread time of each tap from a Chrome trace, in the thread's own CPU time (`tdur`), which
 * a busy machine does not stretch as it stretches wall time: from the tap's pointerdown to the
 * first frame committed after its click, each trace event's self time, grouped.
 */
type TraceEvent = {
  name: string;
  ph: string;
  ts: number;
  dur?: number;
  tdur?: number;
  pid: number;
  tid: number;
  args?: { data?: { type?: string } };
};

const GROUPS: Record<string, string[]> = {
  script: [
    'FunctionCall',
    'EventDispatch',
    'RunMicrotasks',
    'TimerFire',
    'FireAnimationFrame',
    'V8.HandleInterrupts',
    'V8.BytecodeBudgetInterrupt',
  ],
  style: ['UpdateLayoutTree', 'ScheduleStyleRecalculation'],
  layout: ['Layout'],
  prepaint: ['PrePaint'],
  paint: ['Paint', 'Layerize', 'Commit'],
};

export function tapThreadTimes(events: TraceEvent[]) {
  const isClick = (e: TraceEvent) => e.name === 'EventDispatch' && e.args?.data?.type === 'click';
  // The page's main thread: the one that dispatched the clicks.
  const main = events.find(isClick);
  if (!main) return null;
  const xs = events
    .filter((e) => e.ph === 'X' && e.pid === main.pid && e.tid === main.tid)
    .sort((a, b) => a.ts - b.ts || (b.dur ?? 0) - (a.dur ?? 0));
  // Self thread time: an event's own less its children's.
  const self = new Map<TraceEvent, number>();
  const stack: TraceEvent[] = [];
  for (const e of xs) {
    while (stack.length && stack.at(-1)!.ts + (stack.at(-1)!.dur ?? 0) <= e.ts) stack.pop();
    const own = e.tdur ?? e.dur ?? 0;
    self.set(e, own);
    const parent = stack.at(-1);
    if (parent) self.set(parent, self.get(parent)! - own);
    stack.push(e);
  }
  const downs = xs.filter(
    (e) => e.name === 'EventDispatch' && e.args?.data?.type === 'pointerdown',
  );
  const commits = xs.filter((e) => e.name === 'Commit').map((e) => e.ts);
  return xs.filter(isClick).flatMap((click) => {
    const from =
      downs.filter((d) => d.ts <= click.ts && click.ts - d.ts < 300_000).at(-1)?.ts ?? click.ts;
    const to = commits.find((t) => t > click.ts + (click.dur ?? 0));
    if (to === undefined) return [];
    const inTap = xs.filter((e) => e.ts >= from && e.ts < to);
    const ms = (names: string[]) =>
      inTap.filter((e) => names.includes(e.name)).reduce((sum, e) => sum + self.get(e)!, 0) / 1000;
    const row: Record<string, number> = {};
    for (const [group, names] of Object.entries(GROUPS)) row[group] = ms(names);
    row.all = inTap.reduce((sum, e) => sum + self.get(e)!, 0) / 1000;
    return [row];
  });
}
