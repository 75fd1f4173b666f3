import {
  chooseWrench,
  convertTorque,
  formatTorque,
  TORQUE_UNITS,
  UNIT_LABELS,
  type Torque,
} from '@/features/torque-plan';
import { plannedPassOf, type PassProgress, type RunnerState } from '@/features/runner/state';
import { POINTS, type Finding } from './scoring-parts';
import type { PracticeEvent, PracticeSetup, PracticeWrench } from './types';
import { cap, inUnit, passWords, rangeOf, torqueWords } from './words';

/** Why a wrench cannot read a target, in the wrench's own unit (ISO 6789, secondary sources: the floor idea). */
function whyUnsuitable(target: Torque, w: PracticeWrench, floor: number): string {
  const t = inUnit(target, w.unit);
  const shown =
    target.unit === w.unit ? formatTorque(t) : `${formatTorque(t)} (${formatTorque(target)})`;
  if (t.value > w.max + 1e-9) return `${shown} is above the ${rangeOf(w)} wrench's maximum`;
  if (t.value < w.min - 1e-9) return `${shown} is below the ${rangeOf(w)} wrench's lowest mark`;
  const floorValue = formatTorque({ value: floor * w.max, unit: w.unit });
  return `${shown} is below the ${rangeOf(w)} wrench's ${floorValue} floor (the shop reads no wrench under ${Math.round(floor * 1000) / 10} % of its maximum)`;
}

/** The wrench the engine would pick and its setting: what the message offers instead. */
function suggestion(target: Torque, setup: PracticeSetup): string {
  const best = chooseWrench(target, setup.wrenches, { minFractionOfMax: setup.minFractionOfMax });
  if (!best.ok) return best.reason;
  const w = setup.wrenches.find((x) => x.id === best.wrenchId);
  return `the ${w ? w.label : formatTorque(best.setting)} wrench set to ${formatTorque(best.setting)}`;
}

type Confirm = Extract<PracticeEvent, { type: 'bolt_confirmed' }>;

/** Wrench setup level: the wrench picked and the setting typed for each pass, judged by the engine. */
export function judgeWrenches(
  setup: PracticeSetup,
  state: RunnerState,
  events: readonly PracticeEvent[],
): Finding[] {
  const confirms = events.filter((e): e is Confirm => e.type === 'bolt_confirmed');
  return state.passes.flatMap((pass) => {
    const mine = confirms.filter((e) => e.payload.pass === pass.index);
    if (mine.length === 0) return [];
    const target = plannedPassOf(setup.snapshot.plan.passes, pass.index)?.target;
    return target ? judgePass(setup, pass, target, mine) : [];
  });
}

/**
 * The wrenches that tightened the pass's bolts (the one named on each confirmation, else the one
 * picked for the pass), each judged once; then each distinct setting typed on a wrench that suits.
 */
function judgePass(
  setup: PracticeSetup,
  pass: PassProgress,
  target: Torque,
  confirms: Confirm[],
): Finding[] {
  const where = passWords(setup, pass.index);
  const base = { part: 'wrench' as const, step: 'torque', pass: pass.index, bolt: null };
  const expected = suggestion(target, setup);
  const floor = setup.minFractionOfMax;
  const used = new Map<string | null, Confirm[]>();
  for (const e of confirms) {
    const id = e.payload.wrenchId ?? pass.wrenchId;
    used.set(id, [...(used.get(id) ?? []), e]);
  }
  return [...used].flatMap(([wrenchId, mine]): Finding[] => {
    const wrench = setup.wrenches.find((w) => w.id === wrenchId);
    if (!wrench) {
      return [
        {
          ...base,
          kind: 'wrong_wrench',
          expected,
          message: `${cap(where)}: no wrench from this crib was picked. For ${torqueWords(target)} use ${expected}.`,
          points: POINTS.wrongWrench,
        },
      ];
    }
    const choice = chooseWrench(target, [wrench], { minFractionOfMax: floor });
    if (!choice.ok) {
      return [
        {
          ...base,
          kind: 'wrong_wrench',
          expected,
          message: `${cap(where)}: ${whyUnsuitable(target, wrench, floor)}. Use ${expected}.`,
          points: POINTS.wrongWrench,
        },
      ];
    }
    const settings = distinctSettings(mine);
    if (settings.length === 0) {
      return [
        {
          ...base,
          kind: 'wrong_setting',
          expected: `${formatTorque(choice.setting)} on the ${wrench.label} wrench`,
          message: `${cap(where)}: no setting was typed for the ${wrench.label} wrench. Set it to ${torqueWords(choice.setting)} before the first bolt.`,
          points: POINTS.wrongSetting,
        },
      ];
    }
    return settings.flatMap((s) =>
      judgeSetting({ ...base, where, target, wrench, setting: s, right: choice.setting }),
    );
  });
}

function distinctSettings(confirms: Confirm[]): Torque[] {
  const seen = new Map<string, Torque>();
  for (const e of confirms) {
    const s = e.payload.setting;
    if (s) seen.set(`${s.value} ${s.unit}`, s);
  }
  return [...seen.values()];
}

/**
 * A setting is right within one graduation of the target, in the wrench's unit (the finest step
 * the wrench can be set to; common practice, no source). A number that matches the target in
 * another unit (within 2 %, or that figure at the wrench's nearest mark) is a unit mistake: the
 * ft-lb figure dialled on an in-lb wrench. A setting typed with another unit is converted to the
 * wrench's unit first.
 */
function judgeSetting(input: {
  part: 'wrench';
  step: string;
  pass: number;
  bolt: null;
  where: string;
  target: Torque;
  wrench: PracticeWrench;
  setting: Torque;
  /** The target rounded to the wrench's graduation: what to set. */
  right: Torque;
}): Finding[] {
  const { where, target, wrench, setting, right: rightSetting, ...base } = input;
  const unit = wrench.unit;
  const dialled =
    setting.unit === unit ? setting.value : convertTorque(setting.value, setting.unit, unit);
  const t = inUnit(target, unit);
  if (Math.abs(dialled - t.value) <= wrench.graduation + 1e-9) return [];
  const right = formatTorque(rightSetting);
  const rightBoth = torqueWords(rightSetting);
  const slip = TORQUE_UNITS.filter((u) => u !== unit).find((u) => {
    const there = convertTorque(target.value, target.unit, u);
    const atNearestMark = Math.round(there / wrench.graduation) * wrench.graduation;
    return (
      Math.abs(dialled - there) <= 0.02 * there + 1e-9 || Math.abs(dialled - atNearestMark) < 1e-9
    );
  });
  if (slip) {
    return [
      {
        ...base,
        kind: 'unit_mistake',
        expected: `${right} on the ${wrench.label} wrench`,
        message: `${cap(where)}: ${Number(dialled.toFixed(1))} is the target in ${UNIT_LABELS[slip]} (${formatTorque(inUnit(target, slip))}), but the ${wrench.label} wrench reads ${UNIT_LABELS[unit]}. Set it to ${rightBoth}.`,
        points: POINTS.unitMistake,
      },
    ];
  }
  const off = formatTorque({ value: Math.abs(dialled - t.value), unit });
  return [
    {
      ...base,
      kind: 'wrong_setting',
      expected: `${right} on the ${wrench.label} wrench`,
      message: `${cap(where)}: set to ${formatTorque({ value: dialled, unit })}, ${off} off the target ${torqueWords(t)}, more than the wrench's ${formatTorque({ value: wrench.graduation, unit }, 2)} graduation.`,
      points: POINTS.wrongSetting,
    },
  ];
}
