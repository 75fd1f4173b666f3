import { describe, expect, it } from 'vitest';
import {
  assertDemoCompletable,
  demoProblems,
  type SeedSpec,
  type SeedWrench,
} from '@/db/seed-check';
import { DEMO_SPECS, DEMO_WRENCHES } from '@/db/seed-demo-records';

// The shop's default floor: 20 % of a wrench's maximum (ISO 6789 click-wrench calibration starts
// at 20 %, 2003 edition; secondary sources).
const FLOOR = 20;

describe('the demo seed self-check', () => {
  it('passes on the demo specs and crib: every pass of every demo spec has a wrench, no spec is implausible', () => {
    expect(demoProblems(DEMO_SPECS, DEMO_WRENCHES, FLOOR)).toEqual([]);
  });

  it('fails, naming the spec and the pass, when the crib has no wrench small enough for the 96 in-lb ATV ring', () => {
    const withoutSmall = DEMO_WRENCHES.filter((w) => !w.label.startsWith('Small click'));
    expect(() => assertDemoCompletable(DEMO_SPECS, withoutSmall, FLOOR)).toThrow(
      /"Dune Ring 14 in ATV, 20 bolts" pass 1 \(28\.8 in-lb\) cannot be done/,
    );
  });

  it('ignores a wrench that is out of service', () => {
    const crib: SeedWrench[] = [
      {
        label: 'Only click 20–200 in-lb',
        kind: 'click',
        min: 20,
        max: 200,
        unit: 'lbf-in',
        graduation: 1,
        status: 'out_of_service',
      },
    ];
    const spec: SeedSpec = {
      name: 'Test ring',
      finalTorque: 12,
      torqueUnit: 'lbf-ft',
      passFractions: [0.3, 0.7, 1],
      checkPass: true,
      maxBeadSeatPressure: 30,
      runningPressure: 14,
      pressureUnit: 'psi',
    };
    expect(demoProblems([spec], crib, FLOOR)).toHaveLength(4);
  });

  it('fails on the old Kestrel figure: 35 bar is 507.6 psi, above the 40 psi bead-seating ceiling (tire industry guidance; NIST SP 811 App. B)', () => {
    const old = DEMO_SPECS.map((s) =>
      s.name.startsWith('Kestrel') ? { ...s, maxBeadSeatPressure: 35, runningPressure: 1.2 } : s,
    );
    expect(() => assertDemoCompletable(old, DEMO_WRENCHES, FLOOR)).toThrow(
      /"Kestrel 16 in sport, 16 bolts" maxBeadSeatPressure: 35 bar is 507\.6 psi/,
    );
  });
});
