import 'server-only';
import { and, asc, eq, inArray, isNull, notInArray, sql } from 'drizzle-orm';
import { getDb } from '@/db';
import { jobEvents, jobs, jobWheels, users, wheelSpecs } from '@/db/schema';
import { clearedAmong, isClearedForRealWheels, notClearedMessage } from '@/server/auth/clearance';
import { can } from '@/server/auth/permissions';
import type { Member } from '@/server/auth/session';
import { wheelTargetError } from '@/features/torque-plan';
import { DomainError, notFound } from '@/server/errors';
import { axleWarnings, intakeWarnings, tireSizeErrors } from '../axle-check';
import type { JobInput, JobStateName, WheelInput } from '../schemas';
import {
  createCustomer,
  createVehicle,
  getCustomer,
  getVehicle,
  vehicleLabel,
  type Customer,
  type Vehicle,
} from './customers';

/** `specFlag`: why the wheel's spec fails the plausibility rules (the runner will not run it), else null. */
export type JobWheel = WheelInput & {
  id: string;
  specName: string;
  specFlag: string | null;
  submittedAt: string | null;
  flaggedReason: string | null;
};
export type JobCard = {
  id: string;
  number: number;
  state: JobStateName;
  customer: Customer;
  vehicle: Vehicle & { label: string };
  assignee: { id: string; name: string } | null;
  dueAt: string | null;
  dismount: boolean;
  reinstall: boolean;
  notes: string;
  createdAt: string;
  updatedAt: string;
  wheels: JobWheel[];
  /** `selfSignoff`: a lead signed off their own work under the single-lead setting; `note` is their reason. `wheels`: a send-back's wheels with their notes. */
  events: {
    action: string;
    fromState: JobStateName | null;
    toState: JobStateName;
    by: string;
    note: string;
    selfSignoff: boolean;
    wheels: { wheelId: string; note: string; steps: string[] }[] | null;
    at: string;
  }[];
  /** Intake warnings that do not stop the work (an axle with one wheel on the card); see `intakeWarnings`. */
  warnings: string[];
};

const wheelColumns = {
  id: jobWheels.id,
  jobId: jobWheels.jobId,
  position: jobWheels.position,
  specId: jobWheels.specId,
  specName: wheelSpecs.name,
  specFlag: wheelSpecs.plausibilityFlag,
  tireSize: jobWheels.tireSize,
  directional: jobWheels.directional,
  targetPressure: jobWheels.targetPressure,
  pressureUnit: jobWheels.pressureUnit,
  submittedAt: jobWheels.submittedAt,
  flaggedReason: jobWheels.flaggedReason,
};
const wheelDto = (
  w: Omit<JobWheel, 'submittedAt'> & { jobId: string; submittedAt: Date | null },
) => ({ ...w, submittedAt: w.submittedAt?.toISOString() ?? null });

/**
 * Assignable people: active leads and technicians of the shop, and apprentices a lead has cleared
 * for real wheels (the others only practise).
 */
export async function listAssignees(shopId: string) {
  const people = await activeMembers(shopId);
  const cleared = await clearedAmong(
    shopId,
    people.filter((p) => p.role === 'apprentice').map((p) => p.id),
  );
  return people.filter((p) => p.role !== 'apprentice' || cleared.has(p.id));
}

function activeMembers(shopId: string) {
  return getDb()
    .select({ id: users.id, name: users.name, role: users.role })
    .from(users)
    .where(and(eq(users.shopId, shopId), isNull(users.removedAt)))
    .orderBy(asc(users.name));
}

async function assertAssignee(actor: Member, assigneeId: string | null | undefined) {
  if (!assigneeId) return;
  if (!can(actor.role, 'jobs.assign') && assigneeId !== actor.userId) {
    const message =
      'Only a lead assigns job cards to others; you can take it yourself or leave it unassigned.';
    throw new DomainError('forbidden', message, { assigneeId: [message] });
  }
  const person = (await activeMembers(actor.shopId)).find((p) => p.id === assigneeId);
  if (!person) {
    const message = 'Assign the job to a lead or technician of this shop.';
    throw new DomainError('invalid', message, { assigneeId: [message] });
  }
  if (person.role === 'apprentice' && !(await isClearedForRealWheels(actor.shopId, person.id))) {
    const message = notClearedMessage(person.name);
    throw new DomainError('invalid', message, { assigneeId: [message] });
  }
}

