import {
  chooseWrench,
  convertPressure,
  convertTorque,
  formatTorque,
  UNIT_LABELS,
  verificationFor,
  type Pressure,
  type Torque,
} from '@/features/torque-plan';
import { shopDay } from '@/features/ui/shop-time';
import {
  liveEvents,
  medianInterval,
  wheelRecord,
  type BoltConfirmation,
  type PassRecord,
  type WheelRecord,
} from './record';
import type {
  Anomaly,
  AnomalyCode,
  JobReviewInput,
  ReviewSettings,
  ReviewWrench,
  Severity,
  WheelReviewInput,
} from './types';

/**
 * What a lead must look at before signing a job off, computed from the record alone (pure, no
 * I/O, and blind to the order the events arrived in). `blocks`: safety-relevant, sign-off waits
 * until a lead acknowledges it with a reason; `notes`: worth reading, does not hold the job.
 * Sorted for reading: what blocks first, then by wheel (job-level first), then by kind and pass.
 */
export function jobAnomalies(input: JobReviewInput): Anomaly[] {
  const found: Anomaly[] = [];
  if (input.vinCheckOverridden) {
    found.push(
      anomaly(
        'vin_overridden',
        'notes',
        null,
        "The VIN's check digit does not compute and was accepted by a lead when the vehicle was saved; compare it with the vehicle's plate.",
      ),
    );
  }
  for (const warning of input.axleWarnings) {
    found.push({
      ...anomaly(
        'axle_mismatch_accepted',
        'notes',
        null,
        `Accepted when the job was saved: ${warning}`,
      ),
      key: `axle_mismatch_accepted:job:${warning}`,
    });
  }
  input.wheels.forEach((wheel) => found.push(...wheelAnomalies(wheel, input)));
  const wheelOrder = (a: Anomaly) =>
    a.wheelId === null ? -1 : input.wheels.findIndex((w) => w.wheelId === a.wheelId);
  return found.sort(
    (a, b) =>
      SEVERITY_ORDER.indexOf(a.severity) - SEVERITY_ORDER.indexOf(b.severity) ||
      wheelOrder(a) - wheelOrder(b) ||
      CODE_ORDER.indexOf(a.code) - CODE_ORDER.indexOf(b.code) ||
      (a.pass ?? 0) - (b.pass ?? 0) ||
      a.key.localeCompare(b.key),
  );
}

const SEVERITY_ORDER: Severity[] = ['blocks', 'notes'];
const CODE_ORDER: AnomalyCode[] = [
  'inspection_failed',
  'bolt_flagged',
  'bead_seat_over_limit',
  'out_of_sequence',
  'too_fast',
  'wrench_missing',
  'wrench_out_of_service',
  'wrench_calibration_overdue',
  'wrench_unverified',
  'wrench_unsuitable',
  'photo_missing',
  'received_after_submit',
  'pressure_off_target',
  'step_skipped',
  'other_person',
  'events_refused',
  'vin_overridden',
  'axle_mismatch_accepted',
];

export const blocking = (anomalies: readonly Anomaly[]) =>
  anomalies.filter((a) => a.severity === 'blocks');

export function countBySeverity(anomalies: readonly Anomaly[]): Record<Severity, number> {
  return {
    blocks: blocking(anomalies).length,
    notes: anomalies.length - blocking(anomalies).length,
  };
}

function anomaly(
  code: AnomalyCode,
  severity: Severity,
  wheelId: string | null,
  message: string,
  extra: { pass?: number; bolts?: number[]; key?: string } = {},
): Anomaly {
  const key = [code, wheelId ?? 'job', extra.pass ?? '-', extra.key ?? ''].join(':');
  return {
    key,
    code,
    severity,
    message,
    wheelId,
    ...(extra.pass !== undefined && { pass: extra.pass }),
    ...(extra.bolts && { bolts: extra.bolts }),
  };
}

/** "bolt 5", "bolts 5 and 3", "bolts 5, 3 and 7" — in the order given. */
export function boltList(bolts: readonly number[]): string {
  if (bolts.length === 1) return `bolt ${bolts[0]}`;
  return `bolts ${bolts.slice(0, -1).join(', ')} and ${bolts.at(-1)}`;
}

