import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { ClientEvent, RunEvent } from '@/features/runner/events';
import { createRunTracker } from '@/features/runner/run-tracker';
import { reduceRun, type RunnerPlan } from '@/features/runner/state';
import { STEP_IDS, stepsFor } from '@/features/runner/steps';
import { tighteningSequence } from '@/features/torque-plan';

const order = tighteningSequence(8, { kind: 'cross' });
const plan: RunnerPlan = {
  steps: stepsFor({ dismount: true, reinstall: false }),
  boltCount: 8,
  passes: [
    { index: 1, kind: 'staged', order },
    { index: 2, kind: 'staged', order },
    { index: 3, kind: 'check', order: [1, 2, 3, 4, 5, 6, 7, 8] },
  ],
};

// Bolts and passes a little past the plan, so refusals inside the reducer are exercised too.
const bolt = fc.integer({ min: 1, max: 9 });
const pass = fc.integer({ min: 1, max: 5 });
const runEvent: fc.Arbitrary<RunEvent> = fc.oneof(
  {
    weight: 6,
    arbitrary: fc
      .record({ pass, bolt, turned: fc.option(fc.boolean(), { nil: undefined }) })
      .map(({ turned, ...p }) => ({
        type: 'bolt_confirmed' as const,
        payload: turned === undefined ? p : { ...p, turned },
      })),
  },
  {
    weight: 2,
    arbitrary: fc
      .record({ pass, bolt })
      .map((payload) => ({ type: 'bolt_undone' as const, payload })),
  },
  {
    weight: 2,
    arbitrary: bolt.map((b) => ({ type: 'hand_started' as const, payload: { bolt: b } })),
  },
  {
    weight: 1,
    arbitrary: bolt.map((b) => ({ type: 'hand_unstarted' as const, payload: { bolt: b } })),
  },
  {
    weight: 2,
    arbitrary: fc
      .constantFrom(...STEP_IDS)
      .map((step) => ({ type: 'step_done' as const, payload: { step, checklist: [] } })),
  },
  {
    weight: 1,
    arbitrary: fc.constantFrom(...STEP_IDS).map((step) => ({
      type: 'step_skipped' as const,
      payload: { step, reason: 'not on this job' },
    })),
  },
  {
    weight: 1,
    arbitrary: pass.map((p) => ({
      type: 'wrench_chosen' as const,
      payload: { pass: p, wrenchId: '11111111-1111-4111-8111-111111111111' },
    })),
  },
  {
    weight: 1,
    arbitrary: bolt.map((b) => ({
      type: 'bolt_flagged' as const,
      payload: { bolt: b, problem: 'stripped' as const },
    })),
  },
  {
    weight: 1,
    arbitrary: fc.constant({
      type: 'inspection_failed' as const,
      payload: { notes: 'cracked ring' },
    }),
  },
);

const idOf = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const at = (second: number) => new Date(Date.UTC(2026, 0, 1, 8, 0, second)).toISOString();

/** What happens to the runner's log between two renders. */
type Change =
  | { kind: 'tap'; event: RunEvent } // the common case: a new event, later than everything
  | { kind: 'late'; event: RunEvent; back: number } // another phone's, pulled late: sorts earlier
  | { kind: 'replay'; index: number; copy: boolean } // a duplicate, the same object or a copy
  | { kind: 'drop'; index: number } // refused for good, or superseded by a send-back
  | { kind: 'retimed'; index: number; shift: number } // the server clamped its clock time
  | { kind: 'reload' }; // a re-render with an equal log in a new array

const change: fc.Arbitrary<Change> = fc.oneof(
  { weight: 8, arbitrary: runEvent.map((event) => ({ kind: 'tap' as const, event })) },
  {
    weight: 2,
    arbitrary: fc
      .record({ event: runEvent, back: fc.integer({ min: 0, max: 30 }) })
      .map((c) => ({ kind: 'late' as const, ...c })),
  },
  {
    weight: 1,
    arbitrary: fc
      .record({ index: fc.nat(), copy: fc.boolean() })
      .map((c) => ({ kind: 'replay' as const, ...c })),
  },
  { weight: 1, arbitrary: fc.nat().map((index) => ({ kind: 'drop' as const, index })) },
  {
    weight: 1,
    arbitrary: fc
      .record({ index: fc.nat(), shift: fc.integer({ min: -20, max: 20 }) })
      .map((c) => ({ kind: 'retimed' as const, ...c })),
  },
  { weight: 1, arbitrary: fc.constant({ kind: 'reload' as const }) },
);

/** Plays the changes, checking the tracker against a full reduce after each one. */
function play(changes: Change[]) {
  const track = createRunTracker(plan);
  let log: ClientEvent[] = [];
  let clock = 100;
  let ids = 0;
  const make = (event: RunEvent, second: number) =>
    ({ ...event, clientId: idOf(++ids), clientAt: at(second) }) as ClientEvent;
  for (const c of changes) {
    const pick = (i: number) => log[i % Math.max(1, log.length)];
    if (c.kind === 'tap') log = [...log, make(c.event, (clock += 1))];
    else if (c.kind === 'late') log = [...log, make(c.event, clock - c.back)];
    else if (c.kind === 'replay' && pick(c.index)) {
      const e = pick(c.index)!;
      log = [...log, c.copy ? structuredClone(e) : e];
    } else if (c.kind === 'drop' && pick(c.index)) {
      const gone = pick(c.index)!.clientId;
      log = log.filter((e) => e.clientId !== gone);
    } else if (c.kind === 'retimed' && pick(c.index)) {
      const e = pick(c.index)!;
      const moved = { ...e, clientAt: at(clock + c.shift) };
      log = log.map((x) => (x === e ? moved : x));
    } else log = [...log];
    expect(track(log)).toEqual(reduceRun(plan, log));
  }
}

describe('the runner’s incremental reduce', () => {
  it('gives exactly the full reduce over any log: taps, late and duplicate events, drops, clock changes', () => {
    fc.assert(fc.property(fc.array(change, { maxLength: 80 }), play), { numRuns: 300 });
  });

  it('a whole pass tapped one bolt at a time ends where the full reduce does', () => {
    const taps: Change[] = [...order, ...order].map((b, i) => ({
      kind: 'tap',
      event: { type: 'bolt_confirmed', payload: { pass: i < 8 ? 1 : 2, bolt: b } },
    }));
    play(taps);
  });

  it('hands back the same state when nothing new came (the screen has nothing to redraw)', () => {
    const track = createRunTracker(plan);
    const log = [
      { type: 'hand_started', payload: { bolt: 1 }, clientId: idOf(1), clientAt: at(1) },
    ] as ClientEvent[];
    const first = track(log);
    expect(track([...log])).toBe(first);
    expect(track([...log, { ...log[0]! }])).toBe(first);
  });
});
