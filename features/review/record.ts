import { isPressureUnit, isTorqueUnit, type Pressure, type Torque } from '@/features/torque-plan';
import { deviceLabel } from '@/features/ui/device-label';
import type { ReviewEvent, ReviewPass, ReviewPlan } from './types';

export type BoltConfirmation = {
  bolt: number;
  at: string;
  receivedAt: string;
  byId: string;
  /** The phone that confirmed it and its short name ("Phone 3F9A"); null for events from before phones kept an id. */
  deviceId: string | null;
  device: string | null;
  /** The wrench the event names, else the one chosen for the pass when the bolt was confirmed. */
  wrenchId: string | null;
  /** The setting shown on the phone, when the event carries it. */
  setting: Torque | null;
  /** Confirmed in another order than the plan's (the bolt the plan called for is `expected`). */
  outOfOrder: boolean;
  expected: number | null;
  /** Since the previous confirmation of the same pass. */
  seconds: number | null;
};

export type PassRecord = ReviewPass & { confirmed: BoltConfirmation[]; complete: boolean };
export type StepRecord = {
  id: string;
  title: string;
  status: 'done' | 'skipped' | 'todo';
  reason: string | null;
  at: string | null;
  byId: string | null;
  seconds: number | null;
};
export type FlaggedBolt = { pass: number | null; bolt: number; reason: string };

/** What the wheel's live (not superseded) events amount to, in the order they happened. */
export type WheelRecord = {
  passes: PassRecord[];
  steps: StepRecord[];
  measurements: Record<string, Pressure & { at: string }>;
  inspectionFailed: string | null;
  flaggedBolts: FlaggedBolt[];
};

const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : null);
const str = (v: unknown) => (typeof v === 'string' && v ? v : null);
const seconds = (from: string, to: string) => (Date.parse(to) - Date.parse(from)) / 1000;

/** The setting the phone showed, in either shape an event may carry it ({ value, unit } or setting + unit). */
function settingOf(payload: Record<string, unknown>): Torque | null {
  const s = payload.setting;
  if (s && typeof s === 'object') {
    const { value, unit } = s as Record<string, unknown>;
    return num(value) !== null && isTorqueUnit(unit) ? { value: value as number, unit } : null;
  }
  return num(s) !== null && isTorqueUnit(payload.settingUnit ?? payload.unit)
    ? { value: s as number, unit: (payload.settingUnit ?? payload.unit) as Torque['unit'] }
    : null;
}

/** Device order, ties by id, each event once, rework's superseded events left out: every arrival order gives the same. */
export function liveEvents(events: readonly ReviewEvent[]): ReviewEvent[] {
  const seen = new Set<string>();
  return [...events]
    .sort((a, b) => a.clientAt.localeCompare(b.clientAt) || a.clientId.localeCompare(b.clientId))
    .filter((e) => !e.superseded && !seen.has(e.clientId) && seen.add(e.clientId));
}

/**
 * The plan's passes, plus the check passes the runner added after a bolt turned on a check pass
 * (their events name a pass past the plan): each repeats the last check pass, at the target the
 * event carries when it does.
 */
function passesOf(plan: ReviewPlan, events: readonly ReviewEvent[]): ReviewPass[] {
  const lastCheck = plan.passes.at(-1);
  if (lastCheck?.kind !== 'check') return plan.passes;
  const extra = events.filter(
    (e) => e.type === 'bolt_confirmed' && (num(e.payload.pass) ?? 0) > plan.passes.length,
  );
  const highest = Math.min(
    plan.passes.length + 10,
    Math.max(plan.passes.length, ...extra.map((e) => num(e.payload.pass)!)),
  );
  const added: ReviewPass[] = [];
  for (let index = plan.passes.length + 1; index <= highest; index++) {
    const t = extra.find((e) => e.payload.pass === index)?.payload.target as Torque | undefined;
    added.push({
      ...lastCheck,
      index,
      target:
        t && num(t.value) !== null && isTorqueUnit(t.unit)
          ? { value: t.value, unit: t.unit }
          : lastCheck.target,
    });
  }
  return [...plan.passes, ...added];
}

