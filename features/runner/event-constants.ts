// The parts of the event contract the phone needs at run time, kept apart from the zod schemas in
// events.ts: the runner's first page load then carries no schema library (the server validates).

/**
 * The most check passes a wheel may have in all: the plan's one, then one more each time a bolt of
 * the check pass before turned (see `reduceRun`). Past this the wheel goes to a lead.
 */
export const MAX_CHECK_PASSES = 10;

/** What a technician can report about one bolt when they stop the wheel. */
export const BOLT_PROBLEMS = ['stripped', 'snapped', 'cross_threaded', 'spins', 'other'] as const;
export type BoltProblem = (typeof BOLT_PROBLEMS)[number];

const PROBLEM_WORDS: Record<BoltProblem, string> = {
  stripped: 'stripped thread',
  snapped: 'snapped head',
  cross_threaded: 'cross-threaded',
  spins: 'bolt spins',
  other: 'other problem',
};

/** The words a flagged bolt leaves on the wheel for the lead (the reducer and the save path agree on them). */
export function boltFlagReason(payload: {
  bolt: number;
  pass?: number | undefined;
  problem: BoltProblem;
  note?: string | undefined;
}): string {
  const where = payload.pass ? `pass ${payload.pass}` : 'hand-start';
  const note = payload.note?.trim();
  return `Bolt ${payload.bolt} (${where}): ${PROBLEM_WORDS[payload.problem]}${note ? ` — ${note}` : ''}`;
}
