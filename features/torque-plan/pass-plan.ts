import { clean, TorquePlanError } from './errors';
import { assertTorque, type Torque } from './units';

export type PlannedPass = {
  index: number;
  kind: 'staged' | 'check';
  fraction: number;
  target: Torque;
};

/**
 * Default rounds: about 30 %, 70 %, 100 % of the final spec. ASME PCC-1 (from memory) recommends
 * rounds of 20–30 %, 50–70 % and 100 %, then check passes at 100 % until no nut turns.
 */
export const DEFAULT_FRACTIONS: readonly number[] = [0.3, 0.7, 1];

export function assertFractions(fractions: unknown): asserts fractions is number[] {
  if (!Array.isArray(fractions) || fractions.length === 0) {
    throw new TorquePlanError('Give at least one pass fraction, ending at 1 (100 %).', 'fractions');
  }
  fractions.forEach((f, i) => {
    if (typeof f !== 'number' || !Number.isFinite(f) || f <= 0 || f > 1) {
      throw new TorquePlanError(
        `Pass ${i + 1}'s fraction must be above 0 and at most 1; got ${String(f)}.`,
        `fractions.${i}`,
      );
    }
    // A repeated fraction is allowed: many repeat the first pass as a second lap at the same target.
    if (i > 0 && f < (fractions[i - 1] as number)) {
      throw new TorquePlanError(
        'Pass fractions must not go down from one pass to the next (a repeated pass is allowed).',
        `fractions.${i}`,
      );
    }
  });
  if (fractions[fractions.length - 1] !== 1) {
    throw new TorquePlanError(
      'The last pass must be at 1 (100 % of the final spec).',
      `fractions.${fractions.length - 1}`,
    );
  }
}

/** Staged passes at each fraction of `final`, then (by default) one check pass at 100 %. */
export function passPlan(
  final: Torque,
  fractions: readonly number[] = DEFAULT_FRACTIONS,
  options: { checkPass?: boolean } = {},
): PlannedPass[] {
  assertTorque(final, 'final');
  const list = [...fractions];
  assertFractions(list);
  const passes: PlannedPass[] = list.map((fraction, i) => ({
    index: i + 1,
    kind: 'staged',
    fraction,
    target: { value: clean(final.value * fraction), unit: final.unit },
  }));
  if (options.checkPass ?? true) {
    passes.push({ index: passes.length + 1, kind: 'check', fraction: 1, target: { ...final } });
  }
  return passes;
}
