import { describe, expect, it } from 'vitest';
import { pressureOffTarget } from '@/features/torque-plan';

describe('pressureOffTarget: "Pressure set" against the wheel’s target', () => {
  it('within 1 psi of a psi target is fine, the edge included', () => {
    expect(pressureOffTarget({ value: 14, unit: 'psi' }, { value: 14, unit: 'psi' })).toBeNull();
    expect(pressureOffTarget({ value: 15, unit: 'psi' }, { value: 14, unit: 'psi' })).toBeNull();
    expect(pressureOffTarget({ value: 13, unit: 'psi' }, { value: 14, unit: 'psi' })).toBeNull();
  });

  it('more than 1 psi off asks for a re-check, with the difference in psi and kPa (1 psi = 6.894 757 kPa, NIST SP 811 App. B)', () => {
    const off = pressureOffTarget({ value: 16, unit: 'psi' }, { value: 14, unit: 'psi' });
    expect(off!.psi).toBe(2);
    expect(off!.kPa).toBeCloseTo(13.7895, 3);
    expect(
      pressureOffTarget({ value: 12.9, unit: 'psi' }, { value: 14, unit: 'psi' })!.psi,
    ).toBeCloseTo(-1.1, 9);
  });

  it('a kPa target allows 7 kPa', () => {
    expect(pressureOffTarget({ value: 107, unit: 'kPa' }, { value: 100, unit: 'kPa' })).toBeNull();
    const off = pressureOffTarget({ value: 92.9, unit: 'kPa' }, { value: 100, unit: 'kPa' });
    expect(off!.kPa).toBeCloseTo(-7.1, 9);
    expect(off!.psi).toBeCloseTo(-7.1 / 6.894757, 6);
  });

  it('compares across units: 1 bar = 100 kPa (NIST SP 811 App. B) against a psi target', () => {
    // 1 bar = 14.5038 psi: 0.5038 psi over a 14 psi target... 1 bar vs 14 psi is within 1 psi.
    expect(pressureOffTarget({ value: 1, unit: 'bar' }, { value: 14, unit: 'psi' })).toBeNull();
    expect(
      pressureOffTarget({ value: 1.1, unit: 'bar' }, { value: 14, unit: 'psi' })!.psi,
    ).toBeCloseTo(15.954 - 14, 2);
  });
});
