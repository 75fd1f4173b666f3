import { reduceRun, type RunnerPlan, type RunnerState } from '@/features/runner/state';
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
  return state.anomalies.map((a) => {
    const where = cap(passWords(setup, a.pass));
    const before = reduceRun(
      plan,
      events.filter((e) => e.clientAt < a.at),
    ).currentPass;
    const message =
      a.expected === null
        ? `${where}: bolt ${a.bolt} was tightened after every pass was finished.`
        : before === null || before === a.pass
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
