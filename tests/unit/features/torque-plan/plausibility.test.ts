import { describe, expect, it } from 'vitest';
import {
  checkPlausibility,
  pressureLimitIn,
  torqueLimitIn,
  wheelTargetError,
  type PlausibilityInput,
  type PressureUnit,
  type TorqueUnit,
} from '@/features/torque-plan';

// A plausible spec: 30 psi bead-seating limit, 14 psi running, 12 ft-lb ring bolts, 30/70/100 %.
const base: PlausibilityInput = {
  maxBeadSeatPressure: 30,
  runningPressure: 14,
  pressureUnit: 'psi',
  finalTorque: 12,
  torqueUnit: 'lbf-ft',
  fractions: [0.3, 0.7, 1],
};
const check = (over: Partial<PlausibilityInput>) => checkPlausibility({ ...base, ...over });
const fieldsOf = (issues: { field: string }[]) => issues.map((i) => i.field);

describe('the limits in every unit', () => {
  // 40 psi: the tire industry's bead-seating guidance for passenger and light-truck tires (and
  // OSHA publication 3401's chart for truck tires); 1 psi = 6.894 757 kPa, 1 bar = 100 kPa (NIST SP 811 App. B).
  it.each<[PressureUnit, number]>([
    ['psi', 40],
    ['kPa', 275.8], // 40 × 6.894 757 = 275.79 kPa (NIST SP 811 App. B)
    ['bar', 2.758], // 275.79 kPa / 100 (1 bar = 100 kPa)
  ])('the 40 psi bead-seating ceiling is %s %s', (unit, value) =>
    expect(pressureLimitIn(40, unit)).toBe(value),
  );

  // 5–40 ft-lb: common practice for ring bolts, no source; 1 ft·lbf = 1.355 818 N·m and 12 in·lbf (NIST SP 811 App. B).
  it.each<[TorqueUnit, number, number]>([
    ['lbf-ft', 5, 40],
    ['lbf-in', 60, 480], // × 12
    ['Nm', 7, 54], // 6.78 and 54.23 N·m, to the whole N·m
  ])('the ring-bolt range is %s %s–%s', (unit, low, high) =>
    expect([torqueLimitIn(5, unit), torqueLimitIn(40, unit)]).toEqual([low, high]),
  );
});

describe('bead-seating limit (40 psi, tire industry bead-seating guidance)', () => {
  it.each<[PressureUnit, number, number, number]>([
    // unit, at the ceiling (accepted), just above (refused), a running pressure below both
    ['psi', 40, 40.1, 14], // 40 psi: tire industry guidance
    ['kPa', 275.8, 275.9, 100], // 275.8 kPa = 40 psi (NIST SP 811 App. B)
    ['bar', 2.758, 2.759, 1], // 2.758 bar = 40 psi (NIST SP 811 App. B; 1 bar = 100 kPa)
  ])('in %s: %s is accepted, %s is refused with a message naming psi', (unit, at, above, run) => {
    expect(
      check({ pressureUnit: unit, maxBeadSeatPressure: at, runningPressure: run }).errors,
    ).toEqual([]);
    const refused = check({
      pressureUnit: unit,
      maxBeadSeatPressure: above,
      runningPressure: run,
    }).errors;
    expect(fieldsOf(refused)).toEqual(['maxBeadSeatPressure']);
    expect(refused[0]!.message).toMatch(/above the 40 psi bead-seating ceiling/);
    expect(refused[0]!.message).toContain(unit === 'psi' ? 'kPa' : 'psi');
  });

  it('35 bar (the old demo figure) is refused: "35 bar is 507.6 psi" (NIST SP 811 App. B)', () => {
    const { errors } = check({
      pressureUnit: 'bar',
      maxBeadSeatPressure: 35,
      runningPressure: 1.2,
    });
    expect(errors[0]).toEqual({
      field: 'maxBeadSeatPressure',
      message: expect.stringMatching(
        /^35 bar is 507\.6 psi: above the 40 psi bead-seating ceiling/,
      ),
    });
  });

  it("a higher limit passes only with the tire maker's rating on record and a lead's confirmation", () => {
    const rating = (reference: string, confirmed: boolean) =>
      check({
        maxBeadSeatPressure: 50,
        runningPressure: 35,
        beadSeatRating: { reference, confirmed },
      });
    expect(rating('Tire maker data book TB-7, p. 12 (fictional)', true).errors).toEqual([]);
    expect(fieldsOf(rating('Tire maker data book TB-7, p. 12 (fictional)', false).errors)).toEqual([
      'maxBeadSeatPressure',
      'beadSeatRatingConfirmed',
    ]);
    expect(fieldsOf(rating('   ', true).errors)).toEqual(['maxBeadSeatPressure']);
  });
});