/** "pass 2 of 4 (70 %, 14 ft-lb)", "the check pass (…)"; a check pass the runner added past the plan is "check pass 2 (…)". */
export function passLabel(
  pass: Pick<PassRecord, 'index' | 'kind' | 'fraction' | 'target'>,
  passCount: number,
): string {
  const at = `${Math.round(pass.fraction * 100)} %, ${formatTorque(pass.target, 1)}`;
  if (pass.kind === 'staged') return `pass ${pass.index} of ${passCount} (${at})`;
  return pass.index > passCount
    ? `check pass ${pass.index - passCount + 1} (${at})`
    : `the check pass (${at})`;
}

const psi = (p: Pressure) => convertPressure(p.value, p.unit, 'psi');
const shownPressure = (p: Pressure) => `${Number(p.value.toFixed(1))} ${UNIT_LABELS[p.unit]}`;
/** NIST SP 811 App. B: 1 psi = 6.894 757 kPa; a set pressure more than 1 psi off the target is worth a look. */
export const PRESSURE_TOLERANCE_PSI = 1;
/** A verification the runner records just before a pass is stamped by the server, whose clock may lead the phone's. */
const VERIFICATION_GRACE_MS = 5 * 60_000;

function wheelAnomalies(wheel: WheelReviewInput, job: JobReviewInput): Anomaly[] {
  const record = wheelRecord(wheel.plan, wheel.events);
  const name = `${wheel.position} wheel`;
  const out: Anomaly[] = [];
  const add = (
    code: AnomalyCode,
    severity: Severity,
    message: string,
    extra?: { pass?: number; bolts?: number[]; key?: string },
  ) => out.push(anomaly(code, severity, wheel.wheelId, `${name}: ${message}`, extra));
  const passCount = wheel.plan.passes.length;

  const failed = record.inspectionFailed ?? wheel.flaggedReason;
  if (failed)
    add(
      'inspection_failed',
      'blocks',
      `the inspection failed (${failed}); the rim, ring or bolts need a lead's decision before this wheel goes back on.`,
    );
  for (const f of record.flaggedBolts) {
    const planned = f.pass ? wheel.plan.passes[f.pass - 1] : undefined;
    const where = planned
      ? ` during ${passLabel(planned, passCount)}`
      : f.pass
        ? ` during pass ${f.pass}`
        : '';
    add(
      'bolt_flagged',
      'blocks',
      `${boltList([f.bolt])} was flagged${where}${f.reason ? `: ${f.reason}` : ''}. Check the thread and the bolt before release.`,
      { pass: f.pass ?? undefined, bolts: [f.bolt], key: String(f.bolt) },
    );
  }

  for (const pass of record.passes) {
    const label = passLabel(pass, passCount);
    const off = pass.confirmed.filter((c) => c.outOfOrder);
    if (off.length) {
      const expected = [
        ...new Set(off.map((c) => c.expected).filter((b): b is number => b !== null)),
      ];
      const staged = pass.kind === 'staged';
      add(
        'out_of_sequence',
        staged ? 'blocks' : 'notes',
        `${boltList(off.map((c) => c.bolt))} confirmed out of the tightening sequence on ${label}${expected.length ? `; the plan called for ${boltList(expected)} at that point` : ''}.${staged ? ' An uneven pull can leave the ring clamped unevenly.' : ''}`,
        { pass: pass.index, bolts: off.map((c) => c.bolt) },
      );
    }
    const median = medianInterval(pass);
    if (median !== null && median < job.settings.tooFastSecondsPerBolt) {
      add(
        'too_fast',
        'blocks',
        `${label} was confirmed at a median of ${Number(median.toFixed(1))} s per bolt, faster than the shop's ${job.settings.tooFastSecondsPerBolt} s; a wrench cannot click that fast on every bolt. Ask whether each bolt was really pulled to the click.`,
        { pass: pass.index, bolts: pass.confirmed.map((c) => c.bolt) },
      );
    }
    out.push(
      ...wrenchAnomalies(pass, label, wheel, job.settings).map((a) => ({
        ...a,
        key: a.key,
        message: `${name}: ${a.message}`,
      })),
    );
    const others = [
      ...new Set(pass.confirmed.map((c) => c.byId).filter((id) => id !== job.assigneeId)),
    ];
    for (const id of others) {
      const bolts = pass.confirmed.filter((c) => c.byId === id).map((c) => c.bolt);
      const who = job.people[id] ?? 'someone else';
      add(
        'other_person',
        'notes',
        `${boltList(bolts)} on ${label} confirmed by ${who}, not the assigned ${job.assigneeId ? `technician (${job.people[job.assigneeId] ?? 'unknown'})` : 'technician (nobody was assigned)'}.`,
        { pass: pass.index, bolts, key: id },
      );
    }
  }

  out.push(
    ...measurementAnomalies(record, wheel).map((a) => ({ ...a, message: `${name}: ${a.message}` })),
  );

  for (const kind of wheel.requiredPhotos) {
    if (!wheel.photoKinds.includes(kind))
      add(
        'photo_missing',
        'blocks',
        `no ${PHOTO_NAMES[kind] ?? kind} photo; the seated bead cannot be checked from the record.`,
        { key: kind },
      );
  }
  for (const step of record.steps.filter((s) => s.status === 'skipped')) {
    add(
      'step_skipped',
      'notes',
      `step "${step.title}" was skipped: ${step.reason || 'no reason given'}.`,
      { key: step.id },
    );
  }
  if (wheel.refused.length) {
    const reasons = [...new Set(wheel.refused.map((r) => r.message))].slice(0, 3).join(' ');
    add(
      'events_refused',
      'notes',
      `${wheel.refused.length} ${wheel.refused.length === 1 ? 'entry was' : 'entries were'} refused by the server and are not in this record. ${reasons}`,
    );
  }
  if (wheel.submittedAt) {
    const late = liveEvents(wheel.events).filter((e) => e.receivedAt > wheel.submittedAt!);
    if (late.length)
      add(
        'received_after_submit',
        'blocks',
        `${late.length} ${late.length === 1 ? 'entry arrived' : 'entries arrived'} after the wheel was submitted; the record changed after it was closed.`,
      );
  }
  return out;
}

