import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { passPlan, TorquePlanError, type Torque } from '@/features/torque-plan';

describe('passPlan', () => {
  it('defaults to 30 %, 70 %, 100 % and a check pass at 100 %', () => {
    expect(passPlan({ value: 20, unit: 'Nm' })).toEqual([
      { index: 1, kind: 'staged', fraction: 0.3, target: { value: 6, unit: 'Nm' } },
      { index: 2, kind: 'staged', fraction: 0.7, target: { value: 14, unit: 'Nm' } },
      { index: 3, kind: 'staged', fraction: 1, target: { value: 20, unit: 'Nm' } },
      { index: 4, kind: 'check', fraction: 1, target: { value: 20, unit: 'Nm' } },
    ]);
  });

  it('a 12 ft-lb spec goes about 3.5–4, about 8.5–9, then 12 ft-lb (common practice, no source)', () => {
    const [p1, p2, p3] = passPlan({ value: 12, unit: 'lbf-ft' }, undefined, { checkPass: false });
    expect(p1!.target.value).toBeGreaterThanOrEqual(3.5);
    expect(p1!.target.value).toBeLessThanOrEqual(4);
    // 70 % gives 8.4 ft-lb: "about 8.5" in the trade's words, so allow 0.2 ft-lb below the range.
    expect(p2!.target.value).toBeGreaterThanOrEqual(8.5 - 0.2);
    expect(p2!.target.value).toBeLessThanOrEqual(9);
    expect(p3!.target).toEqual({ value: 12, unit: 'lbf-ft' });
  });

  it('repeats a pass at the same target (a second lap) instead of refusing it', () => {
    const plan = passPlan({ value: 12, unit: 'lbf-ft' }, [0.3, 0.3, 0.7, 1], { checkPass: false });
    expect(plan.map((p) => [p.index, p.target.value])).toEqual([
      [1, 3.6],
      [2, 3.6],
      [3, 8.4],
      [4, 12],
    ]);
  });

  it('targets never go down pass by pass and end at the final spec', () => {
    const fractions = fc
      .array(fc.integer({ min: 1, max: 99 }), { minLength: 0, maxLength: 6 })
      .map((xs) => [...xs.sort((a, b) => a - b).map((x) => x / 100), 1]);
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 500, noNaN: true }), fractions, (value, fs) => {
        const plan = passPlan({ value, unit: 'lbf-in' }, fs, { checkPass: false });
        for (let i = 1; i < plan.length; i++)
          expect(plan[i]!.target.value).toBeGreaterThanOrEqual(plan[i - 1]!.target.value);
        expect(plan.at(-1)!.target.value).toBeCloseTo(value, 9);
      }),
    );
  });

  it.each<[string, Torque, number[], RegExp]>([
    ['zero torque', { value: 0, unit: 'Nm' }, [1], /greater than zero/],
    ['negative torque', { value: -5, unit: 'Nm' }, [1], /greater than zero/],
    ['unknown unit', { value: 5, unit: 'kgm' as never }, [1], /Unknown torque unit/],
    ['fractions out of order', { value: 5, unit: 'Nm' }, [0.7, 0.3, 1], /must not go down/],
    ['not ending at 1', { value: 5, unit: 'Nm' }, [0.3, 0.7], /last pass must be at 1/],
    ['no fractions', { value: 5, unit: 'Nm' }, [], /at least one/],
    ['fraction above 1', { value: 5, unit: 'Nm' }, [0.5, 1.2], /at most 1/],
  ])('refuses %s', (_, final, fractions, message) => {
    expect(() => passPlan(final, fractions)).toThrow(TorquePlanError);
    expect(() => passPlan(final, fractions)).toThrow(message);
  });
});
