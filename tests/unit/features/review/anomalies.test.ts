import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { jobAnomalies } from '@/features/review/anomalies';
import type {
  JobReviewInput,
  ReviewEvent,
  ReviewPlan,
  WheelReviewInput,
} from '@/features/review/types';

// A 4-bolt ring, 20 ft-lb final, passes at 30 / 70 / 100 % and a check pass. The cross order for
// 4 bolts is 1-3-2-4 (ASME PCC-1 legacy cross pattern, from memory); the check pass goes round 1-2-3-4.
const CROSS = [1, 3, 2, 4];
const plan: ReviewPlan = {
  boltCount: 4,
  passes: [
    { index: 1, kind: 'staged', fraction: 0.3, target: { value: 6, unit: 'lbf-ft' }, order: CROSS },
    {
      index: 2,
      kind: 'staged',
      fraction: 0.7,
      target: { value: 14, unit: 'lbf-ft' },
      order: CROSS,
    },
    { index: 3, kind: 'staged', fraction: 1, target: { value: 20, unit: 'lbf-ft' }, order: CROSS },
    {
      index: 4,
      kind: 'check',
      fraction: 1,
      target: { value: 20, unit: 'lbf-ft' },
      order: [1, 2, 3, 4],
    },
  ],
  steps: [
    { id: 'safety', title: 'Safety gate', required: true },
    { id: 'clean', title: 'Clean', required: false },
    { id: 'hand_start', title: 'Start every bolt by hand', required: true },
    { id: 'torque', title: 'Torque passes', required: true },
    { id: 'seat_bead', title: 'Seat the bead', required: true },
    { id: 'leak_check', title: 'Leak check and pressure', required: false },
  ],
};

const TECH = '00000000-0000-4000-8000-0000000000a1';
const LEAD = '00000000-0000-4000-8000-0000000000b1';
const WRENCH = '00000000-0000-4000-8000-0000000000c1';
const START = Date.parse('2026-03-10T16:00:00Z');

type Draft = {
  type: string;
  payload: Record<string, unknown>;
  byId?: string;
  superseded?: boolean;
};

/** Events 10 s apart from START, in the order given, each with its own id. */
function history(drafts: Draft[], gapSeconds = 10): ReviewEvent[] {
  return drafts.map((d, i) => {
    const at = new Date(START + i * gapSeconds * 1000).toISOString();
    return {
      clientId: `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`,
      type: d.type,
      payload: d.payload,
      clientAt: at,
      receivedAt: at,
      byId: d.byId ?? TECH,
      superseded: d.superseded ?? false,
    };
  });
}

const pass = (p: number, bolts = plan.passes[p - 1]!.order): Draft[] => [
  { type: 'wrench_chosen', payload: { pass: p, wrenchId: WRENCH } },
  ...bolts.map((bolt) => ({ type: 'bolt_confirmed', payload: { pass: p, bolt } })),
];
const done = (step: string, measurement?: { value: number; unit: string }): Draft => ({
  type: 'step_done',
  payload: { step, checklist: [], ...(measurement && { measurement }) },
});

function cleanDrafts(): Draft[] {
  return [
    done('safety'),
    done('clean'),
    ...[1, 2, 3, 4].map((bolt) => ({ type: 'hand_started', payload: { bolt } })),
    done('hand_start'),
    ...pass(1),
    ...pass(2),
    ...pass(3),
    ...pass(4),
    done('torque'),
    done('seat_bead', { value: 30, unit: 'psi' }),
    done('leak_check', { value: 12, unit: 'psi' }),
  ];
}

