import { passPlan, type PlannedPass } from './pass-plan';
import { tighteningSequence, type Pattern } from './sequence';
import type { Torque } from './units';
import { chooseWrench, type Wrench, type WrenchChoice } from './wrench';

export type TorquePlanInput = {
  boltCount: number;
  pattern: Pattern;
  start?: number;
  final: Torque;
  fractions?: readonly number[];
  checkPass?: boolean;
  wrenches: readonly Wrench[];
  /** The shop's wrench floor, a fraction of each wrench's maximum (0 to below 1). */
  minFractionOfMax: number;
};

export type TorquePlan = {
  boltCount: number;
  pattern: Pattern;
  sequence: number[];
  passes: (PlannedPass & { order: number[]; wrench: WrenchChoice })[];
};

/**
 * The whole plan for one wheel: the tightening order, each pass's target, and the wrench and
 * setting for it. Staged passes follow the pattern; the check pass goes round clockwise
 * (sequential), so no bolt is missed.
 */
export function planTorque(input: TorquePlanInput): TorquePlan {
  const sequence = tighteningSequence(input.boltCount, input.pattern, { start: input.start });
  const checkOrder = tighteningSequence(
    input.boltCount,
    { kind: 'sequential' },
    { start: input.start },
  );
  const passes = passPlan(input.final, input.fractions, { checkPass: input.checkPass }).map(
    (pass) => ({
      ...pass,
      order: pass.kind === 'check' ? checkOrder : sequence,
      wrench: chooseWrench(pass.target, input.wrenches, {
        minFractionOfMax: input.minFractionOfMax,
      }),
    }),
  );
  return { boltCount: input.boltCount, pattern: input.pattern, sequence, passes };
}
