import { assertFiniteNumber, clean, TorquePlanError } from './errors';
import {
  assertTorque,
  assertTorqueUnit,
  convertTorque,
  formatTorque,
  type Torque,
  type TorqueUnit,
} from './units';

export type Wrench = {
  id: string;
  min: number;
  max: number;
  unit: TorqueUnit;
  graduation: number;
  kind: 'click' | 'beam' | 'dial' | 'digital';
  /** What people call it; messages use it when given, else the id. */
  label?: string;
};

export type WrenchChoice =
  | {
      ok: true;
      wrenchId: string;
      setting: Torque;
      fractionOfMax: number;
      roundingErrorPct: number;
      warnings: string[];
    }
  | { ok: false; reason: string };

const WRENCH_KINDS = ['click', 'beam', 'dial', 'digital'] as const;

export function assertWrench(w: unknown, field = 'wrench'): asserts w is Wrench {
  const c = w as Partial<Wrench> | null;
  if (!c || typeof c !== 'object')
    throw new TorquePlanError('A wrench needs an id, a range, a unit and a graduation.', field);
  if (typeof c.id !== 'string' || !c.id)
    throw new TorquePlanError('A wrench needs an id.', `${field}.id`);
  assertFiniteNumber(c.min, `${field}.min`, "The wrench's minimum");
  assertFiniteNumber(c.max, `${field}.max`, "The wrench's maximum");
  assertFiniteNumber(c.graduation, `${field}.graduation`, "The wrench's graduation");
  if (c.min < 0)
    throw new TorquePlanError("The wrench's minimum cannot be negative.", `${field}.min`);
  if (c.max <= c.min)
    throw new TorquePlanError("The wrench's maximum must be above its minimum.", `${field}.max`);
  if (c.graduation <= 0 || c.graduation > c.max - c.min) {
    throw new TorquePlanError(
      "The wrench's graduation must be above zero and fit inside its range.",
      `${field}.graduation`,
    );
  }
  assertTorqueUnit(c.unit, `${field}.unit`);
  if (!WRENCH_KINDS.includes(c.kind as Wrench['kind'])) {
    throw new TorquePlanError(
      `The wrench kind must be one of: ${WRENCH_KINDS.join(', ')}.`,
      `${field}.kind`,
    );
  }
}

/**
 * ISO 6789-1:2017 permissible deviation for setting (click) wrenches, classes A, D and G
 * (secondary sources): ±4 %, or ±6 % for a maximum of 10 N·m or less.
 */
export function tolerancePct(wrench: Pick<Wrench, 'max' | 'unit'>): number {
  return convertTorque(wrench.max, wrench.unit, 'Nm') <= 10 + 1e-9 ? 6 : 4;
}

/** Recalibration after this many cycles (ISO 6789, secondary sources), unless the shop says otherwise. */
export const CYCLE_LIMIT = 5000;

const EPS = 1e-9;

/** The graduation step nearest to `value`, kept inside the wrench's marked range. */
function roundToGraduation(value: number, w: Wrench): number {
  const steps = Math.round((value - 0) / w.graduation);
  let setting = clean(steps * w.graduation);
  if (setting < w.min - EPS) setting = clean(Math.ceil(w.min / w.graduation - EPS) * w.graduation);
  if (setting > w.max + EPS) setting = clean(Math.floor(w.max / w.graduation + EPS) * w.graduation);
  return setting;
}

function whyNot(target: Torque, w: Wrench, floor: number): string {
  const t = clean(convertTorque(target.value, target.unit, w.unit));
  const shown = formatTorque({ value: t, unit: w.unit }, 2);
  const name = w.label ?? w.id;
  if (t > w.max + EPS)
    return `${name}: ${shown} is above its maximum ${formatTorque({ value: w.max, unit: w.unit })}`;
  if (t < w.min - EPS)
    return `${name}: ${shown} is below its lowest mark ${formatTorque({ value: w.min, unit: w.unit })}`;
  return `${name}: ${shown} is below the shop's floor of ${Number((floor * 100).toFixed(1))} % of its maximum (${formatTorque({ value: floor * w.max, unit: w.unit })})`;
}

