import type { WheelSnapshot, WheelSpecRow } from '@/db/schema';
import { passPlan, tighteningSequence, type Pattern } from '@/features/torque-plan';
import type { RunnerPlan } from './state';
import { stepsFor } from './steps';

type SpecFields = Pick<
  WheelSpecRow,
  | 'id'
  | 'name'
  | 'boltCount'
  | 'boltThread'
  | 'finalTorque'
  | 'torqueUnit'
  | 'passFractions'
  | 'patternKind'
  | 'skipStep'
  | 'checkPass'
  | 'lugTorque'
  | 'lugTorqueUnit'
  | 'lugCount'
  | 'maxBeadSeatPressure'
  | 'runningPressure'
  | 'pressureUnit'
  | 'makerReference'
  | 'notes'
  | 'threadCondition'
  | 'boltReuse'
>;
type WheelFields = {
  targetPressure: number;
  pressureUnit: WheelSnapshot['targetPressure']['unit'];
};

/**
 * What the technician is told to do, frozen when the wheel's run starts: the spec's numbers with
 * their units, the tightening sequence and every pass with its target. Pure; the save path stores
 * it on the wheel with the first event.
 */
export function takeSnapshot(spec: SpecFields, wheel: WheelFields, now: Date): WheelSnapshot {
  const pattern: Pattern =
    spec.patternKind === 'skip'
      ? { kind: 'skip', step: spec.skipStep ?? 1 }
      : { kind: spec.patternKind };
  const sequence = tighteningSequence(spec.boltCount, pattern);
  const check = tighteningSequence(spec.boltCount, { kind: 'sequential' });
  const passes = passPlan({ value: spec.finalTorque, unit: spec.torqueUnit }, spec.passFractions, {
    checkPass: spec.checkPass,
  });
  return {
    version: 1,
    takenAt: now.toISOString(),
    spec: {
      id: spec.id,
      name: spec.name,
      boltCount: spec.boltCount,
      boltThread: spec.boltThread,
      pattern: {
        kind: spec.patternKind,
        step: spec.patternKind === 'skip' ? (spec.skipStep ?? 1) : null,
      },
      passFractions: [...spec.passFractions],
      checkPass: spec.checkPass,
      finalTorque: { value: spec.finalTorque, unit: spec.torqueUnit },
      maxBeadSeatPressure: { value: spec.maxBeadSeatPressure, unit: spec.pressureUnit },
      runningPressure: { value: spec.runningPressure, unit: spec.pressureUnit },
      lugTorque:
        spec.lugTorque && spec.lugTorqueUnit
          ? { value: spec.lugTorque, unit: spec.lugTorqueUnit }
          : null,
      lugCount: spec.lugCount,
      makerReference: spec.makerReference,
      notes: spec.notes,
      threadCondition: spec.threadCondition,
      boltReuse: spec.boltReuse,
    },
    plan: {
      sequence,
      passes: passes.map((p) => ({
        index: p.index,
        kind: p.kind,
        fraction: p.fraction,
        target: p.target,
        order: p.kind === 'check' ? check : sequence,
      })),
    },
    targetPressure: { value: wheel.targetPressure, unit: wheel.pressureUnit },
  };
}

/** The runner's plan from a snapshot: the steps follow the job (dismount, reinstall), the rest the snapshot. */
export function planFromSnapshot(
  snapshot: WheelSnapshot,
  job: { dismount: boolean; reinstall: boolean },
): RunnerPlan {
  return {
    steps: stepsFor(job),
    boltCount: snapshot.spec.boltCount,
    passes: snapshot.plan.passes.map((p) => ({ index: p.index, kind: p.kind, order: p.order })),
  };
}
