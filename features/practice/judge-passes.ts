import { orderEvents, type RunnerPlan, type RunnerState } from '@/features/runner/state';
import { POINTS, type Finding } from './scoring-parts';
import type { PracticeEvent, PracticeSetup } from './types';
import { cap, passWords } from './words';

/**
 * Every bolt tightened out of the pass's order: which bolt, and the one that was due. Whether the
 * bolt jumped ahead within its pass or into the next pass is read from the run as it stood just
 * before that bolt.
 */
export function judgeSequence(
  setup: PracticeSetup,
  plan: RunnerPlan,
  state: RunnerState,
  events: readonly PracticeEvent[],
): Finding[] {
  const unfinished = earlierUnfinished(plan, events);
  return state.anomalies.map((a) => {
    const where = cap(passWords(setup, a.pass));
    const before = unfinished.get(`${a.at}|${a.pass}|${a.bolt}`) ?? null;
    const message =
      a.expected === null
        ? `${where}: bolt ${a.bolt} was tightened after every pass was finished.`
        : before === null
          ? `${where}: bolt ${a.bolt} was tightened when bolt ${a.expected} was next. Out of order the ring draws down unevenly and the bolts done first lose torque.`
          : `${where}: bolt ${a.bolt} was tightened before ${passWords(setup, before)} was finished (bolt ${a.expected} was next). Finish each pass all the way round first.`;
    return {
      part: 'sequence' as const,
      kind: 'bolt_out_of_sequence' as const,
      step: 'torque',
      pass: a.pass,
      bolt: a.bolt,
      expected: a.expected === null ? null : `bolt ${a.expected}`,
      message,
      points: POINTS.outOfSequence,
    };
  });
}

/**
 * For each confirmation, the first earlier pass still unfinished when it was made (null when none),
 * keyed "time|pass|bolt" as the reducer's anomalies are. One walk in the reducer's order: a bolt
 * counts once per pass, an undone bolt no longer counts.
 */
function earlierUnfinished(
  plan: RunnerPlan,
  events: readonly PracticeEvent[],
): Map<string, number | null> {
  const confirmed = new Map<number, Set<number>>();
  const out = new Map<string, number | null>();
  const seen = new Set<string>();
  for (const e of orderEvents(events)) {
    if (seen.has(e.clientId)) continue;
    seen.add(e.clientId);
    if (e.type !== 'bolt_confirmed' && e.type !== 'bolt_undone') continue;
    const { pass, bolt } = e.payload;
    const done = confirmed.get(pass) ?? new Set<number>();
    confirmed.set(pass, done);
    if (e.type === 'bolt_undone') {
      done.delete(bolt);
      continue;
    }
    let open: number | null = null;
    for (let p = 1; p < pass && open === null; p++)
      if ((confirmed.get(p)?.size ?? 0) < plan.boltCount) open = p;
    const key = `${e.clientAt}|${pass}|${bolt}`;
    if (!out.has(key)) out.set(key, open);
    done.add(bolt);
  }
  return out;
}
