import { UNIT_LABELS, type PressureUnit, type TorqueUnit } from '@/features/torque-plan';

/** The <option>s of a unit picker, written as the trade writes them (ft-lb, N·m, psi). */
export function UnitOptions({ units }: { units: readonly (TorqueUnit | PressureUnit)[] }) {
  return units.map((unit) => (
    <option key={unit} value={unit}>
      {UNIT_LABELS[unit]}
    </option>
  ));
}
