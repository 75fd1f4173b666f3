import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { ClientEvent } from '@/features/runner/events';
import { reduceRun, submitBlockers, type RunnerPlan } from '@/features/runner/state';
import { stepsFor } from '@/features/runner/steps';
import { tighteningSequence } from '@/features/torque-plan';

const order = tighteningSequence(8, { kind: 'cross' });
const plan: RunnerPlan = {
  steps: stepsFor({ dismount: false, reinstall: false }),
  boltCount: 8,
  passes: [
    { index: 1, kind: 'staged', order },
    { index: 2, kind: 'staged', order },
    { index: 3, kind: 'check', order: [1, 2, 3, 4, 5, 6, 7, 8] },
  ],
};

let n = 0;
const ev = (e: Omit<ClientEvent, 'clientId' | 'clientAt'>, at = n): ClientEvent =>
  ({
    ...e,
    clientId: `00000000-0000-4000-8000-${String(++n).padStart(12, '0')}`,
    clientAt: new Date(Date.UTC(2026, 0, 1, 8, 0, at)).toISOString(),
  }) as ClientEvent;
const confirm = (pass: number, bolt: number) =>
  ev({ type: 'bolt_confirmed', payload: { pass, bolt } });

describe('reduceRun', () => {
  it('walks the steps in order and follows each pass’s sequence', () => {
    const events = [
      ev({ type: 'step_done', payload: { step: 'safety', checklist: [] } }),
      confirm(1, 1),
      confirm(1, 5),
    ];
    const s = reduceRun(plan, events);
    expect(s.current).toBe('clean'); // cleaning and deburring come before the inspection
    expect(s.passes[0]).toMatchObject({ confirmed: [1, 5], next: 3, complete: false });
    expect(s.currentPass).toBe(1);
    expect(s.anomalies).toEqual([]);
  });

  it('counts a bolt confirmed twice (a replay, a second device) once', () => {
    const a = confirm(1, 1);
    const again = { ...confirm(1, 1) };
    const s = reduceRun(plan, [a, a, again]);
    expect(s.passes[0]!.confirmed).toEqual([1]);
    expect(s.eventCount).toBe(2);
  });

  it('gives the same state whatever order the events arrive in', () => {
    const events = [
      ...order.map((b) => confirm(1, b)),
      ...order.slice(0, 3).map((b) => confirm(2, b)),
    ];
    const expected = reduceRun(plan, events);
    fc.assert(
      fc.property(
        fc.shuffledSubarray(events, { minLength: events.length, maxLength: events.length }),
        (shuffled) => {
          expect(reduceRun(plan, shuffled)).toEqual(expected);
        },
      ),
    );
  });

  it('keeps an out-of-sequence confirmation and lists it as an anomaly', () => {
    const s = reduceRun(plan, [confirm(1, 1), confirm(1, 2)]);
    expect(s.passes[0]!.confirmed).toEqual([1, 2]);
    expect(s.anomalies).toEqual([expect.objectContaining({ pass: 1, bolt: 2, expected: 5 })]);
  });

  it('undo takes a bolt back', () => {
    const s = reduceRun(plan, [
      confirm(1, 1),
      confirm(1, 5),
      ev({ type: 'bolt_undone', payload: { pass: 1, bolt: 5 } }),
    ]);
    expect(s.passes[0]).toMatchObject({ confirmed: [1], next: 5 });
  });

  it('the torque step cannot finish before every pass is complete; hand-start before every bolt is started', () => {
    const early = reduceRun(plan, [
      ev({ type: 'step_done', payload: { step: 'torque', checklist: [] } }),
      ev({ type: 'step_done', payload: { step: 'hand_start', checklist: [] } }),
    ]);
    expect(early.status.torque).toBe('todo');
    expect(early.status.hand_start).toBe('todo');
    const started = [1, 2, 3, 4, 5, 6, 7, 8].map((bolt) =>
      ev({ type: 'hand_started', payload: { bolt } }),
    );
    const passes = plan.passes.flatMap((p) => p.order.map((b) => confirm(p.index, b)));
    const done = reduceRun(plan, [
      ...started,
      ev({ type: 'step_done', payload: { step: 'hand_start', checklist: [] } }),
      ...passes,
      ev({ type: 'step_done', payload: { step: 'torque', checklist: [] } }),
    ]);
    expect(done.status).toMatchObject({ hand_start: 'done', torque: 'done' });
    expect(done.currentPass).toBeNull();
  });

  it('a required step cannot be skipped; an optional one can, with its reason', () => {
    const s = reduceRun(plan, [
      ev({ type: 'step_skipped', payload: { step: 'safety', reason: 'in a hurry' } }),
      ev({
        type: 'step_skipped',
        payload: { step: 'clean', reason: 'new wheel, clean from the box' },
      }),
    ]);
    expect(s.status.safety).toBe('todo');
    expect(s.status.clean).toBe('skipped');
    expect(s.skipReasons.clean).toBe('new wheel, clean from the box');
  });

  it('a failed inspection stops the wheel and blocks submit', () => {
    const s = reduceRun(plan, [
      ev({ type: 'inspection_failed', payload: { notes: 'crack at bolt hole 7' } }),
    ]);
    expect(s.current).toBeNull();
    expect(submitBlockers(plan, s, ['bead_outer', 'bead_inner'])[0]).toMatch(
      /crack at bolt hole 7/,
    );
  });

  it('submit needs every step and both bead photos', () => {
    const s = reduceRun(plan, []);
    const blockers = submitBlockers(plan, s, ['bead_outer']);
    expect(blockers).toContain('Photo missing: seated bead, inner face.');
    expect(blockers).toContain('Step not finished: Safety gate.');
  });
});

describe('a repeated pass (a second lap at the same target)', () => {
  it('is its own pass: finishing the first lap does not finish the second', () => {
    const repeated: RunnerPlan = {
      ...plan,
      passes: [
        { index: 1, kind: 'staged', order },
        { index: 2, kind: 'staged', order },
        ...plan.passes.slice(1).map((p, i) => ({ ...p, index: i + 3 })),
      ],
    };
    const s = reduceRun(
      repeated,
      order.map((bolt) => confirm(1, bolt)),
    );
    expect(s.passes.map((p) => p.complete)).toEqual([true, false, false, false]);
    expect(s.currentPass).toBe(2);
    expect(s.passes[1]!.next).toBe(order[0]);
  });
});
