import {
  arrowDirection,
  convertPressure,
  convertTorque,
  formatTorque,
  isPressureUnit,
  isTorqueUnit,
  threadConditionText,
  UNIT_LABELS,
  type Pressure,
  type Torque,
  type TorqueUnit,
  type WheelPosition,
} from '@/features/torque-plan';
import { formatShopTime } from '@/features/ui/shop-time';
import type { ReportEvent, ReportWheelData, ReportWrench } from './types';

export type WrenchUseView = {
  label: string;
  /** "serial CW-0042", or "no serial on record". */
  serial: string;
  /** In the wrench's own unit first, then the spec's: "104 in-lb (8.7 ft-lb)". */
  setting: string;
  lastVerification: string;
  bolts: number;
};
export type PassView = { index: number; kind: string; target: string; wrenches: WrenchUseView[] };
export type WheelView = {
  position: string;
  positionName: string;
  tireSize: string;
  direction: string;
  spec: {
    name: string;
    boltCount: number;
    boltThread: string;
    pattern: string;
    finalTorque: string;
    makerReference: string;
    threadCondition: string;
    boltReuse: string;
  } | null;
  sequence: number[];
  passes: PassView[];
  beadSeatLimit: string | null;
  beadSeatUsed: string | null;
  targetPressure: string;
  pressureSet: string | null;
  workedBy: string[];
  submittedAt: string | null;
  photos: { id: string; caption: string }[];
};

const POSITION_NAMES: Record<string, string> = {
  LF: 'Left front',
  RF: 'Right front',
  LR: 'Left rear',
  RR: 'Right rear',
  spare: 'Spare',
};
const PHOTO_KINDS: Record<string, string> = {
  bead_outer: 'Seated bead, outer face',
  bead_inner: 'Seated bead, inner face',
  other: 'Photo',
};
const OTHER_TORQUE: Record<TorqueUnit, TorqueUnit> = {
  'lbf-ft': 'Nm',
  'lbf-in': 'Nm',
  Nm: 'lbf-ft',
};
const OTHER_PRESSURE = { psi: 'kPa', kPa: 'psi', bar: 'psi' } as const;

const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : null);
const str = (v: unknown) => (typeof v === 'string' && v ? v : null);

/** A torque with the other unit beside it: both units are named wherever a number can hurt someone. */
export function torqueBoth(t: Torque, other: TorqueUnit = OTHER_TORQUE[t.unit]): string {
  if (other === t.unit) return formatTorque(t);
  return `${formatTorque(t)} (${formatTorque({ value: convertTorque(t.value, t.unit, other), unit: other })})`;
}

export function pressureBoth(p: Pressure): string {
  const other = OTHER_PRESSURE[p.unit];
  const digits = (u: string) => (u === 'bar' ? 2 : u === 'kPa' ? 0 : 1);
  const fmt = (v: number, u: Pressure['unit']) =>
    `${Number(v.toFixed(digits(u)))} ${UNIT_LABELS[u]}`;
  return `${fmt(p.value, p.unit)} (${fmt(convertPressure(p.value, p.unit, other), other)})`;
}

function settingOf(payload: Record<string, unknown>): Torque | null {
  const s = payload.setting as Record<string, unknown> | undefined;
  return s && num(s.value) !== null && isTorqueUnit(s.unit)
    ? { value: s.value as number, unit: s.unit }
    : null;
}

/**
 * Per pass, the wrenches that confirmed its bolts and the setting shown for them. An event names
 * its wrench and setting; an older one takes the wrench chosen for the pass, and its setting is
 * the target in that wrench's unit rounded to its graduation.
 */
function wrenchUses(
  events: readonly ReportEvent[],
  passIndex: number,
  target: Torque,
  specUnit: TorqueUnit,
  wrenches: Record<string, ReportWrench>,
  timeZone: string,
): WrenchUseView[] {
  let chosen: string | null = null;
  const uses = new Map<string, WrenchUseView & { bolts: number; seen: Set<number> }>();
  for (const e of events) {
    if (num(e.payload.pass) !== passIndex) continue;
    if (e.type === 'wrench_chosen') chosen = str(e.payload.wrenchId);
    if (e.type !== 'bolt_confirmed') continue;
    const id = str(e.payload.wrenchId) ?? chosen;
    const wrench = id ? wrenches[id] : undefined;
    const setting =
      settingOf(e.payload) ??
      (wrench
        ? {
            value:
              Math.round(
                convertTorque(target.value, target.unit, wrench.unit) / wrench.graduation,
              ) * wrench.graduation,
            unit: wrench.unit,
          }
        : null);
    const settingText = setting ? torqueBoth(setting, specUnit) : 'setting not recorded';
    const key = `${id ?? '-'}|${settingText}`;
    const use = uses.get(key) ?? {
      label: wrench?.label ?? 'Wrench not recorded',
      serial: wrench?.serial ? `serial ${wrench.serial}` : 'no serial on record',
      setting: settingText,
      lastVerification: verificationText(wrench, timeZone),
      bolts: 0,
      seen: new Set<number>(),
    };
    const bolt = num(e.payload.bolt);
    if (bolt !== null && !use.seen.has(bolt)) use.seen.add(bolt);
    use.bolts = use.seen.size;
    uses.set(key, use);
  }
  return [...uses.values()].map((u) => ({
    label: u.label,
    serial: u.serial,
    setting: u.setting,
    lastVerification: u.lastVerification,
    bolts: u.bolts,
  }));
}

