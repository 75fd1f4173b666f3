import { isPressureUnit, isTorqueUnit } from '@/features/torque-plan';
import { specPlausibility } from './engine-check';

type Issues = { errors: Record<string, string[]>; warnings: Record<string, string[]> };

const NUMBER_FIELDS = [
  'maxBeadSeatPressure',
  'runningPressure',
  'finalTorque',
  'lugTorque',
] as const;

/** A typed number as the spec means it; blank is "not typed yet" (undefined), anything else a number (maybe NaN). */
function typed(raw: unknown): number | undefined {
  if (typeof raw !== 'string' || raw.trim() === '') return undefined;
  return Number(raw.replace(',', '.'));
}

function typedPercents(raw: unknown): number[] | undefined {
  if (typeof raw !== 'string' || raw.trim() === '') return undefined;
  return raw
    .split(/[,;\s]+/)
    .filter(Boolean)
    .map((p) => Number(p.replace('%', '')));
}

/**
 * The plausibility of a spec form half filled in, as the person types: each rule runs as soon as
 * the fields it reads are typed. Missing values get neutral stand-ins, and what is said about a
 * field not typed yet is dropped, so nothing is shown at an empty field.
 */
export function liveCheck(form: Record<string, unknown>): Issues {
  const n = Object.fromEntries(NUMBER_FIELDS.map((f) => [f, typed(form[f])])) as Record<
    (typeof NUMBER_FIELDS)[number],
    number | undefined
  >;
  const percents = typedPercents(form.passPercents);
  const pressureUnit = isPressureUnit(form.pressureUnit) ? form.pressureUnit : 'psi';
  const torqueUnit = isTorqueUnit(form.torqueUnit) ? form.torqueUnit : 'lbf-ft';
  const lugTorqueUnit = isTorqueUnit(form.lugTorqueUnit) ? form.lugTorqueUnit : 'lbf-ft';
  // Stand-ins that raise nothing by themselves: the seat limit twice the running pressure.
  const seat =
    n.maxBeadSeatPressure ??
    (n.runningPressure !== undefined && n.runningPressure > 0 ? n.runningPressure * 2 : 2);
  const run = n.runningPressure ?? (seat > 0 ? seat / 2 : 1);
  const all = specPlausibility({
    maxBeadSeatPressure: seat,
    runningPressure: run,
    pressureUnit,
    finalTorque: n.finalTorque ?? 1,
    torqueUnit,
    passPercents: percents ?? [100],
    lugTorque: n.lugTorque,
    lugTorqueUnit,
    beadSeatRatingReference:
      typeof form.beadSeatRatingReference === 'string' ? form.beadSeatRatingReference : '',
    beadSeatRatingConfirmed:
      form.beadSeatRatingConfirmed === 'on' || form.beadSeatRatingConfirmed === true,
  });
  const missing = new Set<string>([
    ...NUMBER_FIELDS.filter((f) => n[f] === undefined),
    ...(percents === undefined ? ['passPercents'] : []),
    ...(n.maxBeadSeatPressure === undefined ? ['beadSeatRatingConfirmed'] : []),
  ]);
  const typedOnly = (issues: Record<string, string[]>) =>
    Object.fromEntries(Object.entries(issues).filter(([field]) => !missing.has(field)));
  return { errors: typedOnly(all.errors), warnings: typedOnly(all.warnings) };
}
