/**
 * TEMPORARY stand-in for the practice-score engineer's `surprise.ts` (`setupFromSpec`,
 * `drawSurpriseSetup`) and `scoring.ts` (`scoreAttempt`), with their agreed signatures, so the
 * data path and the pages can be built and tested before those land. Deleted once they do.
 */
import type { WheelSpecRow } from '@/db/schema';
import { takeSnapshot } from '@/features/runner/snapshot';
import { reduceRun } from '@/features/runner/state';
import { practicePlan } from './plan';
import type {
  PracticeEvent,
  PracticeLevel,
  PracticeResult,
  PracticeSetup,
  PracticeWrench,
} from './types';

type SpecFields = Parameters<typeof takeSnapshot>[0];
type SetupInput = {
  level: PracticeLevel;
  shopWrenches: PracticeWrench[];
  minFractionOfMax: number;
  random: () => number;
};

export function setupFromSpec(spec: SpecFields, input: SetupInput): PracticeSetup {
  const snapshot = takeSnapshot(
    spec,
    { targetPressure: spec.runningPressure, pressureUnit: spec.pressureUnit },
    new Date(),
  );
  return {
    version: 1,
    level: input.level,
    source: 'spec',
    snapshot,
    wheel: {
      position: input.random() < 0.5 ? 'LF' : 'RR',
      tireSize: '30x10-14',
      directional: input.random() < 0.5,
      targetPressure: spec.runningPressure,
      pressureUnit: spec.pressureUnit,
    },
    wrenches: input.shopWrenches,
    minFractionOfMax: input.minFractionOfMax,
  };
}

export function drawSurpriseSetup(
  random: () => number,
  input: { level: PracticeLevel; shopWrenches: PracticeWrench[]; minFractionOfMax: number },
): PracticeSetup {
  const spec: SpecFields & Pick<WheelSpecRow, 'runningPressure'> = {
    id: '00000000-0000-4000-8000-000000000000',
    name: 'Surprise ring',
    boltCount: 12 + 4 * Math.floor(random() * 3),
    boltThread: 'M8x1.25',
    finalTorque: 18,
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
    threadCondition: null,
    boltReuse: '',
  };
  const wrenches: PracticeWrench[] = [
    {
      id: '00000000-0000-4000-8000-000000000001',
      label: '40–200 in-lb click',
      min: 40,
      max: 200,
      unit: 'lbf-in',
      graduation: 1,
      kind: 'click',
    },
    {
      id: '00000000-0000-4000-8000-000000000002',
      label: '10–50 ft-lb click',
      min: 10,
      max: 50,
      unit: 'lbf-ft',
      graduation: 0.5,
      kind: 'click',
    },
  ];
  return { ...setupFromSpec(spec, { ...input, random }), source: 'surprise', wrenches };
}

export function scoreAttempt(setup: PracticeSetup, events: PracticeEvent[]): PracticeResult {
  const state = reduceRun(practicePlan(setup), events);
  const points = Math.min(100, state.anomalies.length * 5);
  return {
    version: 1,
    score: 100 - points,
    parts: [{ label: 'Sequence', points: 100 - points, max: 100 }],
    mistakes: state.anomalies.map((a) => ({
      kind: 'bolt_out_of_sequence' as const,
      step: 'torque',
      pass: a.pass,
      bolt: a.bolt,
      expected: a.expected ? `bolt ${a.expected}` : null,
      message: `Bolt ${a.bolt} was tightened where bolt ${a.expected ?? '?'} was due.`,
      points: 5,
    })),
    secondsPerStep: {},
    passes: state.passes.map((p) => ({
      pass: p.index,
      done: p.confirmed,
      expected: p.order,
      unit: setup.snapshot.spec.finalTorque.unit,
    })),
  };
}