function verificationText(wrench: ReportWrench | undefined, timeZone: string): string {
  const v = wrench?.lastVerification;
  if (!v) return 'no verification on record';
  return `${formatShopTime(v.at, timeZone, 'date')} at ${formatTorque(v.reference)}, ${
    v.withinTolerance ? 'within tolerance' : 'out of tolerance'
  }`;
}

function measurement(events: readonly ReportEvent[], step: string): Pressure | null {
  const found = events.findLast((e) => e.type === 'step_done' && e.payload.step === step);
  const m = found?.payload.measurement as Record<string, unknown> | undefined;
  return m && num(m.value) !== null && isPressureUnit(m.unit)
    ? { value: m.value as number, unit: m.unit }
    : null;
}

/** The plan's passes and the check passes the runner added after a bolt turned (their events name a pass past the plan). */
function passesOf(wheel: ReportWheelData) {
  const planned = wheel.snapshot?.plan.passes ?? [];
  const lastCheck = planned.at(-1);
  if (lastCheck?.kind !== 'check') return planned;
  const highest = Math.max(
    0,
    ...wheel.events.filter((e) => e.type === 'bolt_confirmed').map((e) => num(e.payload.pass) ?? 0),
  );
  const added = [];
  for (let index = planned.length + 1; index <= Math.min(highest, planned.length + 10); index++)
    added.push({ ...lastCheck, index });
  return [...planned, ...added];
}

export function wheelView(
  wheel: ReportWheelData,
  ctx: { timeZone: string; people: Record<string, string>; wrenches: Record<string, ReportWrench> },
): WheelView {
  const snap = wheel.snapshot;
  const spec = snap?.spec;
  const seated = measurement(wheel.events, 'seat_bead');
  const set = measurement(wheel.events, 'leak_check');
  const hands = new Set([
    ...wheel.events.map((e) => e.byId),
    ...(wheel.submittedById ? [wheel.submittedById] : []),
  ]);
  return {
    position: wheel.position,
    positionName: POSITION_NAMES[wheel.position] ?? wheel.position,
    tireSize: wheel.tireSize,
    direction: wheel.directional
      ? `Directional. ${arrowDirection(wheel.position as WheelPosition).instruction}`
      : 'Not directional.',
    spec: spec
      ? {
          name: spec.name,
          boltCount: spec.boltCount,
          boltThread: spec.boltThread,
          pattern:
            spec.pattern.kind === 'skip'
              ? `skip ${spec.pattern.step ?? ''}`.trim()
              : spec.pattern.kind,
          finalTorque: torqueBoth(spec.finalTorque),
          makerReference: spec.makerReference || 'not stated',
          threadCondition: threadConditionText(spec.threadCondition),
          boltReuse: spec.boltReuse || 'not stated',
        }
      : null,
    sequence: snap?.plan.sequence ?? [],
    passes: passesOf(wheel).map((p) => ({
      index: p.index,
      kind:
        p.kind === 'check'
          ? 'Check pass (100 %)'
          : `Pass ${p.index} (${Math.round(p.fraction * 100)} %)`,
      target: torqueBoth(p.target),
      wrenches: wrenchUses(
        wheel.events,
        p.index,
        p.target,
        snap!.spec.finalTorque.unit,
        ctx.wrenches,
        ctx.timeZone,
      ),
    })),
    beadSeatLimit: spec ? pressureBoth(spec.maxBeadSeatPressure) : null,
    beadSeatUsed: seated ? pressureBoth(seated) : null,
    targetPressure: pressureBoth(snap?.targetPressure ?? wheel.targetPressure),
    pressureSet: set ? pressureBoth(set) : null,
    workedBy: [...hands].map((id) => ctx.people[id] ?? 'a former team member'),
    submittedAt: wheel.submittedAt ? formatShopTime(wheel.submittedAt, ctx.timeZone) : null,
    photos: wheel.photos.map((p) => ({
      id: p.id,
      caption: [PHOTO_KINDS[p.kind] ?? 'Photo', p.note, formatShopTime(p.at, ctx.timeZone)]
        .filter(Boolean)
        .join(' · '),
    })),
  };
}
