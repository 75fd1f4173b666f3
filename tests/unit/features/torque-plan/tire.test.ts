import { describe, expect, it } from 'vitest';
import {
  arrowDirection,
  axleMismatch,
  circumferenceAllowancePct,
  tireDiameter,
  TorquePlanError,
} from '@/features/torque-plan';

describe('tireDiameter', () => {
  it('265/70R17 is 31.61 in (rim + 2 × width × aspect / 100 / 25.4)', () => {
    expect(tireDiameter('265/70R17').inches).toBeCloseTo(31.61, 2);
  });
  it.each([
    ['LT285/70R17', 17 + (2 * 285 * 0.7) / 25.4, 'radial'],
    ['P225/60R16', 16 + (2 * 225 * 0.6) / 25.4, 'radial'],
    ['30x10-14', 30, 'bias'],
    ['30x10R14', 30, 'radial'],
    ['30x10.00-14', 30, 'bias'],
    ['32X10R15', 32, 'radial'],
  ])('%s → %f in (%s)', (size, inches, construction) => {
    const t = tireDiameter(size);
    expect(t.inches).toBeCloseTo(inches, 6);
    expect(t.construction).toBe(construction);
  });
  it.each(['', '30-14', '265/70', 'big tire', '14x30-30'])(
    'refuses "%s" and names the accepted forms',
    (size) => {
      expect(() => tireDiameter(size)).toThrow(TorquePlanError);
      expect(() => tireDiameter(size)).toThrow(/30x10-14.*265\/70R17/);
    },
  );
});

describe('axleMismatch', () => {
  it('matching tires do not mismatch', () => {
    expect(axleMismatch(['30x10R14', '30x10R14'], 1)).toMatchObject({
      mismatched: false,
      spreadPct: 0,
    });
  });
  it('a 30 and a 32 in tire on one axle do', () => {
    const r = axleMismatch(['30x10R14', '32x10R14'], 1);
    expect(r.mismatched).toBe(true);
    expect(r.spreadPct).toBeCloseTo((2 / 30) * 100, 6);
    expect(r.circumferenceSpreadInches).toBeCloseTo(2 * Math.PI, 6);
  });
  it('radial beside bias is a mismatch even at the same size', () => {
    expect(axleMismatch(['30x10R14', '30x10-14'], 5)).toMatchObject({
      mismatched: true,
      constructionDiffers: true,
    });
  });
  it('a 1/4 in circumference allowance on a 31.6 in tire is about 0.25 % (common practice, no source)', () => {
    expect(circumferenceAllowancePct(0.25, 31.61)).toBeCloseTo(0.2517, 3);
  });
});

describe('arrowDirection', () => {
  it('left side turns counterclockwise seen from outside, right side clockwise', () => {
    expect(arrowDirection('LF').seenFromOutside).toBe('counterclockwise');
    expect(arrowDirection('LR').side).toBe('left');
    expect(arrowDirection('RF').seenFromOutside).toBe('clockwise');
    expect(arrowDirection('spare').side).toBeNull();
  });
});
