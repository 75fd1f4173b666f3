import { handStartOrder } from '@/features/torque-plan';
import { boltFlagReason, MAX_CHECK_PASSES, type BoltProblem } from './event-constants';
import type { ClientEvent } from './events';
import { missingPhotos, PHOTO_KIND_INFO } from './photo-kinds';
import type { Step, StepId } from './steps';

export type RunnerPass = { index: number; kind: 'staged' | 'check'; order: number[] };
export type RunnerPlan = { steps: Step[]; boltCount: number; passes: RunnerPass[] };

/**
 * `added`: a check pass the runner appended because a bolt turned on the check pass before it
 * (its index is past the plan's; its target is the plan's check pass's, see `plannedPassOf`).
 * `turned`: the bolts of a check pass confirmed as having turned before the wrench clicked.
 */
export type PassProgress = RunnerPass & {
  confirmed: number[];
  next: number | null;
  complete: boolean;
  wrenchId: string | null;
  added: boolean;
  turned: number[];
};
export type Anomaly = { at: string; pass: number; bolt: number; expected: number | null };
/** A bolt that stopped the wheel; `pass` is null when it was flagged during hand-start. */
export type FlaggedBolt = { bolt: number; pass: number | null; problem: BoltProblem; note: string };

export type RunnerState = {
  status: Record<string, 'done' | 'skipped' | 'todo'>;
  skipReasons: Record<string, string>;
  measurements: Record<string, { value: number; unit: 'psi' | 'kPa' | 'bar' }>;
  /** The first step not yet done or skipped; null once everything before submit is done, or when flagged. */
  current: StepId | null;
  /** Why the wheel stopped for a lead (a failed inspection or a flagged bolt), else null. */
  flagged: string | null;
  flaggedBolts: FlaggedBolt[];
  handStarted: number[];
  /** The next bolt to start by hand in the cross order (`handStartOrder`), null once all are started. */
  nextHandStart: number | null;
  /** The plan's passes, then any check passes added because a bolt turned. */
  passes: PassProgress[];
  /** The first pass not yet complete. */
  currentPass: number | null;
  /** A bolt still turned on the last check pass allowed (MAX_CHECK_PASSES): a lead must look at the wheel. */
  checkPassLimitReached: boolean;
  anomalies: Anomaly[];
  /** When each step was finished (device time), to show time per step. */
  doneAt: Record<string, string>;
  eventCount: number;
};

/**
 * The plan's pass an added check pass repeats (the plan's last pass, its check pass), or the
 * pass itself; for its target and wrench setting. `index` is 1-based as in the events.
 */
export function plannedPassOf<P>(planPasses: readonly P[], index: number): P | undefined {
  return planPasses[Math.min(index, planPasses.length) - 1];
}

/** The highest pass index a wheel's events may name: the plan's, plus the check passes that may be added. */
export function maxPassIndex(planPasses: readonly { kind: 'staged' | 'check' }[]): number {
  return planPasses.at(-1)?.kind === 'check'
    ? planPasses.length + MAX_CHECK_PASSES - 1
    : planPasses.length;
}

function safeHandStartOrder(boltCount: number): number[] {
  try {
    return handStartOrder(boltCount);
  } catch {
    return Array.from({ length: Math.max(0, boltCount) }, (_, i) => i + 1);
  }
}

/** Events in the order they happened on the devices; ties broken by id so every device agrees. */
export function orderEvents<E extends Pick<ClientEvent, 'clientAt' | 'clientId'>>(
  events: readonly E[],
): E[] {
  return [...events].sort(
    (a, b) => a.clientAt.localeCompare(b.clientAt) || a.clientId.localeCompare(b.clientId),
  );
}

/**
 * The wheel's progress from its events. Pure and order-independent in its input: events are
 * sorted first, a bolt confirmed twice (two devices, a replay) counts once, and a confirmation
 * out of the planned order is kept but listed as an anomaly.
 */
