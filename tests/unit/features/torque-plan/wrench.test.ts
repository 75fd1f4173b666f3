import { describe, expect, it } from 'vitest';
import { chooseWrench, TorquePlanError, verifyReading, type Wrench } from '@/features/torque-plan';

const inLb: Wrench = {
  id: 'in-lb 20–200',
  min: 20,
  max: 200,
  unit: 'lbf-in',
  graduation: 1,
  kind: 'click',
};
const ftLb: Wrench = {
  id: 'ft-lb 5–80',
  min: 5,
  max: 80,
  unit: 'lbf-ft',
  graduation: 1,
  kind: 'click',
};
const nm: Wrench = { id: 'N·m 2–10', min: 2, max: 10, unit: 'Nm', graduation: 0.1, kind: 'click' };
/** ISO 6789 (2003 edition; secondary sources) calibrates click wrenches from 20 % of the maximum: the product's default floor. */
const iso = { minFractionOfMax: 0.2 };

describe('chooseWrench', () => {
  it('a 3.5 ft-lb pass (42 in-lb) goes to the 20–200 in-lb wrench, not the 5–80 ft-lb (common practice, no source)', () => {
    const choice = chooseWrench({ value: 3.5, unit: 'lbf-ft' }, [ftLb, inLb], iso);
    expect(choice).toMatchObject({
      ok: true,
      wrenchId: inLb.id,
      setting: { value: 42, unit: 'lbf-in' },
    });
  });

  it('prefers the wrench where the target is the largest fraction of its maximum', () => {
    const big: Wrench = {
      id: 'big',
      min: 10,
      max: 150,
      unit: 'lbf-ft',
      graduation: 1,
      kind: 'click',
    };
    const choice = chooseWrench({ value: 40, unit: 'lbf-ft' }, [big, ftLb], iso);
    expect(choice).toMatchObject({ ok: true, wrenchId: 'ft-lb 5–80', fractionOfMax: 0.5 });
  });

  it('refuses a target below the shop floor (20 % of maximum here) and says why', () => {
    const choice = chooseWrench({ value: 10, unit: 'lbf-ft' }, [{ ...ftLb, min: 1 }], iso);
    expect(choice.ok).toBe(false);
    if (!choice.ok)
      expect(choice.reason).toMatch(/below the shop's floor of 20 % of its maximum \(16 ft-lb\)/);
  });

  it('takes the shop floor as an option', () => {
    expect(chooseWrench({ value: 10, unit: 'lbf-ft' }, [ftLb], { minFractionOfMax: 0.1 }).ok).toBe(
      true,
    );
  });

  it('a floor of 0 leaves only the lowest mark: a 5–80 ft-lb wrench takes 8.4 and 12 ft-lb (under 16 ft-lb, its 20 % point), not 3.6', () => {
    for (const value of [3.6, 8.4, 12]) {
      expect(
        chooseWrench({ value, unit: 'lbf-ft' }, [ftLb], { minFractionOfMax: 0 }).ok,
        `${value} ft-lb`,
      ).toBe(value >= 5);
    }
    const below = chooseWrench({ value: 3.6, unit: 'lbf-ft' }, [ftLb], { minFractionOfMax: 0 });
    if (!below.ok) expect(below.reason).toMatch(/below its lowest mark 5 ft-lb/);
  });

  it('the floor is always given: no silent default', () => {
    expect(() => chooseWrench({ value: 10, unit: 'lbf-ft' }, [ftLb], {} as never)).toThrow(
      /The shop's floor must be a number/,
    );
    expect(() =>
      chooseWrench({ value: 10, unit: 'lbf-ft' }, [ftLb], { minFractionOfMax: 1 }),
    ).toThrow(/from 0 to below 1/);
    expect(() =>
      chooseWrench({ value: 10, unit: 'lbf-ft' }, [ftLb], { minFractionOfMax: -0.01 }),
    ).toThrow(/from 0 to below 1/);
  });

  it('explains each wrench when none suits', () => {
    const choice = chooseWrench({ value: 300, unit: 'lbf-ft' }, [ftLb, inLb], iso);
    expect(choice).toEqual({
      ok: false,
      reason: expect.stringMatching(/above its maximum 80 ft-lb.*above its maximum 200 in-lb/),
    });
  });

  it('names a wrench by its label when it has one', () => {
    const choice = chooseWrench(
      { value: 300, unit: 'lbf-ft' },
      [{ ...ftLb, id: 'b66bbd5e', label: 'Grey click' }],
      iso,
    );
    expect(choice).toEqual({
      ok: false,
      reason: expect.stringMatching(/Grey click: 300 ft-lb is above its maximum/),
    });
  });

  it('says so when the tool crib is empty', () => {
    expect(chooseWrench({ value: 10, unit: 'Nm' }, [], iso)).toEqual({
      ok: false,
      reason: expect.stringMatching(/tool crib is empty/),
    });
  });

  it('rounds the setting to the graduation and warns when that moves it beyond the tolerance', () => {
    const coarse: Wrench = {
      id: 'coarse',
      min: 10,
      max: 100,
      unit: 'lbf-ft',
      graduation: 5,
      kind: 'click',
    };
    const choice = chooseWrench({ value: 22, unit: 'lbf-ft' }, [coarse], iso);
    expect(choice).toMatchObject({ ok: true, setting: { value: 20, unit: 'lbf-ft' } });
    if (choice.ok) {
      expect(choice.roundingErrorPct).toBeCloseTo(-9.0909, 3);
      expect(choice.warnings.join(' ')).toMatch(/more than the wrench's ±4 % tolerance/);
    }
  });

  it('does not warn when rounding stays inside the tolerance', () => {
    const choice = chooseWrench({ value: 8.4, unit: 'lbf-ft' }, [{ ...inLb }], iso);
    expect(choice).toMatchObject({
      ok: true,
      setting: { value: 101, unit: 'lbf-in' },
      warnings: [],
    });
  });

  it('refuses a malformed wrench with a clear error', () => {
    expect(() => chooseWrench({ value: 10, unit: 'Nm' }, [{ ...nm, max: 1 }], iso)).toThrow(
      TorquePlanError,
    );
    expect(() =>
      chooseWrench({ value: 10, unit: 'Nm' }, [{ ...nm, unit: 'kgm' as never }], iso),
    ).toThrow(/Unknown torque unit/);
  });
});

describe('verifyReading: ISO 6789-1:2017 click wrenches, classes A, D, G (secondary sources)', () => {
  it('±4 % above 10 N·m maximum', () => {
    expect(
      verifyReading(ftLb, { value: 50, unit: 'lbf-ft' }, { value: 52, unit: 'lbf-ft' }),
    ).toEqual({
      withinTolerance: true,
      deviationPct: 4,
      tolerancePct: 4,
    });
    expect(
      verifyReading(ftLb, { value: 50, unit: 'lbf-ft' }, { value: 52.1, unit: 'lbf-ft' })
        .withinTolerance,
    ).toBe(false);
    expect(
      verifyReading(ftLb, { value: 50, unit: 'lbf-ft' }, { value: 47.9, unit: 'lbf-ft' })
        .withinTolerance,
    ).toBe(false);
  });

  it('±6 % for a maximum of 10 N·m or less', () => {
    expect(verifyReading(nm, { value: 5, unit: 'Nm' }, { value: 5.3, unit: 'Nm' })).toMatchObject({
      withinTolerance: true,
      tolerancePct: 6,
    });
    expect(
      verifyReading(nm, { value: 5, unit: 'Nm' }, { value: 5.31, unit: 'Nm' }).withinTolerance,
    ).toBe(false);
  });

  it('an 80 in-lb wrench (9.04 N·m) gets ±6 %; a 200 in-lb wrench (22.6 N·m) ±4 %', () => {
    expect(
      verifyReading(
        { ...inLb, max: 80 },
        { value: 40, unit: 'lbf-in' },
        { value: 42, unit: 'lbf-in' },
      ).tolerancePct,
    ).toBe(6);
    expect(
      verifyReading(inLb, { value: 100, unit: 'lbf-in' }, { value: 100, unit: 'lbf-in' })
        .tolerancePct,
    ).toBe(4);
  });

  it('compares across units', () => {
    const r = verifyReading(inLb, { value: 10, unit: 'Nm' }, { value: 88.5, unit: 'lbf-in' });
    expect(r.deviationPct).toBeCloseTo(((88.5 * 0.1129848 - 10) / 10) * 100, 3);
  });
});
