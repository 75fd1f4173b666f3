import {
  chooseWrench,
  TORQUE_UNITS,
  UNIT_LABELS,
  convertTorque,
  type Torque,
  type TorqueUnit,
  type Wrench,
} from '@/features/torque-plan';
import { chance, int, pick, uuidFrom, type Random } from './random';
import type { PracticeWrench } from './types';

/** Whether every target has at least one wrench that suits it at the shop's floor (the engine decides). */
export function cribSuits(
  targets: readonly Torque[],
  wrenches: readonly Wrench[],
  minFractionOfMax: number,
): boolean {
  if (wrenches.length === 0) return false;
  try {
    return targets.every((t) => chooseWrench(t, wrenches, { minFractionOfMax }).ok);
  } catch {
    // A wrench the engine refuses (bad range, unknown unit) makes the crib unusable as it stands.
    return false;
  }
}

/** Graduations as click wrenches are commonly marked (common practice, no source). */
function graduationFor(unit: TorqueUnit, max: number): number {
  if (unit === 'lbf-in') return max <= 250 ? 1 : 5;
  return max <= 60 ? 0.5 : 1;
}

const niceStep = (unit: TorqueUnit) => (unit === 'lbf-in' ? 10 : 5);
const clean = (n: number) => Math.round(n * 1e6) / 1e6;

/**
 * A made-up wrench in `unit` that suits `target`: its maximum a round number so the target sits
 * between 35 % and 95 % of it, lowered to the target itself when the shop's floor is too high for
 * a round number (a floor of 0.99 leaves almost no room).
 */
function wrenchFor(
  random: Random,
  target: Torque,
  unit: TorqueUnit,
  floor: number,
): PracticeWrench {
  const t = convertTorque(target.value, target.unit, unit);
  const share = Math.max(floor + 0.02, 0.35) + random() * Math.max(0, 0.95 - Math.max(floor, 0.35));
  const step = niceStep(unit);
  const fits = (max: number) => max >= t && floor * max <= t;
  // A round maximum; else the target rounded up to a graduation; else (a floor near 1) the target itself.
  let max = Math.ceil(t / Math.min(share, 1) / step) * step;
  if (!fits(max)) max = clean(Math.ceil(t / graduationFor(unit, t)) * graduationFor(unit, t));
  if (!fits(max)) max = t;
  const fine = graduationFor(unit, max);
  // The lowest mark about a fifth of the maximum, never above the target itself.
  const min = clean(Math.min(Math.max(fine, Math.round((max * 0.2) / fine) * fine), t / 2));
  const graduation = Math.min(fine, clean(max - min));
  const kind = chance(random, 0.8) ? 'click' : pick(random, ['beam', 'dial', 'digital'] as const);
  return {
    id: uuidFrom(random),
    min,
    max,
    unit,
    graduation,
    kind,
    label: `${min}–${max} ${UNIT_LABELS[unit]} ${kind}`,
  };
}

/**
 * A random tool crib for a practice ring whose units all differ from the spec's (so the apprentice
 * converts), holding at least one suitable wrench for every pass at the shop's floor, and often a
 * wrench too big for the low passes: the trap a wrong pick falls into.
 */
export function drawCrib(
  random: Random,
  targets: readonly Torque[],
  specUnit: TorqueUnit,
  minFractionOfMax: number,
): PracticeWrench[] {
  const units = TORQUE_UNITS.filter((u) => u !== specUnit);
  const crib: PracticeWrench[] = [];
  const sorted = [...targets].sort(
    (a, b) => convertTorque(a.value, a.unit, 'Nm') - convertTorque(b.value, b.unit, 'Nm'),
  );
  for (const target of sorted) {
    if (cribSuits([target], crib, minFractionOfMax)) continue;
    crib.push(wrenchFor(random, target, pick(random, units), minFractionOfMax));
  }
  const final = sorted.at(-1);
  if (final && chance(random, 0.7)) {
    // Big enough that the first pass falls below its floor; still a real wrench for the final.
    const unit = pick(random, units);
    const t = convertTorque(final.value, final.unit, unit);
    const max = Math.ceil((t * int(random, 2, 4)) / niceStep(unit)) * niceStep(unit);
    const min = Math.floor((max * 0.2) / niceStep(unit)) * niceStep(unit);
    crib.push({
      id: uuidFrom(random),
      min,
      max,
      unit,
      graduation: graduationFor(unit, max),
      kind: 'click',
      label: `${min}–${max} ${UNIT_LABELS[unit]} click`,
    });
  }
  // Shuffled, so the right wrench is not always first on the list.
  for (let i = crib.length - 1; i > 0; i--) {
    const j = int(random, 0, i);
    [crib[i], crib[j]] = [crib[j]!, crib[i]!];
  }
  return crib;
}
