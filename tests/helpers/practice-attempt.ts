import { chooseWrench, handStartOrder, type Torque } from '@/features/torque-plan';
import { practicePlan } from '@/features/practice/plan';
import { setupFromSpec, type PracticeSpec } from '@/features/practice/surprise';
import type {
  PracticeEvent,
  PracticeLevel,
  PracticeSetup,
  PracticeWrench,
} from '@/features/practice/types';
import { seededRandom } from '@/features/practice/random';

/** A made-up 12-bolt ring at 30 ft-lb: passes of 9, 21 and 30 ft-lb, then a check pass at 30. */
export const PRACTICE_SPEC: PracticeSpec = {
  id: '5e1f0000-0000-4000-8000-00000000000a',
  name: 'Mesa 12 (practice)',
  boltCount: 12,
  boltThread: 'M8x1.25',
  finalTorque: 30,
  torqueUnit: 'lbf-ft',
  passFractions: [0.3, 0.7, 1],
  patternKind: 'cross',
  skipStep: null,
  checkPass: true,
  lugTorque: null,
  lugTorqueUnit: null,
  lugCount: null,
  maxBeadSeatPressure: 30,
  runningPressure: 12,
  pressureUnit: 'psi',
  makerReference: '',
  notes: '',
  threadCondition: 'dry',
  boltReuse: '',
};

/** 5–50 ft-lb (floor 10 ft-lb at 20 %) for passes 2–4; 20–200 in-lb for pass 1 (9 ft-lb = 108 in-lb). */
export const BIG: PracticeWrench = {
  id: 'a1b2c3d4-0000-4000-8000-0000000000b1',
  label: '5–50 ft-lb click',
  min: 5,
  max: 50,
  unit: 'lbf-ft',
  graduation: 0.5,
  kind: 'click',
};
export const SMALL: PracticeWrench = {
  id: 'a1b2c3d4-0000-4000-8000-0000000000b2',
  label: '20–200 in-lb click',
  min: 20,
  max: 200,
  unit: 'lbf-in',
  graduation: 1,
  kind: 'click',
};

export function practiceSetup(level: PracticeLevel): PracticeSetup {
  return setupFromSpec(PRACTICE_SPEC, {
    level,
    shopWrenches: [BIG, SMALL],
    minFractionOfMax: 0.2,
    random: seededRandom(1),
    now: new Date('2026-12-01T09:00:00Z'),
  });
}

type PassChoice = { wrenchId?: string; setting?: Torque; order?: number[] };

/**
 * The events of an attempt done right, 10 s apart from 09:00:10: every step with all its checks,
 * every bolt in order with the engine's wrench and setting. `passes` overrides a pass's wrench,
 * setting or order (1-based pass number); `checklist` overrides a step's ticked items; `until`
 * stops after that step.
 */
export function attemptEvents(
  setup: PracticeSetup,
  options: {
    passes?: Record<number, PassChoice>;
    checklist?: Record<string, string[]>;
    until?: string;
  } = {},
): PracticeEvent[] {
  const events: PracticeEvent[] = [];
  let n = 0;
  const next = () => {
    n += 1;
    return {
      clientId: `00000000-0000-4000-8000-${n.toString().padStart(12, '0')}`,
      clientAt: new Date(Date.parse('2026-12-01T09:00:00Z') + n * 10_000).toISOString(),
    };
  };
  for (const step of practicePlan(setup).steps) {
    if (step.id === 'submit') break;
    if (step.id === 'hand_start')
      for (const bolt of handStartOrder(setup.snapshot.spec.boltCount))
        events.push({ type: 'hand_started', payload: { bolt }, ...next() });
    if (step.id === 'torque')
      for (const pass of setup.snapshot.plan.passes) {
        const best = chooseWrench(pass.target, setup.wrenches, {
          minFractionOfMax: setup.minFractionOfMax,
        });
        if (!best.ok) throw new Error(best.reason);
        const choice = options.passes?.[pass.index] ?? {};
        const wrenchId = choice.wrenchId ?? best.wrenchId;
        const setting = choice.setting ?? best.setting;
        events.push({ type: 'wrench_chosen', payload: { pass: pass.index, wrenchId }, ...next() });
        for (const bolt of choice.order ?? pass.order)
          events.push({
            type: 'bolt_confirmed',
            payload: { pass: pass.index, bolt, wrenchId, setting, turned: false },
            ...next(),
          });
      }
    const checklist = options.checklist?.[step.id] ?? step.checklist.map((c) => c.id);
    const measurement =
      step.id === 'seat_bead'
        ? { value: 25, unit: 'psi' as const }
        : step.id === 'leak_check'
          ? { value: 12, unit: 'psi' as const }
          : undefined;
    events.push({
      type: 'step_done',
      payload: { step: step.id, checklist, measurement },
      ...next(),
    });
    if (step.id === options.until) break;
  }
  return events;
}

/** `order` with the bolts at places i and i+1 swapped. */
export const swapAt = (order: readonly number[], i: number) => {
  const out = [...order];
  [out[i], out[i + 1]] = [out[i + 1]!, out[i]!];
  return out;
};
