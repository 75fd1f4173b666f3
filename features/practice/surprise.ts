import type { WheelSnapshot } from '@/db/schema';
import {
  checkPlausibility,
  convertPressure,
  convertTorque,
  PRESSURE_UNITS,
  THREAD_CONDITIONS,
  TORQUE_UNITS,
  WHEEL_POSITIONS,
  type PressureUnit,
  type TorqueUnit,
} from '@/features/torque-plan';
import { takeSnapshot } from '@/features/runner/snapshot';
import { cribSuits, drawCrib } from './crib';
import { chance, int, pick, uuidFrom, type Random } from './random';
import type { PracticeLevel, PracticeSetup, PracticeWrench } from './types';

/** The spec fields `takeSnapshot` reads: a shop's spec row, or a made-up one. */
export type PracticeSpec = Parameters<typeof takeSnapshot>[0];

type SetupInput = {
  level: PracticeLevel;
  /** The shop's in-service wrenches (out-of-service ones are never offered, even in practice). */
  shopWrenches: PracticeWrench[];
  /** The shop's wrench floor, a fraction of a wrench's maximum. */
  minFractionOfMax: number;
  /** When the attempt starts (the snapshot's time); now by default. */
  now?: Date;
};

/**
 * Staged pass plans a shop might use: ASME PCC-1 (from memory) rounds of 20–30 %, 50–70 %, 100 %;
 * some repeat the first lap at the same target (common practice, no source).
 */
const FRACTION_PLANS: readonly (readonly number[])[] = [
  [0.3, 0.7, 1],
  [0.3, 0.3, 0.7, 1],
  [0.3, 0.7, 0.7, 1],
  [0.25, 0.5, 1],
  [0.2, 0.5, 0.75, 1],
  [0.3, 0.6, 1],
  [0.5, 1],
];
const THREADS = ['M8x1.25', 'M10x1.25', '5/16-18', '3/8-16'] as const;

/** A final torque of 8–35 ft-lb (inside the engine's ring-bolt range), written as the trade writes it in `unit`. */
function drawTorque(random: Random, unit: TorqueUnit): number {
  const ftLb = int(random, 8, 35);
  const value = convertTorque(ftLb, 'lbf-ft', unit);
  return unit === 'lbf-in' ? Math.round(value / 5) * 5 : Math.round(value);
}

/**
 * Side-by-side pressures in psi (running 8–20, bead-seating limit 20–40 and at most 3× running:
 * common practice, no source), written in `unit`; the limit is rounded down so it never crosses 40 psi.
 */
function drawPressures(random: Random, unit: PressureUnit) {
  const runPsi = int(random, 8, 20);
  const seatPsi = int(random, Math.max(runPsi + 5, 20), Math.min(40, 3 * runPsi));
  const step = unit === 'bar' ? 0.05 : 1;
  const down = (psi: number) =>
    Math.round(Math.floor(convertPressure(psi, 'psi', unit) / step) * step * 100) / 100;
  const near = (psi: number) =>
    Math.round(Math.round(convertPressure(psi, 'psi', unit) / step) * step * 100) / 100;
  return { running: near(runPsi), seat: down(seatPsi) };
}

