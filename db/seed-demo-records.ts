/**
 * The demo shop's records: invented wheel specs, a tool crib, customers with vehicles, and a
 * dozen job cards in every state. Every name, vehicle and brand here is made up.
 */
import { eq } from 'drizzle-orm';
import type { PostgresJsDatabase } from 'drizzle-orm/postgres-js';
import * as schema from './schema';
import { assertDemoCompletable, demoWheelPlan, type SeedSpec, type SeedWrench } from './seed-check';
import { seedDemoWork } from './seed-demo-work';

type Db = PostgresJsDatabase<typeof schema>;
type People = { lead: string; tech: string };

const day = 86_400_000;
const isoDate = (offsetDays: number) =>
  new Date(Date.now() + offsetDays * day).toISOString().slice(0, 10);

// Invented figures that a careful shop could have on file: bead-seating limits at or under the
// tire industry's 40 psi guidance, each spec in its maker's unit.
export const DEMO_SPECS = [
  {
    name: 'Gritline 15 in UTV beadlock, 24 bolts',
    boltCount: 24,
    boltThread: 'M8×1.25',
    finalTorque: 12,
    torqueUnit: 'lbf-ft',
    passFractions: [0.3, 0.7, 1],
    patternKind: 'cross',
    checkPass: true,
    lugTorque: 90,
    lugTorqueUnit: 'lbf-ft',
    lugCount: 4,
    maxBeadSeatPressure: 30,
    runningPressure: 14,
    pressureUnit: 'psi',
    makerReference: 'Gritline install sheet GL-15B rev C (fictional)',
    threadCondition: 'dry',
    boltReuse: 'Reuse if undamaged; replace any bolt with a galled thread or rounded head',
  },
  {
    name: 'Mesa Forge 17 in truck beadlock, 32 bolts',
    boltCount: 32,
    boltThread: '5/16-18',
    finalTorque: 20,
    torqueUnit: 'Nm',
    passFractions: [0.3, 0.7, 1],
    patternKind: 'cross',
    checkPass: true,
    lugTorque: 150,
    lugTorqueUnit: 'lbf-ft',
    lugCount: 6,
    maxBeadSeatPressure: 40,
    runningPressure: 35,
    pressureUnit: 'psi',
    makerReference: 'Mesa Forge MF-17 manual §4 (fictional)',
    threadCondition: 'anti_seize',
    boltReuse: 'Replace all ring bolts at every tire change',
  },
  {
    name: 'Dune Ring 14 in ATV, 20 bolts',
    boltCount: 20,
    boltThread: 'M6×1.0',
    finalTorque: 96,
    torqueUnit: 'lbf-in',
    passFractions: [0.3, 0.7, 1],
    patternKind: 'skip',
    skipStep: 5,
    checkPass: true,
    lugTorque: 40,
    lugTorqueUnit: 'lbf-ft',
    lugCount: 4,
    maxBeadSeatPressure: 20,
    runningPressure: 8,
    pressureUnit: 'psi',
  },
  // A maker that writes bar: 2.4 bar (34.8 psi) to seat, 1.0 bar (14.5 psi) to run.
  {
    name: 'Kestrel 16 in sport, 16 bolts',
    boltCount: 16,
    boltThread: 'M8×1.25',
    finalTorque: 15,
    torqueUnit: 'lbf-ft',
    passFractions: [0.25, 0.6, 1],
    patternKind: 'cross',
    checkPass: true,
    maxBeadSeatPressure: 2.4,
    runningPressure: 1,
    pressureUnit: 'bar',
  },
] satisfies (SeedSpec & Omit<typeof schema.wheelSpecs.$inferInsert, 'shopId'>)[];

// The small click wrench carries the first pass of the 96 in-lb ATV ring (28.8 in-lb), which is
// below the 20 % floor of the 20–200 in-lb wrench and under the digital one's lowest mark.
export const DEMO_WRENCHES = [
  {
    label: 'Blue click 20–200 in-lb',
    kind: 'click',
    min: 20,
    max: 200,
    unit: 'lbf-in',
    graduation: 1,
    serial: 'BC-20418',
    calibrationDueOn: isoDate(200),
  },
  {
    label: 'Grey click 5–80 ft-lb',
    kind: 'click',
    min: 5,
    max: 80,
    unit: 'lbf-ft',
    graduation: 1,
    serial: 'GC-7731',
    calibrationDueOn: isoDate(120),
    cyclesSinceCalibration: 1800,
  },
  {
    label: 'Digital 4–40 N·m',
    kind: 'digital',
    min: 4,
    max: 40,
    unit: 'Nm',
    graduation: 0.1,
    serial: 'DG-0042',
    calibrationDueOn: isoDate(300),
  },
  {
    label: 'Long click 30–250 ft-lb (lug nuts)',
    kind: 'click',
    min: 30,
    max: 250,
    unit: 'lbf-ft',
    graduation: 1,
    serial: 'LC-5512',
    calibrationDueOn: isoDate(90),
  },
  {
    label: 'Old beam 0–150 ft-lb',
    kind: 'beam',
    min: 0,
    max: 150,
    unit: 'lbf-ft',
    graduation: 5,
    serial: 'OB-1',
    calibrationDueOn: isoDate(60),
    status: 'out_of_service',
    statusReason: 'Verification out of tolerance: +6.5 % (allowed ±4 %)',
  },
  {
    label: 'Small click 10–100 in-lb',
    kind: 'click',
    min: 10,
    max: 100,
    unit: 'lbf-in',
    graduation: 0.5,
    serial: 'SC-1107',
    calibrationDueOn: isoDate(250),
  },
] satisfies (SeedWrench & Omit<typeof schema.wrenches.$inferInsert, 'shopId'>)[];