describe('running pressure', () => {
  it.each<[PressureUnit, number, number]>([
    ['psi', 30, 29.9],
    ['kPa', 200, 199.9],
    ['bar', 2, 1.999],
  ])('in %s must be below the bead-seating limit: %s refused, %s accepted', (unit, seat, below) => {
    const refused = check({
      pressureUnit: unit,
      maxBeadSeatPressure: seat,
      runningPressure: seat,
    }).errors;
    expect(fieldsOf(refused)).toEqual(['runningPressure']);
    expect(refused[0]!.message).toMatch(/must be below the bead-seating limit/);
    expect(
      check({ pressureUnit: unit, maxBeadSeatPressure: seat, runningPressure: below }).errors,
    ).toEqual([]);
  });

  // More than 3× the running pressure: common practice, no source.
  it.each<[PressureUnit, number, number, number]>([
    ['psi', 30, 10, 9.9],
    ['kPa', 240, 80, 79.9],
    ['bar', 2.4, 0.8, 0.799],
  ])(
    'in %s: a %s limit over %s running is fine, over %s running is a warning',
    (unit, seat, atThree, belowThree) => {
      expect(
        check({ pressureUnit: unit, maxBeadSeatPressure: seat, runningPressure: atThree }).warnings,
      ).toEqual([]);
      const { errors, warnings } = check({
        pressureUnit: unit,
        maxBeadSeatPressure: seat,
        runningPressure: belowThree,
      });
      expect(errors).toEqual([]);
      expect(warnings).toEqual([
        {
          field: 'maxBeadSeatPressure',
          message: expect.stringMatching(/more than 3× the running pressure/),
        },
      ]);
    },
  );

  // 2–60 psi for the wheels we serve: common practice, no source; converted with NIST SP 811 App. B.
  it.each<[PressureUnit, number, number, number, number]>([
    ['psi', 2, 1.9, 60, 60.1],
    ['kPa', 13.8, 13.7, 413.7, 413.8], // 2 psi = 13.79 kPa, 60 psi = 413.69 kPa
    ['bar', 0.138, 0.137, 4.137, 4.138], // 2 psi = 0.1379 bar, 60 psi = 4.1369 bar
  ])(
    'in %s: %s is usual, %s warns; %s is usual, %s warns',
    (unit, low, belowLow, high, aboveHigh) => {
      const seat = pressureLimitIn(100, unit); // with the tire maker's confirmed rating, so the high end can be reached
      const rating = { reference: 'Tire maker data book TB-7, p. 12 (fictional)', confirmed: true };
      const runAt = (run: number, maxBeadSeatPressure = run * 2.5) =>
        check({
          pressureUnit: unit,
          maxBeadSeatPressure,
          runningPressure: run,
          beadSeatRating: rating,
        });
      expect(runAt(low).warnings).toEqual([]);
      expect(runAt(high, seat).warnings).toEqual([]);
      for (const odd of [runAt(belowLow), runAt(aboveHigh, seat)]) {
        expect(odd.errors).toEqual([]);
        expect(odd.warnings).toEqual([
          {
            field: 'runningPressure',
            message: expect.stringMatching(/outside the usual 2–60 psi/),
          },
        ]);
      }
    },
  );
});