export function wheelRecord(basePlan: ReviewPlan, events: readonly ReviewEvent[]): WheelRecord {
  const ordered = liveEvents(events);
  const plan = { ...basePlan, passes: passesOf(basePlan, ordered) };
  const confirmed = plan.passes.map(() => [] as BoltConfirmation[]);
  const chosen: (string | null)[] = plan.passes.map(() => null);
  const steps = new Map<string, Omit<StepRecord, 'seconds' | 'title' | 'id'>>();
  const measurements: WheelRecord['measurements'] = {};
  const flaggedBolts: FlaggedBolt[] = [];
  let inspectionFailed: string | null = null;

  const has = (p: number, bolt: number) => confirmed[p]!.some((c) => c.bolt === bolt);
  const nextOf = (p: number) => plan.passes[p]!.order.find((b) => !has(p, b)) ?? null;
  const currentPass = () => plan.passes.findIndex((_, p) => confirmed[p]!.length < plan.boltCount);

  for (const e of ordered) {
    const p = (num(e.payload.pass) ?? 0) - 1;
    const bolt = num(e.payload.bolt);
    const step = str(e.payload.step);
    switch (e.type) {
      case 'wrench_chosen':
        if (plan.passes[p]) chosen[p] = str(e.payload.wrenchId);
        break;
      case 'bolt_confirmed': {
        if (!plan.passes[p] || bolt === null || bolt > plan.boltCount || has(p, bolt)) break;
        const cp = currentPass();
        const expected = cp === p ? nextOf(p) : cp >= 0 ? nextOf(cp) : null;
        const previous = confirmed[p]!.at(-1);
        confirmed[p]!.push({
          bolt,
          at: e.clientAt,
          receivedAt: e.receivedAt,
          byId: e.byId,
          deviceId: e.deviceId ?? null,
          device: deviceLabel(e.deviceId),
          wrenchId: str(e.payload.wrenchId) ?? chosen[p]!,
          setting: settingOf(e.payload),
          outOfOrder: cp !== p || bolt !== expected,
          expected,
          seconds: previous ? seconds(previous.at, e.clientAt) : null,
        });
        break;
      }
      case 'bolt_undone':
        if (plan.passes[p]) confirmed[p] = confirmed[p]!.filter((c) => c.bolt !== bolt);
        break;
      case 'bolt_flagged':
        {
          const what = [
            str(e.payload.problem)?.replaceAll('_', ' '),
            str(e.payload.note) ?? str(e.payload.reason),
          ]
            .filter(Boolean)
            .join(': ');
          if (bolt !== null) flaggedBolts.push({ pass: p >= 0 ? p + 1 : null, bolt, reason: what });
          break;
        }
        break;
      case 'inspection_failed':
        inspectionFailed = str(e.payload.notes) ?? 'no notes';
        break;
      case 'step_done':
        if (step && steps.get(step)?.status !== 'done')
          steps.set(step, { status: 'done', reason: null, at: e.clientAt, byId: e.byId });
        if (step) {
          const m = e.payload.measurement as Record<string, unknown> | undefined;
          if (m && num(m.value) !== null && isPressureUnit(m.unit))
            measurements[step] = { value: m.value as number, unit: m.unit, at: e.clientAt };
        }
        break;
      case 'step_skipped':
        if (step && !steps.has(step))
          steps.set(step, {
            status: 'skipped',
            reason: str(e.payload.reason) ?? '',
            at: e.clientAt,
            byId: e.byId,
          });
        break;
    }
  }

  // Time per step: from the previous finished step (or the wheel's first event) to this one.
  let since = ordered[0]?.clientAt ?? null;
  const stepRecords: StepRecord[] = plan.steps.map((s) => {
    const r = steps.get(s.id);
    if (!r?.at)
      return {
        id: s.id,
        title: s.title,
        status: 'todo',
        reason: null,
        at: null,
        byId: null,
        seconds: null,
      };
    const record = {
      id: s.id,
      title: s.title,
      ...r,
      seconds: since ? Math.max(0, seconds(since, r.at)) : null,
    };
    since = r.at;
    return record;
  });
  return {
    passes: plan.passes.map((pass, i) => ({
      ...pass,
      confirmed: confirmed[i]!,
      complete: confirmed[i]!.length === plan.boltCount,
    })),
    steps: stepRecords,
    measurements,
    inspectionFailed,
    flaggedBolts,
  };
}

/** The median of the gaps between a pass's confirmations, in seconds; null under two bolts. */
export function medianInterval(pass: Pick<PassRecord, 'confirmed'>): number | null {
  const gaps = pass.confirmed
    .map((c) => c.seconds)
    .filter((s): s is number => s !== null)
    .sort((a, b) => a - b);
  if (!gaps.length) return null;
  const mid = Math.floor(gaps.length / 2);
  return gaps.length % 2 ? gaps[mid]! : (gaps[mid - 1]! + gaps[mid]!) / 2;
}
