import {
  checkPlausibility,
  passPlan,
  tighteningSequence,
  TorquePlanError,
  type Pattern,
  type Plausibility,
  type PlausibilityInput,
} from '@/features/torque-plan';
import type { SpecInput } from './schemas';
import type { Spec } from './server/specs';

export function specPattern(s: Pick<SpecInput, 'patternKind' | 'skipStep'>): Pattern {
  return s.patternKind === 'skip'
    ? { kind: 'skip', step: s.skipStep ?? 0 }
    : { kind: s.patternKind };
}

// Engine field names → the spec form's.
const FIELD: [RegExp, string][] = [
  [/^boltCount/, 'boltCount'],
  [/^pattern/, 'skipStep'],
  [/^fractions/, 'passPercents'],
  [/^final\.value/, 'finalTorque'],
  [/^final\.unit/, 'torqueUnit'],
];

/**
 * Runs the spec through the engine: a spec the engine refuses cannot be saved. Pure, so the form
 * shows the same message at the same field before the server says it again.
 */
export function engineErrors(s: SpecInput): Record<string, string[]> | null {
  try {
    tighteningSequence(s.boltCount, specPattern(s));
    passPlan(
      { value: s.finalTorque, unit: s.torqueUnit },
      s.passPercents.map((p) => p / 100),
      { checkPass: s.checkPass },
    );
    return null;
  } catch (error) {
    if (!(error instanceof TorquePlanError)) throw error;
    const field = FIELD.find(([re]) => re.test(error.field ?? ''))?.[1] ?? 'name';
    return { [field]: [field === 'passPercents' ? inPercent(error.message) : error.message] };
  }
}

/** The plausibility module's field names → the spec form's. */
const formField = (field: string) => (field === 'fractions' ? 'passPercents' : field);

type Numbers = Pick<
  SpecInput,
  | 'maxBeadSeatPressure'
  | 'runningPressure'
  | 'pressureUnit'
  | 'finalTorque'
  | 'torqueUnit'
  | 'passPercents'
> &
  Partial<
    Pick<
      SpecInput,
      'lugTorque' | 'lugTorqueUnit' | 'beadSeatRatingReference' | 'beadSeatRatingConfirmed'
    >
  >;

export function plausibilityInput(s: Numbers): PlausibilityInput {
  return {
    maxBeadSeatPressure: s.maxBeadSeatPressure,
    runningPressure: s.runningPressure,
    pressureUnit: s.pressureUnit,
    finalTorque: s.finalTorque,
    torqueUnit: s.torqueUnit,
    fractions: s.passPercents.map((p) => p / 100),
    lugTorque:
      s.lugTorque === undefined ? null : { value: s.lugTorque, unit: s.lugTorqueUnit ?? 'lbf-ft' },
    beadSeatRating: {
      reference: s.beadSeatRatingReference ?? '',
      confirmed: s.beadSeatRatingConfirmed ?? false,
    },
  };
}

/** The spec's plausibility, keyed by the form's field names: errors refuse the save, warnings are shown. */
export function specPlausibility(s: Numbers): {
  errors: Record<string, string[]>;
  warnings: Record<string, string[]>;
} {
  const byField = (issues: Plausibility['errors']) => {
    const out: Record<string, string[]> = {};
    for (const { field, message } of issues) (out[formField(field)] ??= []).push(message);
    return out;
  };
  const { errors, warnings } = checkPlausibility(plausibilityInput(s));
  return { errors: byField(errors), warnings: byField(warnings) };
}

/** What refuses this spec: the engine's error, or else the plausibility errors; null when it may be saved. */
export function specErrors(s: SpecInput): Record<string, string[]> | null {
  const engine = engineErrors(s);
  if (engine) return engine;
  const { errors } = specPlausibility(s);
  return Object.keys(errors).length ? errors : null;
}

/** The engine speaks in fractions; the form in percent. */
function inPercent(message: string): string {
  if (/must not go down/.test(message))
    return 'Each pass must be at least the one before (a repeated pass is fine).';
  if (/last pass/.test(message)) return 'The last pass must be 100 (the final torque).';
  if (/above 0 and at most 1/.test(message)) return 'Each pass must be above 0 and at most 100.';
  return message;
}

/** A stored spec as the form's input shape (nulls become absent). */
export function specToInput(spec: Spec): SpecInput {
  return {
    ...spec,
    skipStep: spec.skipStep ?? undefined,
    lugTorque: spec.lugTorque ?? undefined,
    lugTorqueUnit: spec.lugTorqueUnit ?? undefined,
    lugCount: spec.lugCount ?? undefined,
    threadCondition: spec.threadCondition ?? undefined,
    beadSeatRatingConfirmed: spec.beadSeatRatingConfirmedAt !== null,
  };
}