function wheel(over: Partial<WheelReviewInput> = {}): WheelReviewInput {
  return {
    wheelId: 'w-lf',
    position: 'LF',
    plan,
    limits: { maxBeadSeat: { value: 40, unit: 'psi' }, targetPressure: { value: 12, unit: 'psi' } },
    events: history(cleanDrafts()),
    photoKinds: ['bead_outer', 'bead_inner'],
    requiredPhotos: ['bead_outer', 'bead_inner'],
    wrenches: [
      {
        id: WRENCH,
        label: 'Small click wrench',
        kind: 'click',
        min: 5,
        max: 50,
        unit: 'lbf-ft',
        graduation: 0.5,
        calibrationDueOn: '2026-12-31',
        statusHistory: [],
      },
    ],
    verifications: [
      {
        wrenchId: WRENCH,
        recordedAt: '2026-03-10T15:00:00Z',
        referenceValue: 20,
        unit: 'lbf-ft',
        withinTolerance: true,
      },
    ],
    refused: [],
    submittedAt: '2026-03-10T17:00:00Z',
    flaggedReason: null,
    ...over,
  };
}

function job(w: WheelReviewInput = wheel(), over: Partial<JobReviewInput> = {}): JobReviewInput {
  return {
    wheels: [w],
    settings: {
      timeZone: 'America/Denver',
      wrenchFloorPercent: 10,
      verification: { recency: 'same_day', days: 1, nearPercent: 0 },
      tooFastSecondsPerBolt: 1.5,
    },
    assigneeId: TECH,
    people: { [TECH]: 'Dana Tech', [LEAD]: 'Lee Lead' },
    vinCheckOverridden: false,
    axleWarnings: [],
    ...over,
  };
}

const codes = (input: JobReviewInput) => jobAnomalies(input).map((a) => `${a.code}:${a.severity}`);