type TargetedWheel = {
  specId: string;
  targetPressure: number;
  pressureUnit: WheelInput['pressureUnit'];
};

/**
 * Each wheel's spec is this shop's, and its target pressure is below that spec's bead-seating
 * limit (the engine's rule; a unit slip such as 2.4 psi meant as bar is caught the other way by
 * the limit being far above it, so only the dangerous side is refused). `field` names the form field.
 */
async function assertSpecs(
  shopId: string,
  wheels: TargetedWheel[],
  field: (index: number, name: string) => string = (i, name) => `wheels.${i}.${name}`,
) {
  const specIds = wheels.map((w) => w.specId);
  const found = await getDb()
    .select({
      id: wheelSpecs.id,
      limit: wheelSpecs.maxBeadSeatPressure,
      unit: wheelSpecs.pressureUnit,
    })
    .from(wheelSpecs)
    .where(and(eq(wheelSpecs.shopId, shopId), inArray(wheelSpecs.id, specIds)));
  const missing = specIds.findIndex((id) => !found.some((f) => f.id === id));
  if (missing >= 0) {
    const message = 'Pick a wheel spec of this shop.';
    throw new DomainError('invalid', message, { [field(missing, 'specId')]: [message] });
  }
  const errors: Record<string, string[]> = {};
  wheels.forEach((w, i) => {
    const spec = found.find((f) => f.id === w.specId)!;
    const error = wheelTargetError(
      { value: w.targetPressure, unit: w.pressureUnit },
      { value: spec.limit, unit: spec.unit },
    );
    if (error) errors[field(i, 'targetPressure')] = [error];
  });
  if (Object.keys(errors).length)
    throw new DomainError('invalid', Object.values(errors)[0]![0]!, errors);
}

/** Tire sizes the engine reads, and the axle check: warnings stop the save until accepted. */
function assertTires(wheels: WheelInput[], accepted: boolean) {
  const sizeErrors = tireSizeErrors(wheels);
  if (Object.keys(sizeErrors).length)
    throw new DomainError(
      'invalid',
      'A tire size is not one Ringpass can read; see the wheels.',
      sizeErrors,
    );
  const warnings = axleWarnings(wheels);
  if (warnings.length && !accepted) {
    throw new DomainError(
      'invalid',
      'The tires do not match. Fix them, or tick "Save anyway" if the vehicle maker allows it.',
      { wheels: warnings },
    );
  }
}

