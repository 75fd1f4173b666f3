/** The one error the engine throws for input it refuses; `field` names the offending input. */
export class TorquePlanError extends Error {
  constructor(
    message: string,
    readonly field?: string,
  ) {
    super(message);
    this.name = 'TorquePlanError';
  }
}

export function assertFiniteNumber(
  value: unknown,
  field: string,
  label = field,
): asserts value is number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new TorquePlanError(`${label} must be a number.`, field);
  }
}

/** Rounds away binary noise (0.3 × 12 = 3.5999999999999996) without hiding real precision. */
export const clean = (value: number) => Math.round(value * 1e9) / 1e9;
