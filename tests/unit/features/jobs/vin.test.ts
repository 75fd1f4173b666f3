import { describe, expect, it } from 'vitest';
import { checkVin } from '@/features/jobs/vin';

describe('VIN check digit (49 CFR Part 565)', () => {
  it('accepts the worked example 1M8GDM9AXKP042788, whose check digit is X (49 CFR 565, from memory)', () => {
    expect(checkVin('1M8GDM9AXKP042788')).toEqual({ valid: true });
  });
  it('accepts lower case and spaces, as typed from a frame', () => {
    expect(checkVin('1m8gdm9a xkp042788')).toEqual({ valid: true });
  });
  it('names the expected check digit when it does not match', () => {
    expect(checkVin('1M8GDM9A1KP042788')).toMatchObject({
      valid: false,
      reason: 'check-digit',
      expected: 'X',
    });
  });
  it.each(['1M8GDM9AXKP04278', '1M8GDM9AXKP0427888', 'IM8GDM9AXKP042788', '1M8GDM9AXKP04278O'])(
    'refuses the shape of %s',
    (vin) => {
      expect(checkVin(vin)).toMatchObject({ valid: false, reason: 'shape' });
    },
  );
});
