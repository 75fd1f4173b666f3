import { clean } from './errors';
import { convertPressure, type Pressure } from './units';

/**
 * How far a set pressure may be from the wheel's target before the runner asks for a re-check:
 * 1 psi, or 7 kPa for a target in kPa or bar (common practice, no source). 1 psi = 6.894 757 kPa
 * (NIST SP 811, App. B), so the two are nearly the same band, each a round number in its unit.
 */
export const PRESSURE_TOLERANCE = { psi: 1, kPa: 7 } as const;

export type PressureOff = { psi: number; kPa: number };

/**
 * The difference `measured − target` in psi and in kPa (negative = under target) when it is more
 * than the tolerance in the target's unit, else null. Pure; the leak-check step calls it with the
 * technician's "Pressure set" and the wheel's target.
 */
export function pressureOffTarget(measured: Pressure, target: Pressure): PressureOff | null {
  const inPsi = target.unit === 'psi';
  const diff = clean(
    convertPressure(measured.value, measured.unit, inPsi ? 'psi' : 'kPa') -
      convertPressure(target.value, target.unit, inPsi ? 'psi' : 'kPa'),
  );
  const limit = inPsi ? PRESSURE_TOLERANCE.psi : PRESSURE_TOLERANCE.kPa;
  if (Math.abs(diff) <= limit + 1e-9) return null;
  return inPsi
    ? { psi: diff, kPa: clean(convertPressure(diff, 'psi', 'kPa')) }
    : { psi: clean(convertPressure(diff, 'kPa', 'psi')), kPa: diff };
}
