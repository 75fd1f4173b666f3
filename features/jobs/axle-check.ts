import { axleMismatch, tireDiameter, TorquePlanError } from '@/features/torque-plan';

/** Common practice for all-wheel drive, no source: the four within 1/4 in of circumference. */
export const CIRCUMFERENCE_ALLOWANCE_IN = 0.25;

type WheelLike = { position: string; tireSize: string };

/** Tire sizes the engine cannot read, by wheel index. */
export function tireSizeErrors(wheels: WheelLike[]): Record<string, string[]> {
  const errors: Record<string, string[]> = {};
  wheels.forEach((w, i) => {
    try {
      tireDiameter(w.tireSize);
    } catch (error) {
      if (error instanceof TorquePlanError) errors[`wheels.${i}.tireSize`] = [error.message];
      else throw error;
    }
  });
  return errors;
}

/**
 * The engine's checks of the job's tires: each axle's pair must match in size and construction
 * (mixed sizes strain the drivetrain), and the four should stay within the circumference
 * allowance. The vehicle maker's own rule comes first.
 */
export function axleWarnings(wheels: WheelLike[]): string[] {
  if (Object.keys(tireSizeErrors(wheels)).length) return [];
  const size = (p: string) => wheels.find((w) => w.position === p)?.tireSize;
  const warnings: string[] = [];
  for (const [axle, left, right] of [
    ['Front', 'LF', 'RF'],
    ['Rear', 'LR', 'RR'],
  ] as const) {
    const a = size(left);
    const b = size(right);
    if (!a || !b) continue;
    const r = axleMismatch([a, b], 0);
    if (r.mismatched) {
      warnings.push(
        `${axle} axle: ${a} and ${b} differ${r.constructionDiffers ? ' in construction' : ''}${r.spreadPct > 0 ? ` by ${r.spreadPct.toFixed(1)} % in diameter` : ''}. Tires on one axle must match.`,
      );
    }
  }
  const four = ['LF', 'RF', 'LR', 'RR'].map(size).filter((s): s is string => Boolean(s));
  if (four.length === 4) {
    const r = axleMismatch(four, 100);
    if (r.circumferenceSpreadInches > CIRCUMFERENCE_ALLOWANCE_IN) {
      warnings.push(
        `The four tires differ by ${r.circumferenceSpreadInches.toFixed(2)} in of circumference, more than ${CIRCUMFERENCE_ALLOWANCE_IN} in (a common all-wheel-drive allowance; the vehicle maker's rule comes first).`,
      );
    }
  }
  return warnings;
}

/**
 * Warnings at intake that do not stop the save: an axle with only one of its wheels on the job
 * card. Both tires of an axle are replaced together, since different rolling diameters strain the
 * differential (common practice, no source); a one-wheel job may still be right (a puncture on a
 * nearly new pair), so the person decides.
 */
export function intakeWarnings(wheels: readonly { position: string }[]): string[] {
  const on = new Set(wheels.map((w) => w.position));
  const warnings: string[] = [];
  for (const [axle, left, right] of [
    ['Front', 'LF', 'RF'],
    ['Rear', 'LR', 'RR'],
  ] as const) {
    if (on.has(left) === on.has(right)) continue;
    const [has, missing] = on.has(left) ? [left, right] : [right, left];
    warnings.push(
      `${axle} axle: only ${has} is on this job card, not ${missing}. Both tires of an axle are normally replaced together; different rolling diameters strain the differential.`,
    );
  }
  return warnings;
}
