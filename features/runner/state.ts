import type { ClientEvent } from './events';
import type { Step, StepId } from './steps';

export type RunnerPass = { index: number; kind: 'staged' | 'check'; order: number[] };
export type RunnerPlan = { steps: Step[]; boltCount: number; passes: RunnerPass[] };

export type PassProgress = RunnerPass & { confirmed: number[]; next: number | null; complete: boolean; wrenchId: string | null };
export type Anomaly = { at: string; pass: number; bolt: number; expected: number | null };

export type RunnerState = {
  status: Record<string, 'done' | 'skipped' | 'todo'>;
  skipReasons: Record<string, string>;
  measurements: Record<string, { value: number; unit: 'psi' | 'kPa' | 'bar' }>;
  /** The first step not yet done or skipped; null once everything before submit is done, or when flagged. */
  current: StepId | null;
  flagged: string | null;
  handStarted: number[];
  passes: PassProgress[];
  /** The first pass not yet complete. */
  currentPass: number | null;
  anomalies: Anomaly[];
  /** When each step was finished (device time), to show time per step. */
  doneAt: Record<string, string>;
  eventCount: number;
};

/** Events in the order they happened on the devices; ties broken by id so every device agrees. */
export function orderEvents<E extends Pick<ClientEvent, 'clientAt' | 'clientId'>>(events: readonly E[]): E[] {
  return [...events].sort((a, b) => a.clientAt.localeCompare(b.clientAt) || a.clientId.localeCompare(b.clientId));
}

/**
 * The wheel's progress from its events. Pure and order-independent in its input: events are
 * sorted first, a bolt confirmed twice (two devices, a replay) counts once, and a confirmation
 * out of the planned order is kept but listed as an anomaly.
 */
export function reduceRun(plan: RunnerPlan, events: readonly ClientEvent[]): RunnerState {
  const status: RunnerState['status'] = Object.fromEntries(plan.steps.map((s) => [s.id, 'todo']));
  const skipReasons: RunnerState['skipReasons'] = {};
  const measurements: RunnerState['measurements'] = {};
  const doneAt: RunnerState['doneAt'] = {};
  const started = new Set<number>();
  const confirmed = plan.passes.map(() => new Set<number>());
  const orderDone = plan.passes.map(() => [] as number[]);
  const wrench: (string | null)[] = plan.passes.map(() => null);
  const anomalies: Anomaly[] = [];
  let flagged: string | null = null;
  const seen = new Set<string>();

  const nextOf = (p: number) => plan.passes[p]!.order.find((b) => !confirmed[p]!.has(b)) ?? null;
  const currentPassIndex = () => plan.passes.findIndex((_, p) => confirmed[p]!.size < plan.boltCount);
  const canFinish = (step: StepId) => {
    if (step === 'hand_start') return started.size === plan.boltCount;
    if (step === 'torque') return currentPassIndex() === -1;
    return true;
  };

  for (const e of orderEvents(events)) {
    if (seen.has(e.clientId)) continue;
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
      case 'hand_started':
        if (e.payload.bolt <= plan.boltCount) started.add(e.payload.bolt);
        break;
      case 'hand_unstarted':
        started.delete(e.payload.bolt);
        break;
      case 'wrench_chosen':
        if (plan.passes[e.payload.pass - 1]) wrench[e.payload.pass - 1] = e.payload.wrenchId;
        break;
      case 'bolt_confirmed': {
        const p = e.payload.pass - 1;
        if (!plan.passes[p] || e.payload.bolt > plan.boltCount || confirmed[p]!.has(e.payload.bolt)) break;
        const expectedPass = currentPassIndex();
        const expected = p === expectedPass ? nextOf(p) : expectedPass >= 0 ? nextOf(expectedPass) : null;
        if (p !== expectedPass || e.payload.bolt !== expected) anomalies.push({ at: e.clientAt, pass: p + 1, bolt: e.payload.bolt, expected });
        confirmed[p]!.add(e.payload.bolt);
        orderDone[p]!.push(e.payload.bolt);
        break;
      }
      case 'bolt_undone': {
        const p = e.payload.pass - 1;
        if (confirmed[p]?.delete(e.payload.bolt)) orderDone[p] = orderDone[p]!.filter((b) => b !== e.payload.bolt);
        break;
      }
    }
  }

  const passes: PassProgress[] = plan.passes.map((pass, p) => ({
    ...pass,
    confirmed: orderDone[p]!,
    next: nextOf(p),
    complete: confirmed[p]!.size === plan.boltCount,
    wrenchId: wrench[p]!,
  }));
  const cp = currentPassIndex();
  const current = flagged ? null : ((plan.steps.find((s) => s.id !== 'submit' && status[s.id] === 'todo')?.id ?? null) as StepId | null);
  return { status, skipReasons, measurements, current, flagged, handStarted: [...started].sort((a, b) => a - b), passes, currentPass: cp === -1 ? null : cp + 1, anomalies, doneAt, eventCount: seen.size };
}

/** What still stands between this wheel and submit; empty when it may be submitted. */
export function submitBlockers(plan: RunnerPlan, state: RunnerState, photoKinds: readonly string[]): string[] {
  const blockers: string[] = [];
  if (state.flagged) blockers.push(`The inspection failed: ${state.flagged}. A lead must look at this wheel.`);
  for (const s of plan.steps) {
    if (s.id !== 'submit' && state.status[s.id] === 'todo') blockers.push(`Step not finished: ${s.title}.`);
  }
  for (const kind of ['bead_outer', 'bead_inner']) {
    if (!photoKinds.includes(kind)) blockers.push(kind === 'bead_outer' ? 'Photo missing: seated bead, outer face.' : 'Photo missing: seated bead, inner face.');
  }
  return blockers;
}
