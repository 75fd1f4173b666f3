import { reduceRun } from '@/features/runner/state';
import { judgeSequence } from './judge-passes';
import { judgeWrenches } from './judge-wrench';
import { judgeSteps, secondsPerStep } from './judge-steps';
import { practicePlan } from './plan';
import { PART_LABELS, PART_MAX, type Finding, type PartKey } from './scoring-parts';
import type {
  PracticeEvent,
  PracticeMistake,
  PracticeResult,
  PracticeSetup,
  ScorePart,
} from './types';

/** Judges a finished (or abandoned) attempt from its events. Pure: same setup and events, same result. */
export function scoreAttempt(setup: PracticeSetup, events: PracticeEvent[]): PracticeResult {
  const plan = practicePlan(setup);
  const state = reduceRun(plan, events);
  const maxes = PART_MAX[setup.level];
  const findings: Finding[] = [
    ...judgeSequence(setup, plan, state, events),
    ...(maxes.wrench ? judgeWrenches(setup, state, events) : []),
    ...judgeSteps(setup, plan, state, events, maxes.completion ?? 0),
  ];

  const parts: ScorePart[] = [];
  const mistakes: PracticeMistake[] = [];
  const left: Partial<Record<PartKey, number>> = { ...maxes };
  for (const { part, ...mistake } of findings) {
    const remaining = left[part];
    if (remaining === undefined) continue;
    const points = Math.min(remaining, mistake.points);
    left[part] = remaining - points;
    mistakes.push({ ...mistake, points });
  }
  for (const key of Object.keys(PART_LABELS) as PartKey[]) {
    const max = maxes[key];
    if (max !== undefined) parts.push({ label: PART_LABELS[key], points: left[key] ?? 0, max });
  }

  return {
    version: 1,
    score: parts.reduce((sum, p) => sum + p.points, 0),
    parts,
    mistakes,
    secondsPerStep: secondsPerStep(setup, plan, state, events),
    passes: state.passes.map((p) => ({
      pass: p.index,
      done: [...p.confirmed],
      expected: [...p.order],
      unit: setup.snapshot.spec.finalTorque.unit,
    })),
  };
}
