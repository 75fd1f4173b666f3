import {
  convertPressure,
  convertTorque,
  isPressureUnit,
  isTorqueUnit,
  UNIT_LABELS,
  type PressureUnit,
  type TorqueUnit,
} from './units';

/**
 * Plausibility of a wheel spec's numbers: refuses the ones that would hurt someone (a bead-seating
 * limit far above what a tire takes, zero or negative values, passes that go down) and warns about
 * the ones that look like a slip of the unit. Pure; every value is checked in the spec's own unit
 * against the limit converted (convert-units, NIST SP 811 App. B factors) and rounded as shown.
 */

export type PlausibilityField =
  | 'maxBeadSeatPressure'
  | 'runningPressure'
  | 'pressureUnit'
  | 'finalTorque'
  | 'torqueUnit'
  | 'fractions'
  | 'lugTorque'
  | 'beadSeatRatingReference'
  | 'beadSeatRatingConfirmed';
export type PlausibilityIssue = { field: PlausibilityField; message: string };
export type Plausibility = { errors: PlausibilityIssue[]; warnings: PlausibilityIssue[] };

export type PlausibilityInput = {
  maxBeadSeatPressure: number;
  runningPressure: number;
  pressureUnit: PressureUnit;
  finalTorque: number;
  torqueUnit: TorqueUnit;
  /** Staged passes as fractions of the final torque (0.3, 0.7, 1). */
  fractions: readonly number[];
  lugTorque?: { value: number; unit: TorqueUnit } | null;
  /** The tire maker's higher bead-seat rating on record (document and page), and whether a lead confirmed it. */
  beadSeatRating?: { reference: string; confirmed: boolean } | null;
};

/**
 * 40 psi: the tire industry's published bead-seating guidance for passenger and light-truck tires
 * (never exceed 40 psi to seat a bead); OSHA's tire-servicing chart (publication 3401) also says
 * stop at 40 psi for truck tires. A tire maker's higher rating overrides it only on record.
 */
export const BEAD_SEAT_CEILING_PSI = 40;
/** Running pressures outside this range look like a unit slip for the wheels we serve (common practice, no source). */
export const RUNNING_PSI_RANGE = [2, 60] as const;
/** A bead-seating limit more than this many times the running pressure looks like a slip (common practice, no source). */
export const SEAT_TO_RUNNING_RATIO = 3;
/** Ring bolts are small: final torques outside this range look like a slip (common practice, no source). */
export const RING_BOLT_FT_LB_RANGE = [5, 40] as const;

// How finely each unit's limit is written: 40 psi is 275.8 kPa and 2.758 bar; 5–40 ft-lb is
// 60–480 in-lb and 7–54 N·m (whole N·m, as the trade writes them).
const STEP: Record<PressureUnit | TorqueUnit, number> = {
  psi: 0.1,
  kPa: 0.1,
  bar: 0.001,
  'lbf-ft': 1,
  'lbf-in': 1,
  Nm: 1,
};
const roundTo = (value: number, step: number) =>
  Math.round(Math.round(value / step) * step * 1e9) / 1e9;

/** A pressure limit given in psi, in `unit`, rounded as the product shows it. */
export function pressureLimitIn(psi: number, unit: PressureUnit): number {
  return roundTo(convertPressure(psi, 'psi', unit), STEP[unit]);
}

/** A torque limit given in ft-lb, in `unit`, rounded as the product shows it. */
export function torqueLimitIn(ftLb: number, unit: TorqueUnit): number {
  return roundTo(convertTorque(ftLb, 'lbf-ft', unit), STEP[unit]);
}

// The second unit each message names: the one a reader of the first most likely thinks in.
const OTHER_PRESSURE: Record<PressureUnit, PressureUnit> = { psi: 'kPa', kPa: 'psi', bar: 'psi' };
const OTHER_TORQUE: Record<TorqueUnit, TorqueUnit> = {
  'lbf-ft': 'Nm',
  'lbf-in': 'lbf-ft',
  Nm: 'lbf-ft',
};
const show = (value: number, unit: PressureUnit | TorqueUnit) =>
  `${roundTo(value, unit === 'bar' ? 0.001 : 0.1)} ${UNIT_LABELS[unit]}`;
const pressureBoth = (value: number, unit: PressureUnit) =>
  `${show(value, unit)} is ${show(convertPressure(value, unit, OTHER_PRESSURE[unit]), OTHER_PRESSURE[unit])}`;
const torqueBoth = (value: number, unit: TorqueUnit) =>
  `${show(value, unit)} is ${show(convertTorque(value, unit, OTHER_TORQUE[unit]), OTHER_TORQUE[unit])}`;
const pressureRange = (unit: PressureUnit) =>
  RUNNING_PSI_RANGE.map((p) => pressureLimitIn(p, unit)).join('–') + ` ${UNIT_LABELS[unit]}`;
const torqueRange = (unit: TorqueUnit) =>
  RING_BOLT_FT_LB_RANGE.map((t) => torqueLimitIn(t, unit)).join('–') + ` ${UNIT_LABELS[unit]}`;

const positive = (value: unknown): value is number =>
  typeof value === 'number' && Number.isFinite(value) && value > 0;
const percent = (fraction: number) => `${roundTo(fraction * 100, 0.01)} %`;

export function checkPlausibility(input: PlausibilityInput): Plausibility {
  const errors: PlausibilityIssue[] = [];
  const warnings: PlausibilityIssue[] = [];
  const refuse = (field: PlausibilityField, message: string) => errors.push({ field, message });
  const warn = (field: PlausibilityField, message: string) => warnings.push({ field, message });

  checkPressures(input, refuse, warn);
  checkTorques(input, refuse, warn);
  checkFractions(input.fractions, refuse);
  return { errors, warnings };
}

