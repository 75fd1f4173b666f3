import type { WheelPosition, WheelSnapshot } from '@/db/schema';
import type { PressureUnit, TorqueUnit, Wrench } from '@/features/torque-plan';
import type { ClientEvent } from '@/features/runner/events';

/**
 * The contract between practice's parts: the attempt's setup (fixed when it starts, stored in
 * `practice_attempts.setup`), the events (the runner's own `ClientEvent`s, stored in
 * `practice_events`) and the scoring result (stored in `practice_attempts.result`).
 */
export const PRACTICE_LEVELS = ['guided', 'from_memory', 'wrench_setup'] as const;
export type PracticeLevel = (typeof PRACTICE_LEVELS)[number];

/** A wrench on offer in an attempt: the engine's shape plus what people call it. */
export type PracticeWrench = Wrench & { label: string };

export type PracticeSetup = {
  version: 1;
  level: PracticeLevel;
  source: 'spec' | 'surprise';
  /** The simulated wheel in the runner's snapshot shape: the spec's numbers and the pass plan. */
  snapshot: WheelSnapshot;
  /** A made-up wheel for the runner's header and steps. */
  wheel: {
    position: WheelPosition;
    tireSize: string;
    directional: boolean;
    targetPressure: number;
    pressureUnit: PressureUnit;
  };
  /** The wrenches on offer: the shop's in-service crib, or a random one whose units differ from the spec's. */
  wrenches: PracticeWrench[];
  /** The shop's wrench floor (fraction of a wrench's maximum) when the attempt started. */
  minFractionOfMax: number;
};

export type MistakeKind =
  | 'bolt_out_of_sequence'
  | 'wrong_wrench'
  | 'wrong_setting'
  | 'unit_mistake'
  | 'skipped_caution'
  | 'skipped_check'
  | 'unfinished';

/** One mistake, in trade words, with where it happened and what was expected. */
export type PracticeMistake = {
  kind: MistakeKind;
  /** The runner step id (`STEP_IDS`) or null for the attempt as a whole. */
  step: string | null;
  pass: number | null;
  bolt: number | null;
  /** E.g. "bolt 7", "the 20–200 in-lb wrench at 45 in-lb". */
  expected: string | null;
  /** A sentence a master technician would say, e.g. "40 in-lb is below the 20–200 in-lb wrench's floor". */
  message: string;
  /** Points this mistake took off. */
  points: number;
};

/** How the score out of 100 is made up: each part's points of its maximum. */
export type ScorePart = { label: string; points: number; max: number };

export type PracticeResult = {
  version: 1;
  score: number;
  parts: ScorePart[];
  mistakes: PracticeMistake[];
  /** Seconds spent on each step, by step id, from the events' times. */
  secondsPerStep: Record<string, number>;
  /** Per pass, the bolt order done and the order expected, for the side-by-side bolt circles. */
  passes: { pass: number; done: number[]; expected: number[]; unit: TorqueUnit }[];
};

/**
 * What the scoring reads from the events, by level: from memory, each tap is a `bolt_confirmed` of
 * the bolt tapped, right or wrong (the reducer lists the wrong ones as anomalies); wrench setup,
 * the pick is a `wrench_chosen` for the pass and the typed setting travels as `setting` on each
 * `bolt_confirmed` of that pass (the number dialled, in the wrench's unit). Step checklists are
 * judged from the ticked items on the `step_done` the reducer counted.
 */
export type PracticeEvent = ClientEvent;
