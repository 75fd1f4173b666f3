import {
  chooseWrench,
  verificationFor,
  type RecordedVerification,
  type Torque,
  type VerificationPolicy,
  type VerificationVerdict,
  type Wrench,
  type WrenchChoice,
} from '@/features/torque-plan';

export type CribWrench = Wrench & { label: string };

/** The shop's settings the runner's wrench gate reads; the page hands them down. */
export type WrenchRules = {
  /** The shop's wrench floor as a fraction of each wrench's maximum (settings keep it in %). */
  minFractionOfMax: number;
  verification: VerificationPolicy;
  timeZone: string;
};

export type PassWrench = {
  /** The engine's pick among the wrenches still usable. */
  best: WrenchChoice;
  /** Every usable wrench that suits this pass (the technician may pick another). */
  suitable: CribWrench[];
  wrench: CribWrench | null;
  choice: WrenchChoice | null;
  /** Whether the wrench has a verification that counts for this pass's setting. */
  verification: VerificationVerdict | null;
};

/**
 * Which wrench a pass uses and whether it may be used now: the technician's choice when it still
 * suits, else the engine's; then the shop's verification policy for that wrench at that setting.
 * Pure, so the page's data can be checked without a browser.
 */
export function passWrench(input: {
  target: Torque;
  wrenches: readonly CribWrench[];
  /** Wrenches that failed a verification on this phone: out of service, not offered again. */
  failed?: readonly string[];
  chosenId?: string | null;
  rules: WrenchRules;
  verifications: readonly RecordedVerification[];
  now: Date;
}): PassWrench {
  const { target, rules } = input;
  const floor = { minFractionOfMax: rules.minFractionOfMax };
  const usable = input.wrenches.filter((w) => !input.failed?.includes(w.id));
  const best = chooseWrench(target, usable, floor);
  const suitable = usable.filter((w) => chooseWrench(target, [w], floor).ok);
  const wrenchId =
    input.chosenId && suitable.some((w) => w.id === input.chosenId)
      ? input.chosenId
      : best.ok
        ? best.wrenchId
        : null;
  const wrench = usable.find((w) => w.id === wrenchId) ?? null;
  const choice = wrench ? chooseWrench(target, [wrench], floor) : null;
  const verification =
    wrench && choice?.ok
      ? verificationFor(wrench.id, choice.setting, input.verifications, rules.verification, {
          timeZone: rules.timeZone,
          now: input.now,
        })
      : null;
  return { best, suitable, wrench, choice, verification };
}