export async function createJob(
  actor: Member,
  input: JobInput,
): Promise<{ id: string; number: number }> {
  await assertAssignee(actor, input.assigneeId);
  await assertSpecs(actor.shopId, input.wheels);
  assertTires(input.wheels, input.acceptAxleMismatch);
  return getDb().transaction(async (tx) => {
    const customer = input.customerId
      ? await getCustomer(actor.shopId, input.customerId, tx)
      : await createCustomer(actor, input.customer!, tx);
    let vehicle: Vehicle;
    if (input.vehicleId) {
      vehicle = await getVehicle(actor.shopId, input.vehicleId, tx);
      if (vehicle.customerId !== customer.id) {
        throw new DomainError('invalid', 'That vehicle belongs to another customer.', {
          vehicleId: ['That vehicle belongs to another customer.'],
        });
      }
    } else {
      vehicle = await createVehicle(actor, customer.id, input.vehicle!, tx);
    }
    // Job numbers count up per shop; the lock keeps two creations from taking the same one.
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${actor.shopId}))`);
    const [next] = await tx
      .select({ n: sql<number>`coalesce(max(${jobs.number}), 1000) + 1` })
      .from(jobs)
      .where(eq(jobs.shopId, actor.shopId));
    const [job] = await tx
      .insert(jobs)
      .values({
        shopId: actor.shopId,
        number: Number(next!.n),
        customerId: customer.id,
        vehicleId: vehicle.id,
        assigneeId: input.assigneeId ?? null,
        dueAt: input.dueAt ?? null,
        dismount: input.dismount,
        reinstall: input.reinstall,
        notes: input.notes,
        createdById: actor.userId,
      })
      .returning({ id: jobs.id, number: jobs.number });
    await tx
      .insert(jobWheels)
      .values(input.wheels.map((w) => ({ ...w, shopId: actor.shopId, jobId: job!.id })));
    await tx.insert(jobEvents).values({
      shopId: actor.shopId,
      jobId: job!.id,
      action: 'create',
      fromState: null,
      toState: 'open',
      byId: actor.userId,
    });
    return job!;
  });
}

export async function getJob(shopId: string, jobId: string): Promise<JobCard> {
  const db = getDb();
  const [row] = await db
    .select({ job: jobs, assigneeName: users.name })
    .from(jobs)
    .leftJoin(users, eq(users.id, jobs.assigneeId))
    .where(and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)));
  if (!row) throw notFound('That job card');
  const { job } = row;
  const [customer, vehicle, wheels, events] = await Promise.all([
    getCustomer(shopId, job.customerId),
    getVehicle(shopId, job.vehicleId),
    db
      .select(wheelColumns)
      .from(jobWheels)
      .innerJoin(wheelSpecs, eq(wheelSpecs.id, jobWheels.specId))
      .where(and(eq(jobWheels.shopId, shopId), eq(jobWheels.jobId, jobId))),
    db
      .select({
        action: jobEvents.action,
        fromState: jobEvents.fromState,
        toState: jobEvents.toState,
        by: users.name,
        note: jobEvents.note,
        selfSignoff: jobEvents.selfSignoff,
        wheels: jobEvents.wheels,
        at: jobEvents.at,
      })
      .from(jobEvents)
      .innerJoin(users, eq(users.id, jobEvents.byId))
      .where(and(eq(jobEvents.shopId, shopId), eq(jobEvents.jobId, jobId)))
      .orderBy(asc(jobEvents.at)),
  ]);
  const order = ['LF', 'RF', 'LR', 'RR', 'spare'];
  return {
    id: job.id,
    number: job.number,
    state: job.state,
    customer,
    vehicle: { ...vehicle, label: vehicleLabel(vehicle) },
    assignee: job.assigneeId ? { id: job.assigneeId, name: row.assigneeName ?? '' } : null,
    dueAt: job.dueAt?.toISOString() ?? null,
    dismount: job.dismount,
    reinstall: job.reinstall,
    notes: job.notes,
    createdAt: job.createdAt.toISOString(),
    updatedAt: job.updatedAt.toISOString(),
    wheels: wheels
      .map(wheelDto)
      .sort((a, b) => order.indexOf(a.position) - order.indexOf(b.position)),
    events: events.map((e) => ({ ...e, at: e.at.toISOString() })),
    warnings: intakeWarnings(wheels),
  };
}

const ASSIGNEE_LOCKED =
  'The assignee cannot change while the job card awaits sign-off: the record names who did the work.';

export async function updateJob(
  actor: Member,
  jobId: string,
  patch: {
    assigneeId?: string | null;
    dueAt?: Date | null;
    notes?: string;
    dismount?: boolean;
    reinstall?: boolean;
  },
): Promise<JobCard> {
  const job = await getJob(actor.shopId, jobId);
  if (job.state === 'signed_off')
    throw new DomainError('conflict', 'A signed-off job card is a record and cannot be edited.');
  const reassigning =
    patch.assigneeId !== undefined && patch.assigneeId !== (job.assignee?.id ?? null);
  if (reassigning && job.state === 'awaiting_signoff')
    throw new DomainError('conflict', ASSIGNEE_LOCKED, { assigneeId: [ASSIGNEE_LOCKED] });
  // Only a new assignee is checked: editing notes or the due date of a card held by an apprentice
  // whose clearance was revoked must not wait for the lead to reassign it first.
  if (reassigning) await assertAssignee(actor, patch.assigneeId);
  // An unchanged assignee is not written, so a reassignment that lands meanwhile is not undone.
  const { assigneeId, ...rest } = patch;
  // Not signed off at the moment of writing: a sign-off that lands first keeps the record whole;
  // a reassignment only while the job is not awaiting sign-off then either.
  const lockedStates: JobStateName[] = reassigning
    ? ['signed_off', 'awaiting_signoff']
    : ['signed_off'];
  const edited = await getDb()
    .update(jobs)
    .set({ ...rest, ...(reassigning ? { assigneeId } : {}), updatedAt: new Date() })
    .where(
      and(eq(jobs.shopId, actor.shopId), eq(jobs.id, jobId), notInArray(jobs.state, lockedStates)),
    )
    .returning({ id: jobs.id });
  if (!edited.length)
    throw new DomainError(
      'conflict',
      reassigning ? ASSIGNEE_LOCKED : 'A signed-off job card is a record and cannot be edited.',
    );
  return getJob(actor.shopId, jobId);
}

type Tx = Parameters<Parameters<ReturnType<typeof getDb>['transaction']>[0]>[0];

const WHEELS_LOCKED = 'Wheels can change only while the job card is open or sent back.';
const WHEELS_EDITABLE_IN: JobStateName[] = ['open', 'sent_back'];

async function assertWheelsEditable(actor: Member, jobId: string) {
  const job = await getJob(actor.shopId, jobId);
  if (!WHEELS_EDITABLE_IN.includes(job.state)) throw new DomainError('conflict', WHEELS_LOCKED);
  return job;
}

/**
 * Writes a wheel while holding the job card's row, and only if the card is still editable then:
 * a start that lands between the check above and the write waits for it, or wins and refuses it.
 */
async function whileWheelsEditable<T>(
  actor: Member,
  jobId: string,
  write: (tx: Tx) => Promise<T>,
): Promise<T> {
  return getDb().transaction(async (tx) => {
    const [held] = await tx
      .select({ id: jobs.id })
      .from(jobs)
      .where(
        and(
          eq(jobs.shopId, actor.shopId),
          eq(jobs.id, jobId),
          inArray(jobs.state, WHEELS_EDITABLE_IN),
        ),
      )
      .for('update');
    if (!held) throw new DomainError('conflict', WHEELS_LOCKED);
    return write(tx);
  });
}

export async function addWheel(
  actor: Member,
  jobId: string,
  wheel: WheelInput,
  acceptAxleMismatch = false,
): Promise<JobWheel> {
  const job = await assertWheelsEditable(actor, jobId);
  if (job.wheels.some((w) => w.position === wheel.position)) {
    throw new DomainError('conflict', `The job already has a ${wheel.position} wheel.`, {
      position: [`The job already has a ${wheel.position} wheel.`],
    });
  }
  await assertSpecs(actor.shopId, [wheel], (_, name) => name);
  assertTires([...job.wheels, wheel], acceptAxleMismatch);
  const [row] = await whileWheelsEditable(actor, jobId, (tx) =>
    tx
      .insert(jobWheels)
      .values({ ...wheel, shopId: actor.shopId, jobId })
      .returning({ id: jobWheels.id }),
  );
  return (await getJob(actor.shopId, jobId)).wheels.find((w) => w.id === row!.id)!;
}

export async function getWheel(
  shopId: string,
  wheelId: string,
): Promise<JobWheel & { jobId: string }> {
  const [row] = await getDb()
    .select(wheelColumns)
    .from(jobWheels)
    .innerJoin(wheelSpecs, eq(wheelSpecs.id, jobWheels.specId))
    .where(and(eq(jobWheels.shopId, shopId), eq(jobWheels.id, wheelId)));
  if (!row) throw notFound('That wheel');
  return wheelDto(row);
}

export async function updateWheel(
  actor: Member,
  wheelId: string,
  wheel: WheelInput,
  acceptAxleMismatch = false,
): Promise<JobWheel> {
  const current = await getWheel(actor.shopId, wheelId);
  const job = await assertWheelsEditable(actor, current.jobId);
  if (job.wheels.some((w) => w.id !== wheelId && w.position === wheel.position)) {
    throw new DomainError('conflict', `The job already has a ${wheel.position} wheel.`, {
      position: [`The job already has a ${wheel.position} wheel.`],
    });
  }
  await assertSpecs(actor.shopId, [wheel], (_, name) => name);
  assertTires([...job.wheels.filter((w) => w.id !== wheelId), wheel], acceptAxleMismatch);
  await whileWheelsEditable(actor, current.jobId, (tx) =>
    tx
      .update(jobWheels)
      .set(wheel)
      .where(and(eq(jobWheels.shopId, actor.shopId), eq(jobWheels.id, wheelId))),
  );
  return getWheel(actor.shopId, wheelId);
}