type Report = (field: PlausibilityField, message: string) => void;

function checkPressures(input: PlausibilityInput, refuse: Report, warn: Report) {
  const { maxBeadSeatPressure: seat, runningPressure: run, pressureUnit: unit } = input;
  if (!isPressureUnit(unit)) return refuse('pressureUnit', 'Choose psi, kPa or bar.');
  const seatOk = positive(seat);
  const runOk = positive(run);
  if (!seatOk)
    refuse('maxBeadSeatPressure', 'The bead-seating limit must be a number greater than zero.');
  if (!runOk) refuse('runningPressure', 'The running pressure must be a number greater than zero.');

  if (seatOk) {
    const ceiling = pressureLimitIn(BEAD_SEAT_CEILING_PSI, unit);
    const rating = input.beadSeatRating;
    const hasReference = Boolean(rating?.reference.trim());
    if (seat > ceiling && !(hasReference && rating?.confirmed)) {
      const above = `${pressureBoth(seat, unit)}: above the ${BEAD_SEAT_CEILING_PSI} psi bead-seating ceiling (${show(ceiling, unit)}).`;
      refuse(
        'maxBeadSeatPressure',
        hasReference
          ? `${above} A lead must confirm the tire maker's rating before this limit is saved.`
          : `${above} Check the unit and the tire maker's figure; a higher limit needs the tire maker's rating on record (document and page) and a lead's confirmation.`,
      );
      if (hasReference)
        refuse(
          'beadSeatRatingConfirmed',
          "A lead confirms the tire maker's rating here before a limit above 40 psi is saved.",
        );
    }
  }
  if (seatOk && runOk) {
    if (run >= seat) {
      refuse(
        'runningPressure',
        `The running pressure (${pressureBoth(run, unit)}) must be below the bead-seating limit (${show(seat, unit)}).`,
      );
    } else if (seat > SEAT_TO_RUNNING_RATIO * run) {
      warn(
        'maxBeadSeatPressure',
        `The bead-seating limit (${show(seat, unit)}) is more than ${SEAT_TO_RUNNING_RATIO}× the running pressure (${show(run, unit)}): check both against the tire maker's figures.`,
      );
    }
  }
  if (runOk) {
    const [low, high] = RUNNING_PSI_RANGE.map((p) => pressureLimitIn(p, unit)) as [number, number];
    if (run < low || run > high) {
      warn(
        'runningPressure',
        `${pressureBoth(run, unit)}: outside the usual ${RUNNING_PSI_RANGE[0]}–${RUNNING_PSI_RANGE[1]} psi (${pressureRange(unit)}) running pressure. Check the unit.`,
      );
    }
  }
}

function checkTorques(input: PlausibilityInput, refuse: Report, warn: Report) {
  const { finalTorque: final, torqueUnit: unit } = input;
  if (!isTorqueUnit(unit)) refuse('torqueUnit', 'Choose ft-lb, in-lb or N·m.');
  else if (!positive(final))
    refuse('finalTorque', 'The final torque must be a number greater than zero.');
  else {
    const [low, high] = RING_BOLT_FT_LB_RANGE.map((t) => torqueLimitIn(t, unit)) as [
      number,
      number,
    ];
    if (final < low || final > high) {
      warn(
        'finalTorque',
        `${torqueBoth(final, unit)}: outside the usual ${RING_BOLT_FT_LB_RANGE[0]}–${RING_BOLT_FT_LB_RANGE[1]} ft-lb (${torqueRange(unit)}) for ring bolts. Check the unit and the wheel maker's figure.`,
      );
    }
  }
  const lug = input.lugTorque;
  if (lug && (!positive(lug.value) || !isTorqueUnit(lug.unit)))
    refuse('lugTorque', 'The lug-nut torque must be a number greater than zero, with its unit.');
}

function checkFractions(fractions: readonly number[], refuse: Report) {
  if (!Array.isArray(fractions) || fractions.length === 0)
    return refuse('fractions', 'Give at least one pass, ending at 100 %.');
  for (const [i, f] of fractions.entries()) {
    if (!positive(f) || f > 1)
      return refuse(
        'fractions',
        `Pass ${i + 1} must be above 0 and at most 100 %; got ${String(Number.isFinite(f) ? percent(f) : f)}.`,
      );
    const before = fractions[i - 1];
    if (before !== undefined && f < before) {
      return refuse(
        'fractions',
        `Pass ${i + 1} at ${percent(f)} is lower than pass ${i} at ${percent(before)}: passes may repeat a target but never go down.`,
      );
    }
  }
  if (fractions[fractions.length - 1] !== 1)
    refuse('fractions', 'The last pass must be at 100 % (the final torque).');
}

/**
 * A wheel's target (running) pressure on a job card against its spec's bead-seating limit: the
 * same rule as a spec's running pressure — it must be below the limit — judged in the wheel's own
 * unit, the message naming both units. Null when it may be stored.
 */
export function wheelTargetError(
  target: { value: number; unit: PressureUnit },
  limit: { value: number; unit: PressureUnit },
): string | null {
  if (!isPressureUnit(target.unit)) return 'Choose psi, kPa or bar.';
  if (!positive(target.value)) return 'The target pressure must be a number greater than zero.';
  const limitHere = convertPressure(limit.value, limit.unit, target.unit);
  if (target.value >= limitHere - 1e-9) {
    return `The target pressure (${pressureBoth(target.value, target.unit)}) must be below the spec's bead-seating limit (${show(limitHere, target.unit)}): check the unit and the tire maker's figure.`;
  }
  return null;
}