const PHOTO_NAMES: Record<string, string> = {
  bead_outer: 'seated-bead (outer face)',
  bead_inner: 'seated-bead (inner face)',
};

function measurementAnomalies(record: WheelRecord, wheel: WheelReviewInput): Anomaly[] {
  const out: Anomaly[] = [];
  const seat = record.measurements.seat_bead;
  const limit = wheel.limits.maxBeadSeat;
  if (seat && convertPressure(seat.value, seat.unit, limit.unit) > limit.value + 1e-9) {
    out.push(
      anomaly(
        'bead_seat_over_limit',
        'blocks',
        wheel.wheelId,
        `the bead was seated at ${shownPressure(seat)}, above the spec's bead-seating limit of ${shownPressure(limit)}. Check the tire and bead for damage; the tire maker's limit comes first.`,
      ),
    );
  }
  const set = record.measurements.leak_check;
  const target = wheel.limits.targetPressure;
  if (set && Math.abs(psi(set) - psi(target)) > PRESSURE_TOLERANCE_PSI + 1e-9) {
    out.push(
      anomaly(
        'pressure_off_target',
        'notes',
        wheel.wheelId,
        `pressure set to ${shownPressure(set)}, target ${shownPressure(target)} (more than ${PRESSURE_TOLERANCE_PSI} psi off).`,
      ),
    );
  }
  return out;
}

type UseProblem = { code: AnomalyCode; text: string };

/** Each confirmation's wrench judged as it stood when the bolt was confirmed; bolts grouped by wrench and problem. */
function wrenchAnomalies(
  pass: PassRecord,
  label: string,
  wheel: WheelReviewInput,
  settings: ReviewSettings,
): Anomaly[] {
  const groups = new Map<string, { problem: UseProblem; bolts: number[]; wrenchKey: string }>();
  for (const c of pass.confirmed) {
    for (const problem of problemsOfUse(c, pass.target, wheel, settings)) {
      const key = `${problem.code}|${c.wrenchId ?? 'none'}|${problem.text}`;
      const g = groups.get(key) ?? { problem, bolts: [], wrenchKey: c.wrenchId ?? 'none' };
      g.bolts.push(c.bolt);
      groups.set(key, g);
    }
  }
  return [...groups.values()].map(({ problem, bolts, wrenchKey }) =>
    anomaly(
      problem.code,
      'blocks',
      wheel.wheelId,
      `${label}, ${boltList(bolts)}: ${problem.text}`,
      { pass: pass.index, bolts, key: `${wrenchKey}:${problem.text}` },
    ),
  );
}

