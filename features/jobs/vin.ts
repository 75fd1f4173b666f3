/**
 * VIN check digit, 49 CFR Part 565: letters transliterate to numbers, each position has a weight,
 * the weighted sum modulo 11 is the check digit in position 9 (10 is written X).
 * I, O and Q never appear in a VIN.
 */
const VALUES: Record<string, number> = {
  A: 1,
  B: 2,
  C: 3,
  D: 4,
  E: 5,
  F: 6,
  G: 7,
  H: 8,
  J: 1,
  K: 2,
  L: 3,
  M: 4,
  N: 5,
  P: 7,
  R: 9,
  S: 2,
  T: 3,
  U: 4,
  V: 5,
  W: 6,
  X: 7,
  Y: 8,
  Z: 9,
};
const WEIGHTS = [8, 7, 6, 5, 4, 3, 2, 10, 0, 9, 8, 7, 6, 5, 4, 3, 2];
const SHAPE = /^[A-HJ-NPR-Z0-9]{17}$/;

export const normaliseVin = (vin: string) => vin.replace(/[\s-]/g, '').toUpperCase();

export type VinCheck =
  | { valid: true }
  | { valid: false; reason: 'shape'; message: string }
  | { valid: false; reason: 'check-digit'; expected: string; message: string };

export function checkVin(raw: string): VinCheck {
  const vin = normaliseVin(raw);
  if (!SHAPE.test(vin)) {
    return {
      valid: false,
      reason: 'shape',
      message: 'A VIN has 17 letters and digits, without I, O or Q.',
    };
  }
  let sum = 0;
  for (let i = 0; i < 17; i++) {
    const c = vin[i]!;
    sum += (/\d/.test(c) ? Number(c) : VALUES[c]!) * WEIGHTS[i]!;
  }
  const remainder = sum % 11;
  const expected = remainder === 10 ? 'X' : String(remainder);
  if (vin[8] === expected) return { valid: true };
  return {
    valid: false,
    reason: 'check-digit',
    expected,
    message: `The check digit (9th character) should be ${expected} for this VIN. Check the VIN; if it is right as stamped, a lead can accept it anyway.`,
  };
}