function drawSpec(random: Random): PracticeSpec {
  const boltCount = int(random, 12, 40);
  const kind = chance(random, 0.1) ? 'sequential' : pick(random, ['cross', 'skip'] as const);
  // Skip steps that divide the bolt count (laps close early) and steps that do not, half each.
  const divisors = Array.from({ length: boltCount - 2 }, (_, i) => i + 2).filter(
    (k) => k <= boltCount / 2 && boltCount % k === 0,
  );
  const others = Array.from({ length: boltCount - 2 }, (_, i) => i + 2).filter(
    (k) => k <= boltCount / 2 && boltCount % k !== 0,
  );
  const skipStep =
    kind === 'skip'
      ? pick(random, chance(random, 0.5) && divisors.length ? divisors : others)
      : null;
  const torqueUnit = pick(random, TORQUE_UNITS);
  const pressureUnit = pick(random, PRESSURE_UNITS);
  const { running, seat } = drawPressures(random, pressureUnit);
  const lugUnit = pick(random, TORQUE_UNITS);
  return {
    id: uuidFrom(random),
    name: `Surprise ring: ${boltCount} bolts`,
    boltCount,
    boltThread: pick(random, THREADS),
    finalTorque: drawTorque(random, torqueUnit),
    torqueUnit,
    passFractions: [...pick(random, FRACTION_PLANS)],
    patternKind: kind,
    skipStep,
    checkPass: true,
    lugTorque: Math.round(convertTorque(int(random, 40, 80), 'lbf-ft', lugUnit)),
    lugTorqueUnit: lugUnit,
    lugCount: pick(random, [4, 5]),
    maxBeadSeatPressure: seat,
    runningPressure: running,
    pressureUnit,
    makerReference: 'Practice ring (made up): no maker',
    notes: 'A made-up ring for practice. On a real wheel the maker’s spec comes first.',
    threadCondition: pick(random, [...THREAD_CONDITIONS, null]),
    boltReuse: '',
  };
}

const accepted = (spec: PracticeSpec) => {
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
  return errors.length === 0 && warnings.length === 0;
};

function drawWheel(random: Random, spec: PracticeSpec): PracticeSetup['wheel'] {
  const rim = int(random, 12, 15);
  const diameter = int(random, 26, 35);
  const width = pick(random, [8, 9, 10, 11, 12]);
  return {
    position: pick(random, WHEEL_POSITIONS),
    tireSize: `${diameter}x${width}${chance(random, 0.5) ? 'R' : '-'}${rim}`,
    directional: chance(random, 0.4),
    targetPressure: spec.runningPressure,
    pressureUnit: spec.pressureUnit,
  };
}

/** The shop's crib when it suits every pass at the floor; else a random crib in the other units that does. */
function wrenchesFor(random: Random, snapshot: WheelSnapshot, input: SetupInput): PracticeWrench[] {
  const targets = snapshot.plan.passes.map((p) => p.target);
  if (cribSuits(targets, input.shopWrenches, input.minFractionOfMax)) return input.shopWrenches;
  return drawCrib(random, targets, snapshot.spec.finalTorque.unit, input.minFractionOfMax);
}

/** A setup for one attempt on the given spec (a shop's spec, or a drawn one). */
export function setupFromSpec(
  spec: PracticeSpec,
  input: SetupInput & { random: Random },
  source: PracticeSetup['source'] = 'spec',
): PracticeSetup {
  const wheel = drawWheel(input.random, spec);
  const snapshot = takeSnapshot(spec, wheel, input.now ?? new Date());
  return {
    version: 1,
    level: input.level,
    source,
    snapshot,
    wheel,
    wrenches: wrenchesFor(input.random, snapshot, input),
    minFractionOfMax: input.minFractionOfMax,
  };
}

/**
 * "Surprise me": a random ring of 12 to 40 bolts in any pattern, torque and pressure unit, that the
 * engine accepts (plausibility without errors or warnings), with wrenches for every pass.
 */
export function drawSurpriseSetup(random: Random, input: SetupInput): PracticeSetup {
  let spec = drawSpec(random);
  // Rounding into another unit can land a value just past a limit: draw again (rarely needed).
  for (let i = 0; i < 20 && !accepted(spec); i++) spec = drawSpec(random);
  if (!accepted(spec))
    spec = {
      ...spec,
      finalTorque: 20,
      torqueUnit: 'lbf-ft',
      maxBeadSeatPressure: 30,
      runningPressure: 12,
      pressureUnit: 'psi',
    };
  return setupFromSpec(spec, { ...input, random }, 'surprise');
}
