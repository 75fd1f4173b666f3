import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  convertPressure,
  convertTorque,
  TorquePlanError,
  type PressureUnit,
  type TorqueUnit,
} from '@/features/torque-plan';

describe('torque units (NIST SP 811 Appendix B)', () => {
  it('1 ft·lbf = 1.355 818 N·m', () =>
    expect(convertTorque(1, 'lbf-ft', 'Nm')).toBeCloseTo(1.355818, 6));
  it('1 in·lbf = 0.112 984 8 N·m', () =>
    expect(convertTorque(1, 'lbf-in', 'Nm')).toBeCloseTo(0.1129848, 7));
  it('1 ft = 12 in, so 1 ft·lbf = 12 in·lbf', () =>
    expect(convertTorque(1, 'lbf-ft', 'lbf-in')).toBeCloseTo(12, 9));
  it('3.5 ft-lb is 42 in-lb', () =>
    expect(convertTorque(3.5, 'lbf-ft', 'lbf-in')).toBeCloseTo(42, 9));

  it('round-trips between any two units', () => {
    const unit = fc.constantFrom<TorqueUnit>('lbf-ft', 'lbf-in', 'Nm');
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 5000, noNaN: true }), unit, unit, (v, a, b) => {
        expect(convertTorque(convertTorque(v, a, b), b, a)).toBeCloseTo(v, 6);
      }),
    );
  });

  it('refuses an unknown unit', () => {
    expect(() => convertTorque(1, 'kgf-m' as TorqueUnit, 'Nm')).toThrow(TorquePlanError);
    expect(() => convertTorque(1, 'kgf-m' as TorqueUnit, 'Nm')).toThrow(/lbf-ft, lbf-in, Nm/);
  });
});

describe('pressure units', () => {
  // NIST SP 811 Appendix B: 1 psi = 6.894 757 kPa. convert-units' own factor differs in the 7th
  // significant digit (6.894 760), well inside a tire gauge's resolution.
  it('1 psi = 6.894 757 kPa (NIST SP 811)', () =>
    expect(convertPressure(1, 'psi', 'kPa')).toBeCloseTo(6.894757, 5));
  it('1 bar = 100 kPa (SI definition of the bar)', () =>
    expect(convertPressure(1, 'bar', 'kPa')).toBeCloseTo(100, 9));
  it('round-trips', () => {
    const unit = fc.constantFrom<PressureUnit>('psi', 'kPa', 'bar');
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 1000, noNaN: true }), unit, unit, (v, a, b) => {
        expect(convertPressure(convertPressure(v, a, b), b, a)).toBeCloseTo(v, 6);
      }),
    );
  });
  it('refuses an unknown unit', () =>
    expect(() => convertPressure(1, 'atm' as PressureUnit, 'psi')).toThrow(/psi, kPa, bar/));
});