describe('anomalies a lead sees on review', () => {
  it('finds nothing on a clean wheel', () => {
    expect(jobAnomalies(job())).toEqual([]);
  });

  it('names the bolts and pass confirmed out of the tightening sequence, and blocks on a staged pass', () => {
    const drafts = cleanDrafts();
    const i = drafts.findIndex((d) => d.type === 'bolt_confirmed' && d.payload.pass === 2);
    // Pass 2 done 1-2-3-4 instead of 1-3-2-4.
    [1, 2, 3, 4].forEach(
      (bolt, k) => (drafts[i + k] = { type: 'bolt_confirmed', payload: { pass: 2, bolt } }),
    );
    const [a, ...rest] = jobAnomalies(job(wheel({ events: history(drafts) })));
    expect(rest).toEqual([]);
    // Bolt 2 came before 3; after that, 3 was the plan's next bolt again.
    expect(a).toMatchObject({ code: 'out_of_sequence', severity: 'blocks', pass: 2, bolts: [2] });
    expect(a!.message).toBe(
      'LF wheel: bolt 2 confirmed out of the tightening sequence on pass 2 of 4 (70 %, 14 ft-lb); the plan called for bolt 3 at that point. An uneven pull can leave the ring clamped unevenly.',
    );
  });

  it('only notes a check pass done out of order', () => {
    const drafts = cleanDrafts();
    const i = drafts.findIndex((d) => d.type === 'bolt_confirmed' && d.payload.pass === 4);
    [4, 3, 2, 1].forEach(
      (bolt, k) => (drafts[i + k] = { type: 'bolt_confirmed', payload: { pass: 4, bolt } }),
    );
    expect(codes(job(wheel({ events: history(drafts) })))).toEqual(['out_of_sequence:notes']);
  });

  it('blocks a pass confirmed faster than the shop threshold (median gap per bolt)', () => {
    // 1 s between events, under the shop's 1.5 s: every pass is too fast.
    const found = jobAnomalies(job(wheel({ events: history(cleanDrafts(), 1) })));
    expect(found.map((a) => a.code)).toEqual(['too_fast', 'too_fast', 'too_fast', 'too_fast']);
    expect(found[0]!.message).toContain(
      "pass 1 of 4 (30 %, 6 ft-lb) was confirmed at a median of 1 s per bolt, faster than the shop's 1.5 s",
    );
    // The same run at a 0.5 s threshold is fine.
    expect(
      jobAnomalies(
        job(wheel({ events: history(cleanDrafts(), 1) }), {
          settings: { ...job().settings, tooFastSecondsPerBolt: 0.5 },
        }),
      ),
    ).toEqual([]);
  });

  it('blocks a wrench with no verification the policy accepts at the time of use', () => {
    // Verified the day before, in the shop's zone (Denver): a same-day policy does not count it.
    const found = jobAnomalies(
      job(
        wheel({
          verifications: [
            {
              wrenchId: WRENCH,
              recordedAt: '2026-03-09T15:00:00Z',
              referenceValue: 20,
              unit: 'lbf-ft',
              withinTolerance: true,
            },
          ],
        }),
      ),
    );
    expect(found.map((a) => a.code)).toEqual([
      'wrench_unverified',
      'wrench_unverified',
      'wrench_unverified',
      'wrench_unverified',
    ]);
    expect(found[0]!.message).toContain(
      'pass 1 of 4 (30 %, 6 ft-lb), bolts 1, 3, 2 and 4: Small click wrench had no verification',
    );
  });

  it('does not count a verification recorded long after the bolts were done', () => {
    const later = [
      {
        wrenchId: WRENCH,
        recordedAt: '2026-03-10T20:00:00Z',
        referenceValue: 20,
        unit: 'lbf-ft' as const,
        withinTolerance: true,
      },
    ];
    expect(new Set(codes(job(wheel({ verifications: later }))))).toEqual(
      new Set(['wrench_unverified:blocks']),
    );
  });

  it('blocks a wrench that was out of service when used, but not one taken out afterwards', () => {
    const outBefore = wheel({
      wrenches: [
        {
          ...wheel().wrenches[0]!,
          statusHistory: [
            {
              status: 'out_of_service',
              at: '2026-03-10T10:00:00Z',
              reason: 'failed check at 20 ft-lb',
            },
          ],
        },
      ],
    });
    expect(new Set(codes(job(outBefore)))).toEqual(new Set(['wrench_out_of_service:blocks']));
    expect(jobAnomalies(job(outBefore))[0]!.message).toContain(
      'Small click wrench was out of service when used (failed check at 20 ft-lb).',
    );
    const outAfter = wheel({
      wrenches: [
        {
          ...wheel().wrenches[0]!,
          statusHistory: [
            { status: 'out_of_service', at: '2026-03-11T10:00:00Z', reason: 'dropped' },
          ],
        },
      ],
    });
    expect(jobAnomalies(job(outAfter))).toEqual([]);
  });

  it('blocks a wrench overdue for calibration on the shop day it was used', () => {
    const overdue = wheel({
      wrenches: [{ ...wheel().wrenches[0]!, calibrationDueOn: '2026-03-09' }],
    });
    expect(new Set(codes(job(overdue)))).toEqual(new Set(['wrench_calibration_overdue:blocks']));
    // Due that very day is not overdue.
    expect(
      jobAnomalies(
        job(wheel({ wrenches: [{ ...wheel().wrenches[0]!, calibrationDueOn: '2026-03-10' }] })),
      ),
    ).toEqual([]);
  });

  it('blocks a setting outside the wrench range at the shop floor', () => {
    // At a 20 % floor the 50 ft-lb wrench starts at 10 ft-lb: pass 1 at 6 ft-lb is below it.
    const found = jobAnomalies(
      job(wheel(), { settings: { ...job().settings, wrenchFloorPercent: 20 } }),
    );
    expect(found.map((a) => `${a.code}:${a.pass}`)).toEqual(['wrench_unsuitable:1']);
    expect(found[0]!.message).toContain("below the shop's floor of 20 % of its maximum");
  });

  it('blocks a bead seated above the spec limit, in another unit', () => {
    const drafts = cleanDrafts().map((d) =>
      d.payload.step === 'seat_bead' ? done('seat_bead', { value: 3, unit: 'bar' }) : d,
    );
    // 3 bar = 43.5 psi (NIST SP 811 App. B: 1 psi = 6.894 757 kPa), above the 40 psi limit.
    const found = jobAnomalies(job(wheel({ events: history(drafts) })));
    expect(found.map((a) => `${a.code}:${a.severity}`)).toEqual(['bead_seat_over_limit:blocks']);
    expect(found[0]!.message).toContain(
      "seated at 3 bar, above the spec's bead-seating limit of 40 psi",
    );
  });

  it('notes a set pressure more than 1 psi (6.894 757 kPa, NIST SP 811 App. B) off the target', () => {
    const at = (value: number, unit: string) =>
      history(
        cleanDrafts().map((d) =>
          d.payload.step === 'leak_check' ? done('leak_check', { value, unit }) : d,
        ),
      );
    expect(codes(job(wheel({ events: at(13.5, 'psi') })))).toEqual(['pressure_off_target:notes']);
    // 89.6 kPa is 12.995 psi: within 1 psi of 12.
    expect(jobAnomalies(job(wheel({ events: at(89.6, 'kPa') })))).toEqual([]);
    // 90 kPa is 13.05 psi: off by more than 1 psi.
    expect(codes(job(wheel({ events: at(90, 'kPa') })))).toEqual(['pressure_off_target:notes']);
  });

  it('blocks a missing bead photo, naming the face', () => {
    const found = jobAnomalies(job(wheel({ photoKinds: ['bead_outer', 'other'] })));
    expect(found.map((a) => a.message)).toEqual([
      'LF wheel: no seated-bead (inner face) photo; the seated bead cannot be checked from the record.',
    ]);
    expect(found[0]!.severity).toBe('blocks');
  });

  it('notes an overridden VIN and an accepted axle mismatch for the job', () => {
    const found = jobAnomalies(
      job(wheel(), {
        vinCheckOverridden: true,
        axleWarnings: [
          'Front axle: 30x10-14 and 28x10-14 differ by 6.9 % in diameter. Tires on one axle must match.',
        ],
      }),
    );
    expect(found.map((a) => `${a.code}:${a.severity}:${a.wheelId}`)).toEqual([
      'vin_overridden:notes:null',
      'axle_mismatch_accepted:notes:null',
    ]);
  });

  it('notes a skipped step with its reason', () => {
    const drafts = cleanDrafts().map((d) =>
      d.payload.step === 'clean'
        ? {
            type: 'step_skipped',
            payload: { step: 'clean', reason: 'new ring, holes already clean' },
          }
        : d,
    );
    expect(jobAnomalies(job(wheel({ events: history(drafts) }))).map((a) => a.message)).toEqual([
      'LF wheel: step "Clean" was skipped: new ring, holes already clean.',
    ]);
  });

  it('blocks a failed inspection and a flagged bolt', () => {
    const drafts = [
      ...cleanDrafts(),
      { type: 'inspection_failed', payload: { notes: 'crack at the ring' } },
      { type: 'bolt_flagged', payload: { pass: 3, bolt: 2, reason: 'stripped thread' } },
    ];
    const found = jobAnomalies(job(wheel({ events: history(drafts) })));
    expect(found.map((a) => `${a.code}:${a.severity}`)).toEqual([
      'inspection_failed:blocks',
      'bolt_flagged:blocks',
    ]);
    expect(found[1]!.message).toBe(
      'LF wheel: bolt 2 was flagged during pass 3 of 4 (100 %, 20 ft-lb): stripped thread. Check the thread and the bolt before release.',
    );
  });

  it("names a flagged bolt's problem and note as the runner sends them", () => {
    const drafts = [
      ...cleanDrafts(),
      {
        type: 'bolt_flagged',
        payload: { pass: 2, bolt: 4, problem: 'cross_threaded', note: 'bound at two turns' },
      },
    ];
    expect(jobAnomalies(job(wheel({ events: history(drafts) }))).map((a) => a.message)).toEqual([
      'LF wheel: bolt 4 was flagged during pass 2 of 4 (70 %, 14 ft-lb): cross threaded: bound at two turns. Check the thread and the bolt before release.',
    ]);
  });

  it('judges a check pass the runner added after a bolt turned, under its own name', () => {
    // Check pass 2 (pass 5, past the plan) at a median of 1 s: too fast, and named as the second check pass.
    const extra = [1, 2, 3, 4].map((bolt) => ({
      type: 'bolt_confirmed',
      payload: { pass: 5, bolt, target: { value: 20, unit: 'lbf-ft' } },
    }));
    const events = [
      ...history(cleanDrafts()),
      ...history(
        [{ type: 'wrench_chosen', payload: { pass: 5, wrenchId: WRENCH } }, ...extra],
        1,
      ).map((e) => ({
        ...e,
        clientId: e.clientId.replace('8000-', '9000-'),
        clientAt: new Date(Date.parse(e.clientAt) + 3_600_000).toISOString(),
        receivedAt: '2026-03-10T16:59:00.000Z',
      })),
    ];
    const found = jobAnomalies(job(wheel({ events })));
    expect(found.map((a) => `${a.code}:${a.pass}`)).toEqual(['too_fast:5']);
    expect(found[0]!.message).toContain(
      'check pass 2 (100 %, 20 ft-lb) was confirmed at a median of 1 s per bolt',
    );
  });

  it('notes bolts confirmed by someone other than the assignee', () => {
    const drafts = cleanDrafts().map((d) =>
      d.type === 'bolt_confirmed' && d.payload.pass === 3 ? { ...d, byId: LEAD } : d,
    );
    const found = jobAnomalies(job(wheel({ events: history(drafts) })));
    expect(found.map((a) => a.message)).toEqual([
      'LF wheel: bolts 1, 3, 2 and 4 on pass 3 of 4 (100 %, 20 ft-lb) confirmed by Lee Lead, not the assigned technician (Dana Tech).',
    ]);
  });

  it('notes refused entries and blocks entries received after submission', () => {
    expect(
      codes(
        job(
          wheel({
            refused: [
              {
                clientId: null,
                type: 'bolt_confirmed',
                message: 'Bolt 9 is not on this 4-bolt ring.',
                at: '2026-03-10T16:05:00Z',
              },
            ],
          }),
        ),
      ),
    ).toEqual(['events_refused:notes']);
    const events = history(cleanDrafts());
    events[events.length - 1] = { ...events.at(-1)!, receivedAt: '2026-03-10T18:00:00Z' };
    expect(codes(job(wheel({ events })))).toEqual(['received_after_submit:blocks']);
  });

  it('ignores superseded events: a reworked pass is judged by its rework', () => {
    const drafts = cleanDrafts();
    const i = drafts.findIndex((d) => d.type === 'bolt_confirmed' && d.payload.pass === 2);
    // A first, out-of-order attempt that a send-back superseded, then the right order.
    const bad: Draft[] = [4, 2, 3, 1].map((bolt) => ({
      type: 'bolt_confirmed',
      payload: { pass: 2, bolt },
      superseded: true,
    }));
    drafts.splice(i, 0, ...bad);
    expect(jobAnomalies(job(wheel({ events: history(drafts) })))).toEqual([]);
  });

  it('gives the same anomalies whatever order the events arrived in', () => {
    // A messy history: out of order, a duplicate, a foreign hand, fast in places, a skipped step.
    const drafts = cleanDrafts().map((d, i) => (i % 7 === 3 ? { ...d, byId: LEAD } : d));
    drafts.splice(12, 0, { type: 'bolt_confirmed', payload: { pass: 1, bolt: 4 } });
    const events = history(drafts, 1.2);
    events.push({ ...events[20]! });
    const expected = jobAnomalies(job(wheel({ events })));
    expect(expected.length).toBeGreaterThan(0);
    fc.assert(
      fc.property(
        fc.shuffledSubarray(events, { minLength: events.length, maxLength: events.length }),
        (shuffled) => {
          expect(jobAnomalies(job(wheel({ events: shuffled })))).toEqual(expected);
        },
      ),
      { numRuns: 200 },
    );
  });
});