describe('final ring-bolt torque (5–40 ft-lb: common practice, no source)', () => {
  it.each<[TorqueUnit, number, number, number, number]>([
    ['lbf-ft', 5, 4.9, 40, 40.1],
    ['lbf-in', 60, 59, 480, 481], // × 12 in per ft (NIST SP 811 App. B)
    ['Nm', 7, 6.9, 54, 54.1], // × 1.355 818 N·m per ft·lbf (NIST SP 811 App. B), whole N·m
  ])('in %s: %s and %s… %s and %s', (unit, low, belowLow, high, aboveHigh) => {
    expect(check({ torqueUnit: unit, finalTorque: low }).warnings).toEqual([]);
    expect(check({ torqueUnit: unit, finalTorque: high }).warnings).toEqual([]);
    for (const value of [belowLow, aboveHigh]) {
      const { errors, warnings } = check({ torqueUnit: unit, finalTorque: value });
      expect(errors).toEqual([]);
      expect(warnings).toEqual([
        { field: 'finalTorque', message: expect.stringMatching(/outside the usual 5–40 ft-lb/) },
      ]);
      expect(warnings[0]!.message).toMatch(unit === 'lbf-ft' ? /N·m/ : /ft-lb/);
    }
  });

  it('96 in-lb is 8 ft-lb: inside the range, no warning', () =>
    expect(check({ torqueUnit: 'lbf-in', finalTorque: 96 }).warnings).toEqual([]));
});

describe('non-finite, zero or negative values are refused everywhere', () => {
  it.each([0, -1, Number.NaN, Number.POSITIVE_INFINITY])('%s', (bad) => {
    expect(fieldsOf(check({ maxBeadSeatPressure: bad }).errors)).toContain('maxBeadSeatPressure');
    expect(fieldsOf(check({ runningPressure: bad }).errors)).toContain('runningPressure');
    expect(fieldsOf(check({ finalTorque: bad }).errors)).toEqual(['finalTorque']);
    expect(fieldsOf(check({ lugTorque: { value: bad, unit: 'lbf-ft' } }).errors)).toEqual([
      'lugTorque',
    ]);
    expect(fieldsOf(check({ fractions: [bad, 1] }).errors)).toEqual(['fractions']);
  });
});

describe('pass fractions', () => {
  it('a repeated fraction (a second lap at the same target) is accepted', () => {
    expect(check({ fractions: [0.3, 0.3, 0.7, 1] }).errors).toEqual([]);
    expect(check({ fractions: [1] }).errors).toEqual([]);
  });

  it.each<[string, number[], RegExp]>([
    ['going down', [0.7, 0.3, 1], /Pass 2 at 30 % is lower than pass 1 at 70 %/],
    ['above 100 %', [0.5, 1.01], /at most 100 %/],
    ['not ending at 100 %', [0.3, 0.7], /last pass must be at 100 %/],
    ['no passes', [], /at least one pass/],
  ])('%s is refused', (_, fractions, message) => {
    expect(check({ fractions }).errors).toEqual([
      { field: 'fractions', message: expect.stringMatching(message) },
    ]);
  });
});

describe("a wheel's target pressure on a job card", () => {
  // 1 bar = 100 kPa; 1 psi = 6.894 757 kPa (NIST SP 811 App. B): 2.4 bar = 34.8 psi.
  it('must be below its spec’s bead-seating limit, judged in the wheel’s own unit, naming both units', () => {
    expect(wheelTargetError({ value: 14, unit: 'psi' }, { value: 2.4, unit: 'bar' })).toBeNull();
    expect(wheelTargetError({ value: 34.8, unit: 'psi' }, { value: 2.4, unit: 'bar' })).toBeNull();
    expect(wheelTargetError({ value: 35, unit: 'psi' }, { value: 2.4, unit: 'bar' })).toMatch(
      /^The target pressure \(35 psi is 241\.3 kPa\) must be below the spec's bead-seating limit \(34\.8 psi\)/,
    );
    expect(wheelTargetError({ value: 2.4, unit: 'bar' }, { value: 2.4, unit: 'bar' })).toMatch(
      /must be below/,
    );
  });
  it('refuses zero, negative and non-finite targets', () => {
    for (const value of [0, -1, Number.NaN, Number.POSITIVE_INFINITY])
      expect(wheelTargetError({ value, unit: 'psi' }, { value: 30, unit: 'psi' })).toMatch(
        /greater than zero/,
      );
  });
});