/**
 * Picks the wrench for a target: suitable when the target, in the wrench's own unit, lies within
 * its marked range and not below `minFractionOfMax` of its maximum; among those, the one where the
 * target is the largest fraction of the maximum (ties: finer graduation). The setting is rounded
 * to the wrench's graduation, with a warning when that moves it by more than the tolerance.
 *
 * The floor is the shop's own setting and always given: ISO 6789 click-wrench calibration starts
 * at 20 % of the maximum (2003 edition; the 2017 edition from the lowest marked value; secondary
 * sources), and a shop may choose 0, where only the wrench's lowest mark limits it.
 */
export function chooseWrench(
  target: Torque,
  wrenches: readonly Wrench[],
  options: { minFractionOfMax: number },
): WrenchChoice {
  assertTorque(target, 'target');
  const floor = options?.minFractionOfMax;
  assertFiniteNumber(floor, 'minFractionOfMax', "The shop's floor");
  if (floor < 0 || floor >= 1)
    throw new TorquePlanError(
      "The shop's floor must be from 0 to below 1 (a fraction of maximum).",
      'minFractionOfMax',
    );
  if (!Array.isArray(wrenches)) throw new TorquePlanError('Wrenches must be a list.', 'wrenches');
  wrenches.forEach((w, i) => assertWrench(w, `wrenches.${i}`));
  if (wrenches.length === 0) {
    return {
      ok: false,
      reason: `No torque wrench is available for ${formatTorque(target, 2)}: the tool crib is empty.`,
    };
  }

  const suitable = wrenches
    .map((w) => ({ w, t: convertTorque(target.value, target.unit, w.unit) }))
    .filter(({ w, t }) => t >= w.min - EPS && t <= w.max + EPS && t >= floor * w.max - EPS)
    .sort(
      (a, b) =>
        b.t / b.w.max - a.t / a.w.max || a.w.graduation / a.w.max - b.w.graduation / b.w.max,
    );

  const best = suitable[0];
  if (!best) {
    return {
      ok: false,
      reason: `No wrench suits ${formatTorque(target, 2)}. ${wrenches.map((w) => whyNot(target, w, floor)).join('; ')}.`,
    };
  }
  const { w, t } = best;
  const setting = roundToGraduation(t, w);
  const roundingErrorPct = clean(((setting - t) / t) * 100);
  const warnings: string[] = [];
  const tol = tolerancePct(w);
  if (Math.abs(roundingErrorPct) > tol) {
    warnings.push(
      `Rounding to the ${formatTorque({ value: w.graduation, unit: w.unit }, 2)} graduation moves the setting ${roundingErrorPct.toFixed(1)} % from the target, more than the wrench's ±${tol} % tolerance. Use a finer wrench if one is available.`,
    );
  }
  if (w.kind !== 'click' && w.kind !== 'digital') {
    warnings.push(
      `A ${w.kind} wrench has no click: read the scale square-on and stop at the setting.`,
    );
  }
  return {
    ok: true,
    wrenchId: w.id,
    setting: { value: setting, unit: w.unit },
    fractionOfMax: clean(t / w.max),
    roundingErrorPct,
    warnings,
  };
}

/**
 * Judges a verification reading against a reference: the deviation of the reading from the
 * reference, in percent, within the ISO 6789 tolerance for this wrench.
 */
export function verifyReading(
  wrench: Wrench,
  reference: Torque,
  reading: Torque,
): { withinTolerance: boolean; deviationPct: number; tolerancePct: number } {
  assertWrench(wrench);
  assertTorque(reference, 'reference');
  assertTorque(reading, 'reading');
  const ref = convertTorque(reference.value, reference.unit, wrench.unit);
  const got = convertTorque(reading.value, reading.unit, wrench.unit);
  const deviationPct = clean(((got - ref) / ref) * 100);
  const tol = tolerancePct(wrench);
  return { withinTolerance: Math.abs(deviationPct) <= tol + 1e-9, deviationPct, tolerancePct: tol };
}