/** `photoDir`: where the local upload fake keeps files; the demo's bead photos are written there. */
export async function seedDemoRecords(
  tx: Db,
  shopId: string,
  people: People,
  options: { photoDir?: string } = {},
) {
  // The shop's own floor (its settings row is made with the shop): the demo must work at it.
  const [settings] = await tx
    .select({ floor: schema.shopSettings.wrenchFloorPercent })
    .from(schema.shopSettings)
    .where(eq(schema.shopSettings.shopId, shopId));
  assertDemoCompletable(DEMO_SPECS, DEMO_WRENCHES, settings?.floor ?? 20);

  const specs = await tx
    .insert(schema.wheelSpecs)
    .values(DEMO_SPECS.map((spec) => ({ ...spec, shopId })))
    .returning({ id: schema.wheelSpecs.id });

  const wrenches = await tx
    .insert(schema.wrenches)
    .values(DEMO_WRENCHES.map((wrench) => ({ ...wrench, shopId })))
    .returning({ id: schema.wrenches.id });
  const oldBeam = wrenches[4]!.id;
  await tx.insert(schema.wrenchVerifications).values([
    {
      shopId,
      wrenchId: wrenches[0]!.id,
      referenceValue: 100,
      readingValue: 101.5,
      unit: 'lbf-in',
      deviationPct: 1.5,
      tolerancePct: 4,
      withinTolerance: true,
      recordedById: people.tech,
    },
    {
      shopId,
      wrenchId: wrenches[5]!.id,
      referenceValue: 50,
      readingValue: 50.5,
      unit: 'lbf-in',
      deviationPct: 1,
      tolerancePct: 4,
      withinTolerance: true,
      recordedById: people.tech,
    },
    {
      shopId,
      wrenchId: oldBeam,
      referenceValue: 100,
      readingValue: 106.5,
      unit: 'lbf-ft',
      deviationPct: 6.5,
      tolerancePct: 4,
      withinTolerance: false,
      recordedById: people.lead,
    },
  ]);
  await tx.insert(schema.wrenchStatusEvents).values({
    shopId,
    wrenchId: oldBeam,
    status: 'out_of_service',
    reason: 'Verification out of tolerance: +6.5 % (allowed ±4 %)',
    byId: people.lead,
  });

  const customers = await tx
    .insert(schema.customers)
    .values([
      { shopId, name: 'Wren Halloway', phone: '555-0142', email: 'wren.halloway@example.test' },
      { shopId, name: 'Cass Ostrander', phone: '555-0178', email: 'cass@example.test' },
      {
        shopId,
        name: 'Juniper Flats Ranch',
        phone: '555-0199',
        email: 'office@juniperflats.example.test',
      },
      { shopId, name: 'Dario Quintel', phone: '555-0110', email: '' },
    ])
    .returning({ id: schema.customers.id });
  const c = customers.map((x) => x.id);
  const vehicles = await tx
    .insert(schema.vehicles)
    .values([
      {
        shopId,
        customerId: c[0]!,
        year: 2022,
        make: 'Talonworks',
        model: 'Ridgeback 1000',
        description: 'Red side-by-side, long-travel kit',
        vin: '1M8GDM9AXKP042788',
      },
      {
        shopId,
        customerId: c[1]!,
        year: 2019,
        make: 'Boreal',
        model: 'Scout 570',
        description: 'ATV, plow mount',
      },
      {
        shopId,
        customerId: c[2]!,
        year: 2021,
        make: 'Halvard',
        model: 'Ranchline 2500',
        description: 'Ranch truck, white',
      },
      {
        shopId,
        customerId: c[2]!,
        year: 2023,
        make: 'Talonworks',
        model: 'Trailhand 4',
        description: 'Four-seat side-by-side',
      },
      {
        shopId,
        customerId: c[3]!,
        year: 2020,
        make: 'Kestrel Moto',
        model: 'Dust 900',
        description: 'Desert racer',
      },
    ])
    .returning({ id: schema.vehicles.id, customerId: schema.vehicles.customerId });

  type State = (typeof schema.jobStateEnum.enumValues)[number];
  const plan: {
    state: State;
    vehicle: number;
    spec: number;
    tire: string;
    assignee: string | null;
    dueDays: number;
  }[] = [
    { state: 'open', vehicle: 0, spec: 0, tire: '30x10R15', assignee: people.tech, dueDays: 1 },
    { state: 'open', vehicle: 1, spec: 2, tire: '26x9-14', assignee: null, dueDays: 2 },
    { state: 'open', vehicle: 4, spec: 3, tire: '32x10R16', assignee: people.tech, dueDays: -1 },
    {
      state: 'in_progress',
      vehicle: 2,
      spec: 1,
      tire: '285/70R17',
      assignee: people.tech,
      dueDays: 0,
    },
    {
      state: 'in_progress',
      vehicle: 3,
      spec: 0,
      tire: '32x10R15',
      assignee: people.lead,
      dueDays: 1,
    },
    {
      state: 'in_progress',
      vehicle: 0,
      spec: 0,
      tire: '30x10R15',
      assignee: people.tech,
      dueDays: 3,
    },
    {
      state: 'awaiting_signoff',
      vehicle: 1,
      spec: 2,
      tire: '26x9-14',
      assignee: people.tech,
      dueDays: 0,
    },
    {
      state: 'awaiting_signoff',
      vehicle: 4,
      spec: 3,
      tire: '32x10R16',
      assignee: people.tech,
      dueDays: -2,
    },
    {
      state: 'signed_off',
      vehicle: 2,
      spec: 1,
      tire: '285/70R17',
      assignee: people.tech,
      dueDays: -5,
    },
    {
      state: 'signed_off',
      vehicle: 3,
      spec: 0,
      tire: '32x10R15',
      assignee: people.tech,
      dueDays: -8,
    },
    {
      state: 'sent_back',
      vehicle: 0,
      spec: 0,
      tire: '30x10R15',
      assignee: people.tech,
      dueDays: 1,
    },
    {
      state: 'sent_back',
      vehicle: 4,
      spec: 3,
      tire: '32x10R16',
      assignee: people.tech,
      dueDays: 2,
    },
  ];
  const jobs = await tx
    .insert(schema.jobs)
    .values(
      plan.map((p, i) => ({
        shopId,
        number: 1001 + i,
        customerId: vehicles[p.vehicle]!.customerId,
        vehicleId: vehicles[p.vehicle]!.id,
        state: p.state,
        assigneeId: p.assignee,
        dueAt: new Date(Date.now() + p.dueDays * day + 3_600_000 * (9 + i)),
        createdById: people.lead,
        notes: p.state === 'sent_back' ? 'Bead photo on the outer face was blurred; retake.' : '',
      })),
    )
    .returning({ id: schema.jobs.id });
  const positions = ['LF', 'RF', 'LR', 'RR'] as const;
  const wheels = await tx
    .insert(schema.jobWheels)
    .values(
      // Each wheel is filled to its spec's running pressure, in the spec's unit.
      jobs.flatMap((j, i) => {
        const spec = DEMO_SPECS[plan[i]!.spec]!;
        return positions.map((position) => ({
          shopId,
          jobId: j.id,
          position,
          specId: specs[plan[i]!.spec]!.id,
          tireSize: plan[i]!.tire,
          directional: i % 3 === 0,
          targetPressure: spec.runningPressure,
          pressureUnit: spec.pressureUnit,
        }));
      }),
    )
    .returning({
      id: schema.jobWheels.id,
      jobId: schema.jobWheels.jobId,
      position: schema.jobWheels.position,
      targetPressure: schema.jobWheels.targetPressure,
      pressureUnit: schema.jobWheels.pressureUnit,
    });
  // Each job's history follows the same rules as a real run (see seed-demo-work.ts).
  const floor = settings?.floor ?? 20;
  const plans = DEMO_SPECS.map((spec, i) => ({
    ...spec,
    id: specs[i]!.id,
    plan: demoWheelPlan(spec, DEMO_WRENCHES, floor),
  }));
  await seedDemoWork(tx, {
    shopId,
    lead: people.lead,
    wrenchIds: wrenches.map((w) => w.id),
    photoDir: options.photoDir,
    jobs: jobs.map((j, i) => ({
      id: j.id,
      state: plan[i]!.state,
      assignee: plan[i]!.assignee,
      spec: plans[plan[i]!.spec]!,
      workDay: Math.min(plan[i]!.dueDays, 0) - 1,
      wheels: positions.map((p) => wheels.find((w) => w.jobId === j.id && w.position === p)!),
    })),
  });
}
