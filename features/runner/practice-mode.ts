import type { ReactNode } from 'react';

/**
 * The runner in practice mode, handed in by features/practice (the runner never imports it): the
 * same steps, cautions and checklists on a simulated wheel. `guided` shows the sequence as on a
 * real wheel; `from_memory` hides the turn numbers and the next bolt, and the apprentice taps the
 * bolt they would do next (recorded even when wrong: the reducer lists it as an anomaly with the
 * bolt expected); `wrench_setup` has them pick the wrench and type its setting for each pass.
 */
export type RunnerPractice = {
  level: 'guided' | 'from_memory' | 'wrench_setup';
  /** Where the runner pulls the stored events from (the attempt's, never a wheel's). */
  eventsUrl: string;
  /** The way back in the header (the practice home). */
  back: { href: string; label: string };
  /** Practice's own Finish, shown at the end (and when the wheel stopped, or to end early). */
  finish: (info: { waiting: number; unfinished: string[]; early: boolean }) => ReactNode;
};

/** What the torque panel needs to know about practice. */
export type PassPractice = Pick<RunnerPractice, 'level'>;
