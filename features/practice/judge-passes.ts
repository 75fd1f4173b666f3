import {
  chooseWrench,
  convertTorque,
  formatTorque,
  TORQUE_UNITS,
  UNIT_LABELS,
  type Torque,
} from '@/features/torque-plan';
import {
  plannedPassOf,
  reduceRun,
  type PassProgress,
  type RunnerPlan,
  type RunnerState,
} from '@/features/runner/state';
import { POINTS, type Finding } from './scoring-parts';
import type { PracticeEvent, PracticeSetup, PracticeWrench } from './types';

// Torque words name both units wherever a value was converted. Factors through the engine
// (convert-units; NIST SP 811 App. B: 1 ft·lbf = 1.355 818 N·m, 1 ft = 12 in).
const OTHER = { 'lbf-ft': 'Nm', 'lbf-in': 'lbf-ft', Nm: 'lbf-ft' } as const;
export const torqueWords = (t: Torque) =>
  `${formatTorque(t)} (${formatTorque({ value: convertTorque(t.value, t.unit, OTHER[t.unit]), unit: OTHER[t.unit] })})`;
const inUnit = (t: Torque, unit: Torque['unit']): Torque => ({
  value: convertTorque(t.value, t.unit, unit),
  unit,
});
const rangeOf = (w: PracticeWrench) => `${w.min}–${w.max} ${UNIT_LABELS[w.unit]}`;

/** "pass 2 (70 %, 21 ft-lb)" / "check pass 4 (30 ft-lb)". */
export function passWords(setup: PracticeSetup, index: number): string {
  const planned = plannedPassOf(setup.snapshot.plan.passes, index);
  if (!planned) return `pass ${index}`;
  const target = formatTorque(planned.target);
  return planned.kind === 'check'
    ? `check pass ${index} (${target})`
    : `pass ${index} (${Math.round(planned.fraction * 100)} %, ${target})`;
}

/**
 * Every bolt tightened out of the pass's order: which bolt, and the one that was due. Whether the
 * bolt jumped ahead within its pass or into the next pass is read from the run as it stood just
 * before that bolt.
 */
export function judgeSequence(
  setup: PracticeSetup,
  plan: RunnerPlan,
  state: RunnerState,
  events: readonly PracticeEvent[],
): Finding[] {
  return state.anomalies.map((a) => {
    const where = cap(passWords(setup, a.pass));
    const before = reduceRun(
      plan,
      events.filter((e) => e.clientAt < a.at),
    ).currentPass;
    const message =
      a.expected === null
        ? `${where}: bolt ${a.bolt} was tightened after every pass was finished.`
        : before === null || before === a.pass
          ? `${where}: bolt ${a.bolt} was tightened when bolt ${a.expected} was next. Out of order the ring draws down unevenly and the bolts done first lose torque.`
          : `${where}: bolt ${a.bolt} was tightened before ${passWords(setup, before)} was finished (bolt ${a.expected} was next). Finish each pass all the way round first.`;
    return {
      part: 'sequence' as const,
      kind: 'bolt_out_of_sequence' as const,
      step: 'torque',
      pass: a.pass,
      bolt: a.bolt,
      expected: a.expected === null ? null : `bolt ${a.expected}`,
      message,
      points: POINTS.outOfSequence,
    };
  });
}

const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

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
  return `the ${w?.label ?? rangeOf(w!)} wrench set to ${formatTorque(best.setting)}`;
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

function judgePass(
  setup: PracticeSetup,
  pass: PassProgress,
  target: Torque,
  confirms: Confirm[],
): Finding[] {
  const where = passWords(setup, pass.index);
  const base = { part: 'wrench' as const, step: 'torque', pass: pass.index, bolt: null };
  const wrenchId = pass.wrenchId ?? confirms.find((e) => e.payload.wrenchId)?.payload.wrenchId;
  const wrench = setup.wrenches.find((w) => w.id === wrenchId);
  const expected = suggestion(target, setup);
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
  const floor = setup.minFractionOfMax;
  if (!chooseWrench(target, [wrench], { minFractionOfMax: floor }).ok) {
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
  const settings = distinctSettings(confirms);
  if (settings.length === 0) {
    return [
      {
        ...base,
        kind: 'wrong_setting',
        expected,
        message: `${cap(where)}: no setting was typed for the ${wrench.label} wrench. Set it to ${formatTorque(inUnit(target, wrench.unit))} before the first bolt.`,
        points: POINTS.wrongSetting,
      },
    ];
  }
  return settings.flatMap((s) => judgeSetting({ ...base, where, target, wrench, setting: s }));
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
 * another unit (within a graduation or 2 %) is a unit mistake: the ft-lb figure dialled on an in-lb
 * wrench. A setting typed with another unit is converted to the wrench's unit first.
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
}): Finding[] {
  const { where, target, wrench, setting, ...base } = input;
  const unit = wrench.unit;
  const dialled =
    setting.unit === unit ? setting.value : convertTorque(setting.value, setting.unit, unit);
  const t = inUnit(target, unit);
  if (Math.abs(dialled - t.value) <= wrench.graduation + 1e-9) return [];
  const right = formatTorque(t);
  const rightBoth = torqueWords(t);
  const slip = TORQUE_UNITS.filter((u) => u !== unit).find((u) => {
    const there = convertTorque(target.value, target.unit, u);
    return Math.abs(dialled - there) <= Math.max(wrench.graduation, 0.02 * there);
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
      message: `${cap(where)}: set to ${formatTorque({ value: dialled, unit })}, ${off} off the target ${rightBoth}, more than the wrench's ${formatTorque({ value: wrench.graduation, unit }, 2)} graduation.`,
      points: POINTS.wrongSetting,
    },
  ];
}
