import { describe, expect, it } from 'vitest';
import { clampClientAt } from '@/features/runner/clock-window';
import { planFromSnapshot, takeSnapshot } from '@/features/runner/snapshot';

const now = new Date('2026-06-10T12:00:00.000Z');

describe("a phone's clock against the server's", () => {
  it('keeps a time within a day back and five minutes ahead as it is', () => {
    expect(clampClientAt('2026-06-09T12:00:00.000Z', now)).toEqual({
      clientAt: '2026-06-09T12:00:00.000Z',
      deviceAt: null,
    });
    expect(clampClientAt('2026-06-10T12:05:00.000Z', now)).toEqual({
      clientAt: '2026-06-10T12:05:00.000Z',
      deviceAt: null,
    });
  });
  it('pulls a clock that says 9999 (or 2001) to the edge of the window and keeps what it said', () => {
    expect(clampClientAt('9999-01-01T00:00:00.000Z', now)).toEqual({
      clientAt: '2026-06-10T12:05:00.000Z',
      deviceAt: '9999-01-01T00:00:00.000Z',
    });
    expect(clampClientAt('2001-01-01T00:00:00.000Z', now)).toEqual({
      clientAt: '2026-06-09T12:00:00.000Z',
      deviceAt: '2001-01-01T00:00:00.000Z',
    });
  });
});

describe('the wheel snapshot', () => {
  const spec = {
    id: 's1',
    name: 'Ring',
    boltCount: 8,
    boltThread: 'M8',
    finalTorque: 12,
    torqueUnit: 'lbf-ft' as const,
    passFractions: [0.3, 0.7, 1],
    patternKind: 'cross' as const,
    skipStep: null,
    checkPass: true,
    lugTorque: 90,
    lugTorqueUnit: 'lbf-ft' as const,
    lugCount: 4,
    maxBeadSeatPressure: 30,
    runningPressure: 14,
    pressureUnit: 'psi' as const,
    makerReference: 'Sheet 4',
    notes: 'Ring is handed',
    threadCondition: 'anti_seize' as const,
    boltReuse: 'Replace at every tire change',
  };
  it('keeps every number with its unit, and gives the runner the same plan the spec would', () => {
    const snap = takeSnapshot(spec, { targetPressure: 12, pressureUnit: 'psi' }, now);
    expect(snap.plan.passes.map((p) => [p.index, p.kind, p.target.value, p.target.unit])).toEqual([
      [1, 'staged', 3.6, 'lbf-ft'],
      [2, 'staged', 8.4, 'lbf-ft'],
      [3, 'staged', 12, 'lbf-ft'],
      [4, 'check', 12, 'lbf-ft'],
    ]);
    expect(snap.plan.passes[3]!.order).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    expect(snap.spec.lugTorque).toEqual({ value: 90, unit: 'lbf-ft' });
    // The torque means nothing without the thread condition: it is frozen with the numbers.
    expect([snap.spec.threadCondition, snap.spec.boltReuse, snap.spec.notes]).toEqual([
      'anti_seize',
      'Replace at every tire change',
      'Ring is handed',
    ]);
    const plan = planFromSnapshot(snap, { dismount: false, reinstall: false });
    expect(plan.boltCount).toBe(8);
    expect(plan.passes[0]!.order).toEqual(snap.plan.sequence);
    expect(plan.steps.map((s) => s.id)).not.toContain('dismount');
  });
});