function problemsOfUse(
  c: BoltConfirmation,
  target: Torque,
  wheel: WheelReviewInput,
  settings: ReviewSettings,
): UseProblem[] {
  if (!c.wrenchId) return [{ code: 'wrench_missing', text: 'no torque wrench was recorded.' }];
  const w = wheel.wrenches.find((x) => x.id === c.wrenchId);
  if (!w)
    return [
      { code: 'wrench_missing', text: "the wrench recorded is not in this shop's tool crib." },
    ];
  const problems: UseProblem[] = [];
  const status = statusAt(w, c.at);
  if (status)
    problems.push({
      code: 'wrench_out_of_service',
      text: `${w.label} was out of service when used (${status}).`,
    });
  const day = shopDay(c.at, settings.timeZone);
  if (day > w.calibrationDueOn)
    problems.push({
      code: 'wrench_calibration_overdue',
      text: `${w.label} was overdue for calibration (due ${w.calibrationDueOn}).`,
    });
  const floor = { minFractionOfMax: settings.wrenchFloorPercent / 100 };
  const choice = chooseWrench(target, [w], floor);
  const setting = c.setting ?? (choice.ok ? choice.setting : null);
  if (!choice.ok)
    problems.push({
      code: 'wrench_unsuitable',
      text: `${w.label} does not suit ${formatTorque(target, 1)}: ${choice.reason.replace(/^No wrench suits [^.]*\. /, '')}`,
    });
  else if (c.setting && !settingFits(c.setting, w, floor.minFractionOfMax)) {
    problems.push({
      code: 'wrench_unsuitable',
      text: `${w.label} was set to ${formatTorque(c.setting, 1)}, outside its usable range at the shop's floor.`,
    });
  }
  if (setting) {
    const before = Date.parse(c.at) + VERIFICATION_GRACE_MS;
    const usable = wheel.verifications.filter((v) => Date.parse(v.recordedAt) <= before);
    const verdict = verificationFor(w.id, setting, usable, settings.verification, {
      timeZone: settings.timeZone,
      now: new Date(c.at),
    });
    if (!verdict.counts)
      problems.push({
        code: 'wrench_unverified',
        text: `${w.label} had no verification the shop's policy accepts at the time. ${verdict.reason}`,
      });
  }
  return problems;
}

function settingFits(setting: Torque, w: ReviewWrench, floor: number): boolean {
  const t = convertTorque(setting.value, setting.unit, w.unit);
  return t >= Math.max(w.min, floor * w.max) - 1e-9 && t <= w.max + 1e-9;
}

/** The reason the wrench was out of service at that instant, or null when it was in service. */
function statusAt(w: ReviewWrench, at: string): string | null {
  const t = Date.parse(at);
  const last = [...w.statusHistory]
    .filter((s) => Date.parse(s.at) <= t)
    .sort((a, b) => Date.parse(a.at) - Date.parse(b.at) || a.status.localeCompare(b.status))
    .at(-1);
  return last?.status === 'out_of_service' ? last.reason || 'no reason recorded' : null;
}

export type WrenchUse = {
  wrenchId: string | null;
  label: string;
  setting: Torque | null;
  bolts: number[];
  verifiedAt: string | null;
  verification: string;
};

/** Per wrench used on a pass: its setting and the verification that counted at its first use (or why none did). */
export function wrenchUses(
  pass: PassRecord,
  wheel: Pick<WheelReviewInput, 'wrenches' | 'verifications'>,
  settings: ReviewSettings,
): WrenchUse[] {
  const ids = [...new Set(pass.confirmed.map((c) => c.wrenchId))];
  return ids.map((id) => {
    const uses = pass.confirmed.filter((c) => c.wrenchId === id);
    const first = uses[0]!;
    const w = wheel.wrenches.find((x) => x.id === id);
    if (!w)
      return {
        wrenchId: id,
        label: id ? 'A wrench not in the tool crib' : 'No wrench recorded',
        setting: first.setting,
        bolts: uses.map((c) => c.bolt),
        verifiedAt: null,
        verification: '',
      };
    const choice = chooseWrench(pass.target, [w], {
      minFractionOfMax: settings.wrenchFloorPercent / 100,
    });
    const setting = first.setting ?? (choice.ok ? choice.setting : null);
    const usable = wheel.verifications.filter(
      (v) => Date.parse(v.recordedAt) <= Date.parse(first.at) + VERIFICATION_GRACE_MS,
    );
    const verdict = setting
      ? verificationFor(w.id, setting, usable, settings.verification, {
          timeZone: settings.timeZone,
          now: new Date(first.at),
        })
      : null;
    return {
      wrenchId: w.id,
      label: w.label,
      setting,
      bolts: uses.map((c) => c.bolt),
      verifiedAt: verdict?.counts ? verdict.verification.recordedAt : null,
      verification: verdict
        ? verdict.counts
          ? `verified at ${formatTorque({ value: verdict.verification.referenceValue, unit: verdict.verification.unit }, 2)}`
          : verdict.reason
        : 'no setting fits this wrench',
    };
  });
}
