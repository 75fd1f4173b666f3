import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  checkPlausibility,
  chooseWrench,
  TORQUE_UNITS,
  type TorqueUnit,
} from '@/features/torque-plan';
import { seededRandom } from '@/features/practice/random';
import { drawSurpriseSetup, setupFromSpec, type PracticeSpec } from '@/features/practice/surprise';
import {
  PRACTICE_LEVELS,
  type PracticeSetup,
  type PracticeWrench,
} from '@/features/practice/types';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;

function engineAccepts(setup: PracticeSetup) {
  const { spec, plan } = setup.snapshot;
  const plausibility = checkPlausibility({
    maxBeadSeatPressure: spec.maxBeadSeatPressure.value,
    runningPressure: spec.runningPressure.value,
    pressureUnit: spec.runningPressure.unit,
    finalTorque: spec.finalTorque.value,
    torqueUnit: spec.finalTorque.unit,
    fractions: spec.passFractions,
    lugTorque: spec.lugTorque,
  });
  expect(plausibility.errors).toEqual([]);
  expect(spec.boltCount).toBeGreaterThanOrEqual(12);
  expect(spec.boltCount).toBeLessThanOrEqual(40);
  const every = Array.from({ length: spec.boltCount }, (_, i) => i + 1);
  for (const pass of plan.passes) {
    // Every bolt once per pass.
    expect([...pass.order].sort((a, b) => a - b)).toEqual(every);
    // At least one wrench on offer suits the pass at the shop's floor.
    const choice = chooseWrench(pass.target, setup.wrenches, {
      minFractionOfMax: setup.minFractionOfMax,
    });
    expect(choice.ok, choice.ok ? '' : choice.reason).toBe(true);
  }
  for (const w of setup.wrenches) expect(w.id).toMatch(UUID);
  expect(setup.wheel.targetPressure).toBeLessThan(spec.maxBeadSeatPressure.value);
}

const shopCrib: PracticeWrench[] = [
  {
    id: 'a1b2c3d4-0000-4000-8000-000000000001',
    label: '10–50 ft-lb click',
    min: 10,
    max: 50,
    unit: 'lbf-ft',
    graduation: 0.5,
    kind: 'click',
  },
  {
    id: 'a1b2c3d4-0000-4000-8000-000000000002',
    label: '20–200 in-lb click',
    min: 20,
    max: 200,
    unit: 'lbf-in',
    graduation: 1,
    kind: 'click',
  },
];

describe('drawSurpriseSetup', () => {
  it('always draws a ring the engine accepts, with a suitable wrench for every pass', () => {
    fc.assert(
      fc.property(
        fc.integer(),
        fc.constantFrom(...PRACTICE_LEVELS),
        fc.double({ min: 0, max: 0.99, noNaN: true }),
        fc.boolean(),
        (seed, level, floor, withShopCrib) => {
          const setup = drawSurpriseSetup(seededRandom(seed), {
            level,
            shopWrenches: withShopCrib ? shopCrib : [],
            minFractionOfMax: floor,
            now: new Date('2026-12-01T10:00:00Z'),
          });
          expect(setup.level).toBe(level);
          expect(setup.source).toBe('surprise');
          engineAccepts(setup);
        },
      ),
      { numRuns: 300 },
    );
    // Generous: the whole suite shares two cores.
  }, 60_000);

  it('is reproducible from the same random source', () => {
    const input = {
      level: 'guided' as const,
      shopWrenches: [],
      minFractionOfMax: 0.2,
      now: new Date(0),
    };
    expect(drawSurpriseSetup(seededRandom(7), input)).toEqual(
      drawSurpriseSetup(seededRandom(7), input),
    );
  });

  it('over many draws covers every pattern, skip steps that do and do not divide the bolt count, and every unit', () => {
    const seen = new Set<string>();
    for (let seed = 0; seed < 400; seed++) {
      const { spec, plan } = drawSurpriseSetup(seededRandom(seed), {
        level: 'from_memory',
        shopWrenches: [],
        minFractionOfMax: 0.2,
      }).snapshot;
      seen.add(spec.pattern.kind);
      if (spec.pattern.step)
        seen.add(
          spec.boltCount % spec.pattern.step === 0 ? 'skip-divides' : 'skip-does-not-divide',
        );
      seen.add(spec.finalTorque.unit);
      seen.add(spec.runningPressure.unit);
      if (spec.passFractions.some((f, i) => f === spec.passFractions[i - 1]))
        seen.add('repeated lap');
      seen.add(`bolts-${spec.boltCount}`);
      expect(plan.passes.at(-1)?.kind).toBe('check');
    }
    for (const want of [
      'cross',
      'skip',
      'sequential',
      'skip-divides',
      'skip-does-not-divide',
      'repeated lap',
      ...TORQUE_UNITS,
      'psi',
      'kPa',
      'bar',
      'bolts-12',
      'bolts-40',
    ])
      expect(seen, want).toContain(want);
  });

  it("uses the shop's crib when it suits every pass, else a crib in units other than the spec's", () => {
    let usedShop = 0;
    let drewCrib = 0;
    for (let seed = 0; seed < 200; seed++) {
      const setup = drawSurpriseSetup(seededRandom(seed), {
        level: 'wrench_setup',
        shopWrenches: shopCrib,
        minFractionOfMax: 0.2,
      });
      if (setup.wrenches === shopCrib) usedShop++;
      else {
        drewCrib++;
        const specUnit: TorqueUnit = setup.snapshot.spec.finalTorque.unit;
        for (const w of setup.wrenches) expect(w.unit).not.toBe(specUnit);
      }
    }
    expect(usedShop).toBeGreaterThan(0);
    expect(drewCrib).toBeGreaterThan(0);
  });
});

describe('setupFromSpec', () => {
  const spec: PracticeSpec = {
    id: '5e1f0000-0000-4000-8000-000000000001',
    name: 'Dune 24',
    boltCount: 24,
    boltThread: 'M8x1.25',
    finalTorque: 15,
    torqueUnit: 'lbf-ft',
    passFractions: [0.3, 0.7, 1],
    patternKind: 'cross',
    skipStep: null,
    checkPass: true,
    lugTorque: null,
    lugTorqueUnit: null,
    lugCount: null,
    maxBeadSeatPressure: 30,
    runningPressure: 12,
    pressureUnit: 'psi',
    makerReference: '',
    notes: '',
    threadCondition: 'dry',
    boltReuse: '',
  };

  it("takes the spec's numbers and plan, and a crib in other units when the shop's has nothing for 4.5 ft-lb", () => {
    const setup = setupFromSpec(spec, {
      level: 'guided',
      // 10–50 ft-lb at a 20 % floor starts at 10 ft-lb: nothing for the 4.5 ft-lb first pass.
      shopWrenches: [shopCrib[0]!],
      minFractionOfMax: 0.2,
      random: seededRandom(3),
    });
    expect(setup.source).toBe('spec');
    expect(setup.snapshot.spec.name).toBe('Dune 24');
    expect(setup.snapshot.plan.passes.map((p) => p.target.value)).toEqual([4.5, 10.5, 15, 15]);
    expect(setup.wheel.targetPressure).toBe(12);
    engineAccepts(setup);
    for (const w of setup.wrenches) expect(w.unit).not.toBe('lbf-ft');
  });
});
