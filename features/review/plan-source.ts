import {
  passPlan,
  tighteningSequence,
  type Pattern,
  type Pressure,
  type Torque,
} from '@/features/torque-plan';
import type { ReviewPlan, ReviewStep } from './types';

/** The spec as stored on the wheel's snapshot (taken when its run started). */
type Snapshot = {
  spec: {
    name: string;
    boltCount: number;
    maxBeadSeatPressure: Pressure;
    runningPressure: Pressure;
    finalTorque: Torque;
  };
  plan: {
    passes: {
      index: number;
      kind: 'staged' | 'check';
      fraction: number;
      target: Torque;
      order: number[];
    }[];
  };
  targetPressure: Pressure;
};

/** The live spec's columns, used only for a wheel whose run never started (no snapshot yet). */
type LiveSpec = {
  name: string;
  boltCount: number;
  patternKind: 'cross' | 'skip' | 'sequential';
  skipStep: number | null;
  finalTorque: number;
  torqueUnit: Torque['unit'];
  passFractions: number[];
  checkPass: boolean;
  maxBeadSeatPressure: number;
  pressureUnit: Pressure['unit'];
};

export type WheelBasis = {
  plan: ReviewPlan;
  specName: string;
  finalTorque: Torque;
  maxBeadSeat: Pressure;
  targetPressure: Pressure;
  /** Where the plan came from: the snapshot (what the technician was shown) or today's spec. */
  source: 'snapshot' | 'live_spec';
};

/**
 * What a wheel is judged against: its snapshot when the run started one, else the live spec
 * through the engine (the same sequence and passes the runner computes: start at bolt 1, the
 * check pass clockwise).
 */
export function wheelBasis(input: {
  snapshot: Snapshot | null;
  spec: LiveSpec;
  targetPressure: Pressure;
  steps: ReviewStep[];
}): WheelBasis {
  const { snapshot, spec, steps } = input;
  if (snapshot) {
    return {
      plan: { boltCount: snapshot.spec.boltCount, passes: snapshot.plan.passes, steps },
      specName: snapshot.spec.name,
      finalTorque: snapshot.spec.finalTorque,
      maxBeadSeat: snapshot.spec.maxBeadSeatPressure,
      targetPressure: snapshot.targetPressure,
      source: 'snapshot',
    };
  }
  const pattern: Pattern =
    spec.patternKind === 'skip'
      ? { kind: 'skip', step: spec.skipStep ?? 1 }
      : { kind: spec.patternKind };
  const staged = tighteningSequence(spec.boltCount, pattern);
  const check = tighteningSequence(spec.boltCount, { kind: 'sequential' });
  const finalTorque = { value: spec.finalTorque, unit: spec.torqueUnit };
  const passes = passPlan(finalTorque, spec.passFractions, { checkPass: spec.checkPass }).map(
    (p) => ({ ...p, order: p.kind === 'check' ? check : staged }),
  );
  return {
    plan: { boltCount: spec.boltCount, passes, steps },
    specName: spec.name,
    finalTorque,
    maxBeadSeat: { value: spec.maxBeadSeatPressure, unit: spec.pressureUnit },
    targetPressure: input.targetPressure,
    source: 'live_spec',
  };
}
