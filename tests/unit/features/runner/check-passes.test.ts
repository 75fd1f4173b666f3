import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { clientEventSchema, MAX_CHECK_PASSES, type ClientEvent } from '@/features/runner/events';
import {
  maxPassIndex,
  plannedPassOf,
  reduceRun,
  submitBlockers,
  type RunnerPlan,
} from '@/features/runner/state';
import { stepsFor } from '@/features/runner/steps';
import { handStartOrder, tighteningSequence } from '@/features/torque-plan';

const order = tighteningSequence(8, { kind: 'cross' });
const sequential = [1, 2, 3, 4, 5, 6, 7, 8];
// Two staged laps at the same fraction (a repeated fraction), a final pass, then the check pass.
const plan: RunnerPlan = {
  steps: stepsFor({ dismount: false, reinstall: false }),
  boltCount: 8,
  passes: [
    { index: 1, kind: 'staged', order },
    { index: 2, kind: 'staged', order },
    { index: 3, kind: 'staged', order },
    { index: 4, kind: 'check', order: sequential },
  ],
};

let n = 0;
const ev = (e: Omit<ClientEvent, 'clientId' | 'clientAt'>): ClientEvent =>
  ({
    ...e,
    clientId: `00000000-0000-4000-8000-${String(++n).padStart(12, '0')}`,
    clientAt: new Date(Date.UTC(2026, 0, 1, 8, 0, 0, n * 10)).toISOString(),
  }) as ClientEvent;
const confirm = (pass: number, bolt: number, turned?: boolean) =>
  ev({
    type: 'bolt_confirmed',
    payload: { pass, bolt, ...(turned === undefined ? {} : { turned }) },
  });
const lap = (pass: number, turnedBolts: number[] = []) =>
  (pass < 4 ? order : sequential).map((b) =>
    confirm(pass, b, pass >= 4 ? turnedBolts.includes(b) : undefined),
  );
const staged = () => [...lap(1), ...lap(2), ...lap(3)];

