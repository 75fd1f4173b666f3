import type { PracticeLevel, PracticeMistake } from './types';

/**
 * How an attempt's score out of 100 is made up. Each part starts at its maximum and each mistake
 * takes its points off that part, never below zero (a mistake past that takes nothing more and
 * says 0). The level decides which parts count:
 *
 * | part                 | guided | from memory | wrench setup |
 * |----------------------|--------|-------------|--------------|
 * | sequence             | 40     | 60          | 40           |
 * | wrench and setting   | —      | —           | 30           |
 * | cautions and checks  | 40     | 25          | 20           |
 * | completion           | 20     | 15          | 10           |
 *
 * Guided shows the sequence, so its sequence part is for following it; from memory weighs it most.
 * Only wrench setup asks for the wrench and its setting, so only it judges them. Points per
 * mistake: a bolt out of sequence 5; a wrong wrench 10 and a wrong setting 10 per pass, a unit
 * mistake 15 (a setting off by a factor of 12 or 1.36 is the worst slip at the wrench); a skipped
 * safety check 5 and a bead seated past its limit 10; any other skipped check 2; completion is
 * shared out evenly over the steps, and each unfinished step takes its share.
 */
export const POINTS = {
  outOfSequence: 5,
  wrongWrench: 10,
  wrongSetting: 10,
  unitMistake: 15,
  skippedSafetyCheck: 5,
  beadPastLimit: 10,
  skippedCheck: 2,
} as const;

export type PartKey = 'sequence' | 'wrench' | 'checks' | 'completion';

export const PART_LABELS: Record<PartKey, string> = {
  sequence: 'Sequence',
  wrench: 'Wrench and setting',
  checks: 'Cautions and checks',
  completion: 'Completion',
};

export const PART_MAX: Record<PracticeLevel, Partial<Record<PartKey, number>>> = {
  guided: { sequence: 40, checks: 40, completion: 20 },
  from_memory: { sequence: 60, checks: 25, completion: 15 },
  wrench_setup: { sequence: 40, wrench: 30, checks: 20, completion: 10 },
};

/** A mistake before the part's cap is applied: the points it would take. */
export type Finding = PracticeMistake & { part: PartKey };
