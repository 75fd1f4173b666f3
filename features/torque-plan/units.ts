import configureMeasurements from 'convert-units';
import pressure, {
  type PressureSystems,
  type PressureUnits,
} from 'convert-units/definitions/pressure';
import torque, { type TorqueSystems, type TorqueUnits } from 'convert-units/definitions/torque';
import { assertFiniteNumber, TorquePlanError } from './errors';

/** The units the product works in, in the order pickers show them (schemas use these too). */
export const TORQUE_UNITS = ['lbf-ft', 'lbf-in', 'Nm'] as const;
export const PRESSURE_UNITS = ['psi', 'kPa', 'bar'] as const;

export type TorqueUnit = (typeof TORQUE_UNITS)[number];
export type PressureUnit = (typeof PRESSURE_UNITS)[number];
export type Torque = { value: number; unit: TorqueUnit };
export type Pressure = { value: number; unit: PressureUnit };

/** How the trade writes each unit on screen. */
export const UNIT_LABELS: Record<TorqueUnit | PressureUnit, string> = {
  'lbf-ft': 'ft-lb',
  'lbf-in': 'in-lb',
  Nm: 'N·m',
  psi: 'psi',
  kPa: 'kPa',
  bar: 'bar',
};

const convert = configureMeasurements<
  'torque' | 'pressure',
  TorqueSystems | PressureSystems,
  TorqueUnits | PressureUnits
>({ torque, pressure });

export function isTorqueUnit(unit: unknown): unit is TorqueUnit {
  return typeof unit === 'string' && (TORQUE_UNITS as readonly string[]).includes(unit);
}

export function isPressureUnit(unit: unknown): unit is PressureUnit {
  return typeof unit === 'string' && (PRESSURE_UNITS as readonly string[]).includes(unit);
}

export function assertTorqueUnit(unit: unknown, field = 'unit'): asserts unit is TorqueUnit {
  if (!isTorqueUnit(unit)) {
    throw new TorquePlanError(
      `Unknown torque unit "${String(unit)}". Use one of: ${TORQUE_UNITS.join(', ')}.`,
      field,
    );
  }
}

export function convertTorque(value: number, from: TorqueUnit, to: TorqueUnit): number {
  assertFiniteNumber(value, 'value', 'The torque');
  assertTorqueUnit(from, 'from');
  assertTorqueUnit(to, 'to');
  return from === to ? value : convert(value).from(from).to(to);
}

export function convertPressure(value: number, from: PressureUnit, to: PressureUnit): number {
  assertFiniteNumber(value, 'value', 'The pressure');
  for (const [field, unit] of [
    ['from', from],
    ['to', to],
  ] as const) {
    if (!isPressureUnit(unit)) {
      throw new TorquePlanError(
        `Unknown pressure unit "${String(unit)}". Use one of: ${PRESSURE_UNITS.join(', ')}.`,
        field,
      );
    }
  }
  return from === to ? value : convert(value).from(from).to(to);
}

/** A positive torque with a known unit, or a TorquePlanError naming the field. */
export function assertTorque(t: unknown, field = 'torque'): asserts t is Torque {
  const candidate = t as Partial<Torque> | null;
  if (!candidate || typeof candidate !== 'object')
    throw new TorquePlanError('A torque needs a value and a unit.', field);
  assertFiniteNumber(candidate.value, `${field}.value`, 'The torque');
  if (candidate.value <= 0)
    throw new TorquePlanError('The torque must be greater than zero.', `${field}.value`);
  assertTorqueUnit(candidate.unit, `${field}.unit`);
}

export function formatTorque(t: Torque, digits = 1): string {
  return `${Number(t.value.toFixed(digits))} ${UNIT_LABELS[t.unit]}`;
}
