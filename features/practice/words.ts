import { convertTorque, formatTorque, UNIT_LABELS, type Torque } from '@/features/torque-plan';
import { plannedPassOf } from '@/features/runner/state';
import type { PracticeSetup, PracticeWrench } from './types';

// Torque words name both units wherever a value was converted. Factors through the engine
// (convert-units; NIST SP 811 App. B: 1 ft·lbf = 1.355 818 N·m, 1 ft = 12 in).
const OTHER = { 'lbf-ft': 'Nm', 'lbf-in': 'lbf-ft', Nm: 'lbf-ft' } as const;
export const torqueWords = (t: Torque) =>
  `${formatTorque(t)} (${formatTorque({ value: convertTorque(t.value, t.unit, OTHER[t.unit]), unit: OTHER[t.unit] })})`;
export const inUnit = (t: Torque, unit: Torque['unit']): Torque => ({
  value: convertTorque(t.value, t.unit, unit),
  unit,
});
export const rangeOf = (w: PracticeWrench) => `${w.min}–${w.max} ${UNIT_LABELS[w.unit]}`;

/** "pass 2 (70 %, 21 ft-lb)" / "check pass 4 (30 ft-lb)". */
export function passWords(setup: PracticeSetup, index: number): string {
  const planned = plannedPassOf(setup.snapshot.plan.passes, index);
  if (!planned) return `pass ${index}`;
  const target = formatTorque(planned.target);
  return planned.kind === 'check'
    ? `check pass ${index} (${target})`
    : `pass ${index} (${Math.round(planned.fraction * 100)} %, ${target})`;
}

/** The sentence's first letter in capitals. */
export const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
