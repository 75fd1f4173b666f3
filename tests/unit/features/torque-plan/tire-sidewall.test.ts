import { describe, expect, it } from 'vitest';
import { tireDiameter } from '@/features/torque-plan';

// Metric diameter = rim + 2 × width × aspect / 100 / 25.4 (the Tire and Rim Association / ETRTO
// metric sizing convention, from memory; 25.4 mm per inch exactly, NIST SP 811 App. B).
// Flotation sizes state the diameter as their first number (nominal).
describe('tire sizes as printed on the sidewall', () => {
  it('35x12.50R17LT: flotation with the LT mark after it — 35 in (stated on the size)', () => {
    expect(tireDiameter('35x12.50R17LT')).toEqual({
      inches: 35,
      kind: 'flotation',
      construction: 'radial',
      rimInches: 17,
      widthInches: 12.5,
    });
  });

  it('LT35x12.50R17: the LT mark in front — 35 in (stated on the size)', () => {
    expect(tireDiameter('LT35x12.50R17')).toMatchObject({
      inches: 35,
      rimInches: 17,
      widthInches: 12.5,
    });
  });

  it('AT25x8-12: an ATV tire, bias — 25 in (stated on the size)', () => {
    expect(tireDiameter('AT25x8-12')).toEqual({
      inches: 25,
      kind: 'flotation',
      construction: 'bias',
      rimInches: 12,
      widthInches: 8,
    });
  });

  it('30x10-14 6PR: the ply rating is ignored — 30 in (stated on the size)', () => {
    expect(tireDiameter('30x10-14 6PR')).toMatchObject({
      inches: 30,
      construction: 'bias',
      rimInches: 14,
    });
  });

  it('315/70R17 121Q: load index and speed rating ignored — 17 + 2 × 315 × 0.70 / 25.4 = 34.362 in (formula above)', () => {
    const t = tireDiameter('315/70R17 121Q');
    expect(t.kind).toBe('metric');
    expect(t.inches).toBeCloseTo(34.362, 3);
  });

  it('a dual load index and XL are ignored too: LT285/70R17 121/118Q = 32.709 in, P225/60R16 97H XL = 26.630 in (formula above)', () => {
    expect(tireDiameter('LT285/70R17 121/118Q').inches).toBeCloseTo(32.709, 3);
    expect(tireDiameter('P225/60R16 97H XL').inches).toBeCloseTo(26.63, 3);
  });

  it('the marks change nothing: each form gives what the bare size gives', () => {
    expect(tireDiameter('315/70R17 121Q')).toEqual(tireDiameter('315/70R17'));
    expect(tireDiameter('30x10-14 6PR')).toEqual(tireDiameter('30x10-14'));
    expect(tireDiameter('35x12.50R17LT')).toEqual(tireDiameter('LT35x12.50R17'));
  });

  it('a size run together with its load index is refused with the accepted forms', () => {
    expect(() => tireDiameter('315/70R17121Q')).toThrow(/as printed on the sidewall/);
    expect(() => tireDiameter('big tire')).toThrow(/Unknown tire size/);
  });
});
