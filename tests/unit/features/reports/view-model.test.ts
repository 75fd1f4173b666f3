import { describe, expect, it } from 'vitest';
import type { ReportData, ReportEvent } from '@/features/reports/types';
import { recheckDay, reportView } from '@/features/reports/view-model';

const WRENCH = 'w-in-lb';
const OLD_WRENCH = 'w-nm';
const snapshot = {
  version: 1 as const,
  takenAt: '2026-03-09T20:00:00Z',
  spec: {
    id: 's1',
    name: 'Eight-bolt test ring',
    boltCount: 8,
    boltThread: 'M8×1.25',
    pattern: { kind: 'cross' as const, step: null },
    passFractions: [0.3, 0.7, 1],
    checkPass: true,
    finalTorque: { value: 12, unit: 'lbf-ft' as const },
    maxBeadSeatPressure: { value: 30, unit: 'psi' as const },
    runningPressure: { value: 14, unit: 'psi' as const },
    lugTorque: null,
    lugCount: null,
    makerReference: 'Ring manual rev. C, p. 4',
    threadCondition: 'dry' as const,
  },
  plan: {
    sequence: [1, 5, 3, 7, 2, 6, 4, 8],
    passes: [
      {
        index: 1,
        kind: 'staged' as const,
        fraction: 0.3,
        target: { value: 3.6, unit: 'lbf-ft' as const },
        order: [1, 5, 3, 7, 2, 6, 4, 8],
      },
      {
        index: 2,
        kind: 'check' as const,
        fraction: 1,
        target: { value: 12, unit: 'lbf-ft' as const },
        order: [1, 2, 3, 4, 5, 6, 7, 8],
      },
    ],
  },
  targetPressure: { value: 14, unit: 'psi' as const },
};
const ev = (type: string, payload: Record<string, unknown>, byId = 'tech'): ReportEvent => ({
  clientId: `${type}-${JSON.stringify(payload)}`,
  type,
  payload,
  byId,
  clientAt: '2026-03-09T21:00:00Z',
});

function data(overrides: Partial<ReportData> = {}): ReportData {
  return {
    shop: { name: 'Dustline Tire & Trail', contact: 'lead@dustline.test' },
    timeZone: 'America/Denver',
    recheckDays: 7,
    job: {
      id: 'j1',
      number: 1042,
      state: 'signed_off',
      createdAt: '2026-03-09T15:00:00Z',
      dismount: true,
      reinstall: true,
      customer: { name: 'Wren Halloway', email: 'wren@example.test', phone: '' },
      vehicle: { year: 2022, make: 'Talonworks', model: 'Ridgeback', description: '', vin: null },
    },
    // 05:30 UTC is 11:30 PM the evening before in Denver (UTC−7 in March before the switch).
    signOff: { byId: 'lead', at: '2026-03-10T05:30:00Z', selfSignoff: false },
    recheck: null,
    wheels: [
      {
        id: 'wh1',
        position: 'RF',
        tireSize: '30x10R14',
        directional: true,
        targetPressure: { value: 14, unit: 'psi' },
        snapshot,
        submittedAt: '2026-03-09T22:00:00Z',
        submittedById: 'tech',
        photos: [],
        events: [
          ev('wrench_chosen', { pass: 1, wrenchId: WRENCH }),
          ...[1, 5, 3, 7, 2, 6, 4, 8].map((bolt) =>
            ev('bolt_confirmed', { pass: 1, bolt, setting: { value: 43, unit: 'lbf-in' } }),
          ),
          // An older phone: no wrench or setting on the event, the wrench chosen for the pass counts.
          ev('wrench_chosen', { pass: 2, wrenchId: OLD_WRENCH }),
          ...[1, 2, 3, 4, 5, 6, 7, 8].map((bolt) => ev('bolt_confirmed', { pass: 2, bolt })),
          // A bolt turned on the check pass: the runner added another.
          ev('bolt_confirmed', {
            pass: 3,
            bolt: 1,
            wrenchId: OLD_WRENCH,
            setting: { value: 16.5, unit: 'Nm' },
          }),
          ev('step_done', { step: 'seat_bead', measurement: { value: 22, unit: 'psi' } }),
          ev('step_done', { step: 'leak_check', measurement: { value: 14, unit: 'psi' } }),
        ],
      },
    ],
    acknowledgements: [
      {
        wheelId: 'wh1',
        message: 'RF wheel: a check pass went too fast.',
        reason: 'Watched it myself.',
        byId: 'lead',
        at: '2026-03-10T05:29:00Z',
      },
    ],
    people: { tech: 'Theo Tech', lead: 'Lena Lead' },
    wrenches: {
      [WRENCH]: {
        label: 'Click 20–200 in-lb',
        kind: 'click',
        serial: 'CW-0042',
        unit: 'lbf-in',
        graduation: 1,
        lastVerification: {
          at: '2026-03-09T16:00:00Z',
          reference: { value: 40, unit: 'lbf-in' },
          withinTolerance: true,
        },
      },
      [OLD_WRENCH]: {
        label: 'Click 5–25 N·m',
        kind: 'click',
        serial: '',
        unit: 'Nm',
        graduation: 0.5,
        lastVerification: null,
      },
    },
    ...overrides,
  };
}

