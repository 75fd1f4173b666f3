import { convertPressure, UNIT_LABELS, type Pressure } from '@/features/torque-plan';
import { orderEvents, type RunnerPlan, type RunnerState } from '@/features/runner/state';
import type { Step } from '@/features/runner/steps';
import { passWords } from './words';
import { POINTS, type Finding } from './scoring-parts';
import type { PracticeEvent, PracticeSetup } from './types';

type StepDone = Extract<PracticeEvent, { type: 'step_done' }>;

// Pressure words name both units (NIST SP 811: 1 psi = 6.894 757 kPa, through the engine).
const OTHER = { psi: 'kPa', kPa: 'psi', bar: 'psi' } as const;
const pressureWords = (p: Pressure) => {
  const digits = (unit: Pressure['unit']) => (unit === 'bar' ? 3 : 1);
  const other = convertPressure(p.value, p.unit, OTHER[p.unit]);
  return `${Number(p.value.toFixed(digits(p.unit)))} ${UNIT_LABELS[p.unit]} (${Number(other.toFixed(digits(OTHER[p.unit])))} ${UNIT_LABELS[OTHER[p.unit]]})`;
};

/** The step_done the runner counted: the first one for the step at the time it was marked done. */
function countedDone(step: string, state: RunnerState, events: readonly PracticeEvent[]) {
  return orderEvents(events).find(
    (e): e is StepDone =>
      e.type === 'step_done' && e.payload.step === step && e.clientAt === state.doneAt[step],
  );
}

/**
 * Cautions and checks, then completion. A checklist item left unticked on a safety step (the steps
 * that cannot be skipped: safety gate, inspection, seating the bead) is a skipped caution: each of
 * those items is what its caution asks for. On any other step it is a skipped check; a whole step
 * skipped counts as its checks skipped. Completion is shared out over the steps before submit.
 */
export function judgeSteps(
  setup: PracticeSetup,
  plan: RunnerPlan,
  state: RunnerState,
  events: readonly PracticeEvent[],
  completionMax: number,
): Finding[] {
  const findings: Finding[] = [];
  const steps = plan.steps.filter((s) => s.id !== 'submit');
  for (const step of steps) {
    const status = state.status[step.id];
    if (status === 'skipped' && step.checklist.length > 0) {
      findings.push({
        part: 'checks',
        kind: 'skipped_check',
        step: step.id,
        pass: null,
        bolt: null,
        expected: step.checklist.map((c) => c.text).join(' '),
        message: `${step.title} was skipped ("${state.skipReasons[step.id] ?? ''}"): none of its ${step.checklist.length} checks were done.`,
        points: POINTS.skippedCheck * step.checklist.length,
      });
    }
    if (status === 'done')
      findings.push(...missingChecks(step, countedDone(step.id, state, events)));
  }
  findings.push(...beadPastLimit(setup, state));
  // Completion: each step's share of the part, so all of them together make exactly its maximum.
  steps.forEach((step, i) => {
    if (state.status[step.id] !== 'todo') return;
    const share =
      Math.round((completionMax * (i + 1)) / steps.length) -
      Math.round((completionMax * i) / steps.length);
    findings.push({
      part: 'completion',
      kind: 'unfinished',
      step: step.id,
      pass: null,
      bolt: null,
      expected: null,
      message: `${step.title} was not finished${progressWords(setup, plan, state, step)}.`,
      points: share,
    });
  });
  return findings;
}

function missingChecks(step: Step, done: StepDone | undefined): Finding[] {
  const ticked = new Set(done?.payload.checklist ?? []);
  const safety = Boolean(step.required);
  return step.checklist
    .filter((item) => !ticked.has(item.id))
    .map((item) => ({
      part: 'checks' as const,
      kind: safety ? ('skipped_caution' as const) : ('skipped_check' as const),
      step: step.id,
      pass: null,
      bolt: null,
      expected: item.text,
      message: safety
        ? `${step.title} was marked done without "${item.text}" ${step.cautions[0] ? `The caution: ${step.cautions[0]}` : ''}`.trim()
        : `${step.title} was marked done without "${item.text}"`,
      points: safety ? POINTS.skippedSafetyCheck : POINTS.skippedCheck,
    }));
}

/** The highest pressure used to seat the bead, against the spec's bead-seating limit. */
function beadPastLimit(setup: PracticeSetup, state: RunnerState): Finding[] {
  const used = state.measurements.seat_bead;
  const limit = setup.snapshot.spec.maxBeadSeatPressure;
  if (!used || convertPressure(used.value, used.unit, limit.unit) <= limit.value + 1e-9) return [];
  return [
    {
      part: 'checks',
      kind: 'skipped_caution',
      step: 'seat_bead',
      pass: null,
      bolt: null,
      expected: `at most ${pressureWords(limit)}`,
      message: `The bead was seated at ${pressureWords(used)}, past the tire's ${pressureWords(limit)} bead-seating limit. If the bead has not seated by the limit, stop, let the air out and find out why.`,
      points: POINTS.beadPastLimit,
    },
  ];
}

function progressWords(setup: PracticeSetup, plan: RunnerPlan, state: RunnerState, step: Step) {
  if (step.id === 'hand_start')
    return `: ${state.handStarted.length} of ${plan.boltCount} bolts started by hand`;
  if (step.id !== 'torque') return '';
  const open = state.passes.find((p) => !p.complete);
  return open
    ? `: ${passWords(setup, open.index)} has ${open.confirmed.length} of ${plan.boltCount} bolts`
    : '';
}

/**
 * Seconds on each finished step, from the events' own times: from the previous step's finish (or
 * the attempt's start, when the setup was drawn, else its first event) to this step's.
 */
export function secondsPerStep(
  setup: PracticeSetup,
  plan: RunnerPlan,
  state: RunnerState,
  events: readonly PracticeEvent[],
): Record<string, number> {
  const first = orderEvents(events)[0]?.clientAt;
  if (!first) return {};
  const out: Record<string, number> = {};
  const started = Date.parse(setup.snapshot.takenAt);
  let from = Number.isFinite(started) ? Math.min(started, Date.parse(first)) : Date.parse(first);
  for (const step of plan.steps) {
    const at = state.doneAt[step.id];
    if (!at) continue;
    const end = Date.parse(at);
    out[step.id] = Math.max(0, Math.round((end - from) / 1000));
    from = Math.max(from, end);
  }
  return out;
}