export function reduceRun(plan: RunnerPlan, events: readonly ClientEvent[]): RunnerState {
  const run = startRun(plan);
  for (const e of orderEvents(events)) run.apply(e);
  return run.state();
}

/**
 * `reduceRun`'s running totals: `apply` takes events in `orderEvents` order (a duplicate id is
 * skipped), `state` reads the progress so far as a fresh object. Lets the runner add a tap to
 * what it already reduced (./run-tracker.ts) instead of reducing the whole log again.
 */
export type RunAccumulator = { apply: (e: ClientEvent) => void; state: () => RunnerState };

export function startRun(plan: RunnerPlan): RunAccumulator {
  const status: RunnerState['status'] = Object.fromEntries(plan.steps.map((s) => [s.id, 'todo']));
  const skipReasons: RunnerState['skipReasons'] = {};
  const measurements: RunnerState['measurements'] = {};
  const doneAt: RunnerState['doneAt'] = {};
  const started = new Set<number>();
  // Room for every pass the wheel may have: the plan's, then added check passes.
  const planCount = plan.passes.length;
  const passCount = maxPassIndex(plan.passes);
  const passAt = (p: number): RunnerPass =>
    plan.passes[p] ?? { index: p + 1, kind: 'check', order: plan.passes[planCount - 1]!.order };
  const confirmed = Array.from({ length: passCount }, () => new Set<number>());
  const turned = Array.from({ length: passCount }, () => new Set<number>());
  const orderDone = Array.from({ length: passCount }, () => [] as number[]);
  const wrench: (string | null)[] = Array.from({ length: passCount }, () => null);
  const anomalies: Anomaly[] = [];
  const flaggedBolts: FlaggedBolt[] = [];
  let flagged: string | null = null;
  const seen = new Set<string>();

  /**
   * How many passes the wheel has now. ASME PCC-1 practice (from memory): after the final round,
   * check passes at 100 % until no nut turns. So each check pass on which some bolt turned is
   * followed by another check pass, up to MAX_CHECK_PASSES in all.
   */
  const activeCount = () => {
    let n = planCount;
    while (n < passCount && turned[n - 1]!.size > 0) n++;
    return n;
  };
  const nextOf = (p: number) => passAt(p).order.find((b) => !confirmed[p]!.has(b)) ?? null;
  const currentPassIndex = () => {
    const n = activeCount();
    for (let p = 0; p < n; p++) if (confirmed[p]!.size < plan.boltCount) return p;
    return -1;
  };
  const canFinish = (step: StepId) => {
    if (step === 'hand_start') return started.size === plan.boltCount;
    if (step === 'torque') return currentPassIndex() === -1;
    return true;
  };

  const handOrder = safeHandStartOrder(plan.boltCount);

  const apply = (e: ClientEvent) => {
    if (seen.has(e.clientId)) return;
    seen.add(e.clientId);
    switch (e.type) {
      case 'step_done':
        if (status[e.payload.step] && canFinish(e.payload.step)) {
          status[e.payload.step] = 'done';
          doneAt[e.payload.step] = e.clientAt;
          if (e.payload.measurement) measurements[e.payload.step] = e.payload.measurement;
        }
        break;
      case 'step_skipped': {
        const step = plan.steps.find((s) => s.id === e.payload.step);
        if (step && !step.required && status[step.id] === 'todo') {
          status[step.id] = 'skipped';
          skipReasons[step.id] = e.payload.reason;
          doneAt[step.id] = e.clientAt;
        }
        break;
      }
      case 'inspection_failed':
        flagged = e.payload.notes;
        break;
      case 'bolt_flagged':
        if (e.payload.bolt > plan.boltCount) break;
        flaggedBolts.push({
          bolt: e.payload.bolt,
          pass: e.payload.pass ?? null,
          problem: e.payload.problem,
          note: e.payload.note ?? '',
        });
        flagged = boltFlagReason(e.payload);
        break;
      case 'hand_started':
        if (e.payload.bolt <= plan.boltCount) started.add(e.payload.bolt);
        break;
      case 'hand_unstarted':
        started.delete(e.payload.bolt);
        break;
      case 'wrench_chosen':
        if (e.payload.pass <= passCount) wrench[e.payload.pass - 1] = e.payload.wrenchId;
        break;
      case 'bolt_confirmed': {
        const p = e.payload.pass - 1;
        // An added check pass not yet due (no bolt turned on the one before) is ignored.
        if (
          p >= activeCount() ||
          e.payload.bolt > plan.boltCount ||
          confirmed[p]!.has(e.payload.bolt)
        )
          break;
        const expectedPass = currentPassIndex();
        const expected =
          p === expectedPass ? nextOf(p) : expectedPass >= 0 ? nextOf(expectedPass) : null;
        if (p !== expectedPass || e.payload.bolt !== expected)
          anomalies.push({ at: e.clientAt, pass: p + 1, bolt: e.payload.bolt, expected });
        confirmed[p]!.add(e.payload.bolt);
        orderDone[p]!.push(e.payload.bolt);
        if (e.payload.turned && passAt(p).kind === 'check') turned[p]!.add(e.payload.bolt);
        break;
      }
      case 'bolt_undone': {
        const p = e.payload.pass - 1;
        turned[p]?.delete(e.payload.bolt);
        if (confirmed[p]?.delete(e.payload.bolt))
          orderDone[p] = orderDone[p]!.filter((b) => b !== e.payload.bolt);
        break;
      }
    }
  };

  // Copies of everything `apply` goes on changing: a state handed out never changes under React.
  const state = (): RunnerState => {
    const count = activeCount();
    const passes: PassProgress[] = Array.from({ length: count }, (_, p) => ({
      ...passAt(p),
      confirmed: [...orderDone[p]!],
      next: nextOf(p),
      complete: confirmed[p]!.size === plan.boltCount,
      wrenchId: wrench[p]!,
      added: p >= planCount,
      turned: [...turned[p]!].sort((a, b) => a - b),
    }));
    const cp = currentPassIndex();
    const checkPassLimitReached =
      passCount > planCount && count === passCount && turned[passCount - 1]!.size > 0;
    const current = flagged
      ? null
      : ((plan.steps.find((s) => s.id !== 'submit' && status[s.id] === 'todo')?.id ??
          null) as StepId | null);
    const nextHandStart = handOrder.find((b) => !started.has(b)) ?? null;
    return {
      status: { ...status },
      skipReasons: { ...skipReasons },
      measurements: { ...measurements },
      current,
      flagged,
      flaggedBolts: [...flaggedBolts],
      handStarted: [...started].sort((a, b) => a - b),
      nextHandStart,
      passes,
      currentPass: cp === -1 ? null : cp + 1,
      checkPassLimitReached,
      anomalies: [...anomalies],
      doneAt: { ...doneAt },
      eventCount: seen.size,
    };
  };
  return { apply, state };
}

/** What still stands between this wheel and submit; empty when it may be submitted. */
export function submitBlockers(
  plan: RunnerPlan,
  state: RunnerState,
  photoKinds: readonly string[],
): string[] {
  const blockers: string[] = [];
  if (state.flagged)
    blockers.push(
      state.flaggedBolts.length
        ? `A bolt stopped the wheel: ${state.flagged}. A lead must look at this wheel.`
        : `The inspection failed: ${state.flagged}. A lead must look at this wheel.`,
    );
  if (state.checkPassLimitReached)
    blockers.push(
      `A bolt still turned on check pass ${state.passes.length}, the last one allowed. A lead must look at this wheel.`,
    );
  for (const s of plan.steps) {
    if (s.id !== 'submit' && state.status[s.id] === 'todo')
      blockers.push(`Step not finished: ${s.title}.`);
  }
  for (const kind of missingPhotos(photoKinds)) {
    const label = PHOTO_KIND_INFO[kind].label;
    blockers.push(`Photo missing: ${label.charAt(0).toLowerCase()}${label.slice(1)}.`);
  }
  return blockers;
}
