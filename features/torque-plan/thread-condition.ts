/**
 * How the ring bolts' threads must be when torqued. The same wrench setting clamps very differently
 * dry, oiled or with anti-seize (lubricant lowers friction, so more of the torque becomes clamp
 * load — common practice, no source), so the condition belongs with the torque in the spec, as the
 * wheel maker states it.
 */
export const THREAD_CONDITIONS = ['dry', 'oiled', 'anti_seize', 'thread_locker'] as const;
export type ThreadCondition = (typeof THREAD_CONDITIONS)[number];

export const THREAD_CONDITION_LABELS: Record<ThreadCondition, string> = {
  dry: 'Dry — clean threads, no lubricant',
  oiled: 'Oiled — light oil on the threads',
  anti_seize: 'Anti-seize on the threads',
  thread_locker: 'Thread locker on the threads',
};

/** What the runner says when the spec is silent: the technician must not guess. */
export const THREAD_CONDITION_UNSTATED =
  "Not stated in this spec: check the wheel maker's instructions before lubricating any bolt.";

export function threadConditionText(condition: ThreadCondition | null | undefined): string {
  return condition ? THREAD_CONDITION_LABELS[condition] : THREAD_CONDITION_UNSTATED;
}
