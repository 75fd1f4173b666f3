import { addDays, shopDay, type ShopClock } from '@/features/ui/shop-time';
import { clean } from './errors';
import { convertTorque, formatTorque, type Torque, type TorqueUnit } from './units';

/** The shop's rule for when a wrench's verification on the tester counts for a pass. */
export type VerificationPolicy = {
  /** `same_day`: verified on the shop's calendar day; `within_days`: within the last `days` shop days. */
  recency: 'same_day' | 'within_days';
  /** With `within_days`: 1 = today only, 2 = today or yesterday, … */
  days: number;
  /** The reference must lie within ±this % of the setting to be used; 0 = any point of the scale. */
  nearPercent: number;
};

export type RecordedVerification = {
  wrenchId: string;
  /** ISO 8601 instant the server recorded it. */
  recordedAt: string;
  referenceValue: number;
  unit: TorqueUnit;
  /** Reads of passing verifications leave it out; a failed one never counts. */
  withinTolerance?: boolean;
};

export type VerificationVerdict =
  { counts: true; verification: RecordedVerification } | { counts: false; reason: string };

/** Recent enough: on the shop's calendar, counted in whole shop days, not 24-hour spans. */
export function isRecentEnough(
  recordedAt: string,
  policy: VerificationPolicy,
  clock: ShopClock,
): boolean {
  const today = shopDay(clock.now, clock.timeZone);
  const verifiedOn = shopDay(recordedAt, clock.timeZone);
  // A verification "after now" (the phone's clock a little behind the server's) is the freshest there is.
  if (verifiedOn >= today) return true;
  const days = policy.recency === 'same_day' ? 1 : Math.max(1, Math.floor(policy.days));
  return verifiedOn > addDays(today, -days);
}

/** Near enough: the reference, in the setting's unit, within ±nearPercent % of the setting (inclusive). */
export function isNearEnough(
  v: Pick<RecordedVerification, 'referenceValue' | 'unit'>,
  setting: Torque,
  nearPercent: number,
): boolean {
  if (nearPercent <= 0) return true;
  const reference = convertTorque(v.referenceValue, v.unit, setting.unit);
  return clean(Math.abs(reference - setting.value)) <= clean((setting.value * nearPercent) / 100);
}

/** The band of references that count for a setting, for the message and the on-the-spot form. */
export function nearBand(
  setting: Torque,
  nearPercent: number,
): { low: Torque; high: Torque } | null {
  if (nearPercent <= 0) return null;
  const off = (setting.value * nearPercent) / 100;
  return {
    low: { value: clean(setting.value - off), unit: setting.unit },
    high: { value: clean(setting.value + off), unit: setting.unit },
  };
}

function recencyText(policy: VerificationPolicy): string {
  if (policy.recency === 'same_day' || policy.days <= 1) return 'today';
  return `in the last ${policy.days} days`;
}

/**
 * Does this wrench have a verification that counts for a pass at `setting`? Passing, recent
 * enough, and near the setting: a wrench checked at 10 ft-lb says little about 60 ft-lb.
 */
export function verificationFor(
  wrenchId: string,
  setting: Torque,
  verifications: readonly RecordedVerification[],
  policy: VerificationPolicy,
  clock: ShopClock,
): VerificationVerdict {
  const recent = verifications.filter(
    (v) =>
      v.wrenchId === wrenchId &&
      v.withinTolerance !== false &&
      isRecentEnough(v.recordedAt, policy, clock),
  );
  const near = recent.find((v) => isNearEnough(v, setting, policy.nearPercent));
  if (near) return { counts: true, verification: near };
  if (!recent.length)
    return { counts: false, reason: `No passing verification ${recencyText(policy)}.` };
  const band = nearBand(setting, policy.nearPercent)!;
  const points = [
    ...new Set(recent.map((v) => formatTorque({ value: v.referenceValue, unit: v.unit }, 2))),
  ].join(', ');
  return {
    counts: false,
    reason: `Verified ${recencyText(policy)} at ${points}, but a check counts for this pass only within ±${policy.nearPercent} % of the ${formatTorque(setting, 2)} setting (${formatTorque(band.low, 2)} to ${formatTorque(band.high, 2)}).`,
  };
}