describe('the report view model', () => {
  it("puts the re-check on the shop's sign-off day plus its re-check days", () => {
    // Signed off on the evening of Mar 9 in Denver, so due Mar 16, not Mar 17 as UTC would say.
    expect(recheckDay(data())).toBe('2026-03-16');
    expect(reportView(data()).recheck?.dueOn).toBe('Mar 16, 2026');
    expect(reportView(data()).signedOff).toEqual({
      by: 'Lena Lead',
      at: 'Mar 9, 2026, 11:30 PM',
      selfSignoff: false,
    });
  });

  it('takes a queued reminder day over the computed one (a lead may have moved it)', () => {
    expect(recheckDay(data({ recheck: { dueOn: '2026-04-01', status: 'scheduled' } }))).toBe(
      '2026-04-01',
    );
  });

  it("shows each pass's wrench and setting in the wrench's unit and the spec's", () => {
    const [pass1, check, added] = reportView(data()).wheels[0]!.passes;
    // 43 in-lb ÷ 12 = 3.58 ft-lb (1 ft = 12 in, NIST SP 811 App. B).
    expect(pass1).toMatchObject({
      kind: 'Pass 1 (30 %)',
      target: '3.6 ft-lb (4.9 N·m)',
      wrenches: [
        {
          label: 'Click 20–200 in-lb',
          serial: 'serial CW-0042',
          setting: '43 in-lb (3.6 ft-lb)',
          lastVerification: 'Mar 9, 2026 at 40 in-lb, within tolerance',
          bolts: 8,
        },
      ],
    });
    // No setting on the events: 12 ft-lb = 16.27 N·m (NIST SP 811 App. B), rounded to the 0.5 N·m graduation.
    expect(check!.wrenches).toEqual([
      {
        label: 'Click 5–25 N·m',
        serial: 'no serial on record',
        setting: '16.5 N·m (12.2 ft-lb)',
        lastVerification: 'no verification on record',
        bolts: 8,
      },
    ]);
    expect(added).toMatchObject({
      index: 3,
      kind: 'Check pass (100 %)',
      target: '12 ft-lb (16.3 N·m)',
    });
  });

  it('names both pressure units, the direction for the side, and who did what', () => {
    const view = reportView(data());
    const wheel = view.wheels[0]!;
    // 22 psi × 6.894 757 = 151.7 kPa (NIST SP 811 App. B).
    expect(wheel.beadSeatUsed).toBe('22 psi (152 kPa)');
    expect(wheel.beadSeatLimit).toBe('30 psi (207 kPa)');
    expect(wheel.pressureSet).toBe('14 psi (97 kPa)');
    expect(wheel.direction).toContain('Right side');
    expect(wheel.spec?.finalTorque).toBe('12 ft-lb (16.3 N·m)');
    expect(wheel.spec?.threadCondition).toMatch(/^Dry/);
    expect(view.workedBy).toEqual(['Theo Tech']);
    expect(view.vin).toBe('not recorded');
    expect(view.acknowledgements).toEqual([
      {
        wheel: 'RF',
        message: 'RF wheel: a check pass went too fast.',
        reason: 'Watched it myself.',
        by: 'Lena Lead',
        at: 'Mar 9, 2026, 11:29 PM',
      },
    ]);
    expect(view.makerFirst).toContain(
      "wheel and tire maker's specifications, local codes and licensed practice",
    );
  });

  it('says what was done in one sentence, the check pass only when there was one', () => {
    expect(reportView(data()).summary).toBe(
      '1 wheel (RF) had a new tire mounted on the beadlock rings, with the ring bolts torqued in staged passes to 12 ft-lb (16.3 N·m) and checked until no bolt turned; the beads were seated and the pressures set.',
    );
  });

  it('has no re-check day before a sign-off', () => {
    expect(recheckDay(data({ signOff: null }))).toBeNull();
  });
});
