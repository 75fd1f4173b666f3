import { planFromSnapshot } from '@/features/runner/snapshot';
import type { RunnerPlan } from '@/features/runner/state';
import type { PracticeSetup } from './types';

/**
 * The runner's plan for a simulated wheel: the whole procedure from dismount, without re-install
 * (there is no vehicle in practice). The runner page and the finish path read the same plan.
 */
export function practicePlan(setup: PracticeSetup): RunnerPlan {
  return planFromSnapshot(setup.snapshot, { dismount: true, reinstall: false });
}
