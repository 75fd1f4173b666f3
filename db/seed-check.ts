/**
 * The demo seed's self-check: the demo must teach the right thing, so every demo spec passes the
 * plausibility rules without a warning, and every pass of every demo spec has a suitable in-service
 * demo wrench at the shop's floor (else a demo job could never be finished). Runs the engine, which
 * is pure (no I/O), so the seed may import it (see the exception in eslint.config.mjs).
 */
import {
  checkPlausibility,
  chooseWrench,
  formatTorque,
  passPlan,
  tighteningSequence,
  type Pattern,
  type PressureUnit,
  type Torque,
  type TorqueUnit,
  type Wrench,
} from '@/features/torque-plan';

export type SeedSpec = {
  name: string;
  finalTorque: number;
  torqueUnit: TorqueUnit;
  passFractions: number[];
  checkPass: boolean;
  maxBeadSeatPressure: number;
  runningPressure: number;
  pressureUnit: PressureUnit;
  lugTorque?: number | null;
  lugTorqueUnit?: TorqueUnit | null;
};

export type SeedWrench = Omit<Wrench, 'id'> & {
  label: string;
  status?: 'in_service' | 'out_of_service' | 'retired';
};

/** What is wrong with the demo, one line each; empty when every demo job can be done safely. */
export function demoProblems(
  specs: readonly SeedSpec[],
  wrenches: readonly SeedWrench[],
  floorPercent: number,
): string[] {
  const problems: string[] = [];
  const crib: Wrench[] = wrenches
    .filter((w) => (w.status ?? 'in_service') === 'in_service')
    .map((w) => ({
      id: w.label,
      label: w.label,
      min: w.min,
      max: w.max,
      unit: w.unit,
      graduation: w.graduation,
      kind: w.kind,
    }));
  for (const spec of specs) {
    const { errors, warnings } = checkPlausibility({
      maxBeadSeatPressure: spec.maxBeadSeatPressure,
      runningPressure: spec.runningPressure,
      pressureUnit: spec.pressureUnit,
      finalTorque: spec.finalTorque,
      torqueUnit: spec.torqueUnit,
      fractions: spec.passFractions,
      lugTorque:
        spec.lugTorque && spec.lugTorqueUnit
          ? { value: spec.lugTorque, unit: spec.lugTorqueUnit }
          : null,
    });
    for (const issue of [...errors, ...warnings])
      problems.push(`"${spec.name}" ${issue.field}: ${issue.message}`);
    if (errors.length) continue;
    for (const pass of passPlan(
      { value: spec.finalTorque, unit: spec.torqueUnit },
      spec.passFractions,
      { checkPass: spec.checkPass },
    )) {
      const choice = chooseWrench(pass.target, crib, { minFractionOfMax: floorPercent / 100 });
      if (!choice.ok)
        problems.push(
          `"${spec.name}" pass ${pass.index} (${formatTorque(pass.target, 2)}) cannot be done: ${choice.reason}`,
        );
    }
  }
  return problems;
}

/** Fails the seed (and so its transaction) with every problem listed. */
export function assertDemoCompletable(
  specs: readonly SeedSpec[],
  wrenches: readonly SeedWrench[],
  floorPercent: number,
): void {
  const problems = demoProblems(specs, wrenches, floorPercent);
  if (problems.length) {
    throw new Error(
      `The demo seed failed its self-check (wrench floor ${floorPercent} %); nothing was seeded:\n- ${problems.join('\n- ')}`,
    );
  }
}

/** A demo wheel's plan as the runner computes it: the sequence, and per pass the target, the wrench (by its place in the crib) and its setting. */
export type DemoWheelPlan = {
  sequence: number[];
  check: number[];
  passes: {
    index: number;
    kind: 'staged' | 'check';
    fraction: number;
    target: Torque;
    wrench: number;
    setting: Torque;
  }[];
};

/**
 * The engine's plan for a demo spec with the demo crib at the shop's floor, so the demo's wheel
 * histories (db/seed-demo-work.ts) use the wrenches and settings the runner would have shown.
 */
export function demoWheelPlan(
  spec: SeedSpec & {
    boltCount: number;
    patternKind: 'cross' | 'skip' | 'sequential';
    skipStep?: number | null;
  },
  wrenches: readonly SeedWrench[],
  floorPercent: number,
): DemoWheelPlan {
  const pattern: Pattern =
    spec.patternKind === 'skip'
      ? { kind: 'skip', step: spec.skipStep ?? 1 }
      : { kind: spec.patternKind };
  const crib: Wrench[] = wrenches.flatMap((w, i) =>
    (w.status ?? 'in_service') === 'in_service'
      ? [
          {
            id: String(i),
            min: w.min,
            max: w.max,
            unit: w.unit,
            graduation: w.graduation,
            kind: w.kind,
          },
        ]
      : [],
  );
  const passes = passPlan({ value: spec.finalTorque, unit: spec.torqueUnit }, spec.passFractions, {
    checkPass: spec.checkPass,
  }).map((p) => {
    const choice = chooseWrench(p.target, crib, { minFractionOfMax: floorPercent / 100 });
    if (!choice.ok) throw new Error(`"${spec.name}" pass ${p.index}: ${choice.reason}`);
    return { ...p, wrench: Number(choice.wrenchId), setting: choice.setting };
  });
  return {
    sequence: tighteningSequence(spec.boltCount, pattern),
    check: tighteningSequence(spec.boltCount, { kind: 'sequential' }),
    passes,
  };
}