// ASME PCC-1 practice (from memory): check passes at the final torque until no nut turns.
describe('check passes until no bolt turns (ASME PCC-1 practice, from memory)', () => {
  it('a repeated fraction is still its own lap: two full laps are needed before the third pass', () => {
    const s = reduceRun(plan, lap(1));
    expect(s.passes.map((p) => p.complete)).toEqual([true, false, false, false]);
    expect(s.currentPass).toBe(2);
  });

  it('a clean check pass ends the torque: no pass is added', () => {
    const s = reduceRun(plan, [...staged(), ...lap(4)]);
    expect(s.passes).toHaveLength(4);
    expect(s.currentPass).toBeNull();
    expect(s.passes[3]).toMatchObject({ added: false, turned: [], complete: true });
  });

  it('one bolt that turned adds a check pass in the same sequential order, and the torque step waits for it', () => {
    const s = reduceRun(plan, [
      ...staged(),
      ...lap(4, [6]),
      ev({ type: 'step_done', payload: { step: 'torque', checklist: [] } }),
    ]);
    expect(s.passes).toHaveLength(5);
    expect(s.passes[3]).toMatchObject({ turned: [6], complete: true });
    expect(s.passes[4]).toMatchObject({
      index: 5,
      kind: 'check',
      order: sequential,
      added: true,
      next: 1,
      complete: false,
    });
    expect(s.currentPass).toBe(5);
    expect(s.status.torque).toBe('todo');
  });

  it('the added pass is followed by another while bolts still turn, and a clean one ends it', () => {
    const s = reduceRun(plan, [
      ...staged(),
      ...lap(4, [6]),
      ...lap(5, [2]),
      ...lap(6),
      ev({ type: 'step_done', payload: { step: 'torque', checklist: [] } }),
    ]);
    expect(s.passes.map((p) => p.index)).toEqual([1, 2, 3, 4, 5, 6]);
    expect(s.currentPass).toBeNull();
    expect(s.status.torque).toBe('done');
    expect(s.anomalies).toEqual([]);
  });

  it('a confirmation for a check pass not yet due (no bolt turned before it) is ignored', () => {
    const s = reduceRun(plan, [...staged(), ...lap(4), confirm(5, 1)]);
    expect(s.passes).toHaveLength(4);
    expect(s.eventCount).toBe(8 * 4 + 1);
  });

  it('undoing the turned bolt (a wrong tap) takes the added pass away again', () => {
    const s = reduceRun(plan, [
      ...staged(),
      ...lap(4, [8]),
      ev({ type: 'bolt_undone', payload: { pass: 4, bolt: 8 } }),
      confirm(4, 8, false),
    ]);
    expect(s.passes).toHaveLength(4);
    expect(s.currentPass).toBeNull();
  });

  it('"turned" on a staged pass adds nothing', () => {
    const s = reduceRun(plan, [
      ...lap(1)
        .map((e, i) => (i === 0 ? confirm(1, order[0]!, true) : e))
        .slice(0, 1),
      ...lap(1).slice(1),
    ]);
    expect(s.passes).toHaveLength(4);
    expect(s.passes[0]!.turned).toEqual([]);
  });

  it(`stops at ${MAX_CHECK_PASSES} check passes in all and sends the wheel to a lead if a bolt still turned`, () => {
    const laps = Array.from({ length: MAX_CHECK_PASSES }, (_, k) => lap(4 + k, [3]));
    const s = reduceRun(plan, [...staged(), ...laps.flat()]);
    expect(s.passes).toHaveLength(3 + MAX_CHECK_PASSES);
    expect(s.checkPassLimitReached).toBe(true);
    expect(submitBlockers(plan, s, ['bead_outer', 'bead_inner'])).toContain(
      `A bolt still turned on check pass ${3 + MAX_CHECK_PASSES}, the last one allowed. A lead must look at this wheel.`,
    );
    expect(maxPassIndex(plan.passes)).toBe(3 + MAX_CHECK_PASSES);
  });

  it('an added check pass takes the plan check pass’s target', () => {
    const targets = [{ t: 30 }, { t: 70 }, { t: 100 }, { t: 100.5 }];
    expect(plannedPassOf(targets, 4)).toEqual({ t: 100.5 });
    expect(plannedPassOf(targets, 7)).toEqual({ t: 100.5 });
    expect(plannedPassOf(targets, 2)).toEqual({ t: 70 });
  });

  it('gives the same state whatever order the events arrive in (shuffled)', () => {
    const events = [...staged(), ...lap(4, [2, 7]), ...lap(5, [5]), ...lap(6).slice(0, 3)];
    const expected = reduceRun(plan, events);
    expect(expected.passes).toHaveLength(6);
    fc.assert(
      fc.property(
        fc.shuffledSubarray(events, { minLength: events.length, maxLength: events.length }),
        (shuffled) => {
          expect(reduceRun(plan, shuffled)).toEqual(expected);
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe('hand-start in the cross order', () => {
  it('suggests bolt 1, then the opposite one, then the quarters, skipping bolts already started', () => {
    expect(reduceRun(plan, []).nextHandStart).toBe(1);
    const started = (bolts: number[]) =>
      bolts.map((bolt) => ev({ type: 'hand_started', payload: { bolt } }));
    expect(reduceRun(plan, started([1])).nextHandStart).toBe(5);
    expect(reduceRun(plan, started([1, 5])).nextHandStart).toBe(3);
    expect(reduceRun(plan, started([1, 3])).nextHandStart).toBe(5);
    expect(reduceRun(plan, started(handStartOrder(8))).nextHandStart).toBeNull();
  });
});

describe('a bolt that stops the wheel', () => {
  it('flags the wheel, lists the bolt with its problem, and blocks submit', () => {
    const s = reduceRun(plan, [
      ...lap(1).slice(0, 3),
      ev({ type: 'bolt_flagged', payload: { bolt: 3, pass: 1, problem: 'stripped' } }),
    ]);
    expect(s.flaggedBolts).toEqual([{ bolt: 3, pass: 1, problem: 'stripped', note: '' }]);
    expect(s.flagged).toBe('Bolt 3 (pass 1): stripped thread');
    expect(s.current).toBeNull();
    expect(submitBlockers(plan, s, ['bead_outer', 'bead_inner'])[0]).toBe(
      'A bolt stopped the wheel: Bolt 3 (pass 1): stripped thread. A lead must look at this wheel.',
    );
  });

  it('during hand-start (no pass) it says so', () => {
    const s = reduceRun(plan, [
      ev({
        type: 'bolt_flagged',
        payload: { bolt: 7, problem: 'cross_threaded', note: 'galled at the root' },
      }),
    ]);
    expect(s.flaggedBolts).toEqual([
      { bolt: 7, pass: null, problem: 'cross_threaded', note: 'galled at the root' },
    ]);
    expect(s.flagged).toBe('Bolt 7 (hand-start): cross-threaded — galled at the root');
  });

  it('the schema needs a note for "other", and refuses an unknown problem or a bolt off the ring', () => {
    const base = {
      clientId: '00000000-0000-4000-8000-000000000999',
      clientAt: '2026-01-01T08:00:00.000Z',
      type: 'bolt_flagged',
    };
    expect(
      clientEventSchema.safeParse({ ...base, payload: { bolt: 2, problem: 'other' } }).success,
    ).toBe(false);
    expect(
      clientEventSchema.safeParse({
        ...base,
        payload: { bolt: 2, problem: 'other', note: 'head rounded off' },
      }).success,
    ).toBe(true);
    expect(
      clientEventSchema.safeParse({ ...base, payload: { bolt: 2, problem: 'melted' } }).success,
    ).toBe(false);
    expect(
      clientEventSchema.safeParse({ ...base, payload: { bolt: 65, problem: 'spins' } }).success,
    ).toBe(false);
  });
});
