import { createCustomer, createVehicle } from '@/features/jobs/server/customers';
import { createJob } from '@/features/jobs/server/jobs';
import { specSchema } from '@/features/specs/schemas';
import { createSpec } from '@/features/specs/server/specs';
import { wrenchSchema } from '@/features/tool-crib/schemas';
import { createWrench } from '@/features/tool-crib/server/wrenches';
import type { Member } from '@/server/auth/session';

export const specBody = {
  name: 'Test 24-bolt ring',
  boltCount: 24,
  boltThread: 'M8×1.25',
  finalTorque: 12,
  torqueUnit: 'lbf-ft' as const,
  passPercents: [30, 70, 100],
  patternKind: 'cross' as const,
  checkPass: true,
  maxBeadSeatPressure: 30,
  runningPressure: 14,
  pressureUnit: 'psi' as const,
};

const inAYear = new Date(Date.now() + 365 * 86_400_000).toISOString().slice(0, 10);
export const wrenchBody = {
  label: 'Test click 20–200 in-lb',
  kind: 'click',
  min: 20,
  max: 200,
  unit: 'lbf-in',
  graduation: 1,
  calibrationDueOn: inAYear,
};

export const fourWheels = (specId: string, size = '30x10R14') =>
  (['LF', 'RF', 'LR', 'RR'] as const).map((position) => ({
    position,
    specId,
    tireSize: size,
    directional: false,
    targetPressure: 14,
    pressureUnit: 'psi' as const,
  }));

/** A spec, a wrench, a customer with a vehicle and a four-wheel job assigned to the technician. */
export async function createRecords(
  lead: Member,
  technicianId: string,
  spec: Partial<typeof specBody> = {},
) {
  const specRow = await createSpec(lead, specSchema.parse({ ...specBody, ...spec }));
  const wrench = await createWrench(lead, wrenchSchema.parse(wrenchBody));
  const customer = await createCustomer(lead, {
    name: 'Wren Halloway',
    phone: '555-0142',
    email: 'wren@example.test',
  });
  const vehicle = await createVehicle(lead, customer.id, {
    year: 2022,
    make: 'Talonworks',
    model: 'Ridgeback',
    description: '',
    vinOverride: false,
  });
  const job = await createJob(lead, {
    customerId: customer.id,
    vehicleId: vehicle.id,
    wheels: fourWheels(specRow.id),
    dismount: true,
    reinstall: true,
    assigneeId: technicianId,
    notes: '',
    acceptAxleMismatch: false,
  });
  return { spec: specRow, wrench, customer, vehicle, job };
}

/**
 * A passing verification of a wrench at a given moment (40 in-lb by default: near pass 1 of the
 * test spec, 43.2 in-lb, within the default ±25 %), for tests whose events are dated in the past.
 */
export async function verifiedAt(member: Member, wrenchId: string, at: Date, referenceValue = 40) {
  const { getDb } = await import('@/db');
  const { wrenchVerifications } = await import('@/db/schema');
  await getDb().insert(wrenchVerifications).values({
    shopId: member.shopId,
    wrenchId,
    referenceValue,
    readingValue: referenceValue,
    unit: 'lbf-in',
    deviationPct: 0,
    tolerancePct: 4,
    withinTolerance: true,
    recordedById: member.userId,
    recordedAt: at,
  });
}
