import 'server-only';
import { and, asc, eq, isNull } from 'drizzle-orm';
import { getDb } from '@/db';
import { customers, jobs, jobWheels, shops, users, vehicles, wheelSpecs } from '@/db/schema';
import { tighteningSequence, type Pattern } from '@/features/torque-plan';
import { formatShopDay } from '@/features/ui/shop-time';
import type { OutgoingMail } from '@/server/mail/mailer';
import { recheckReminderMail, type ReminderWheel } from '../reminder-mail';

const POSITION_NAMES: Record<string, string> = {
  LF: 'Left front',
  RF: 'Right front',
  LR: 'Left rear',
  RR: 'Right rear',
  spare: 'Spare',
};

/** The customer, the vehicle and the job number a follow-up mail names, scoped by shop. */
export async function getJobContact(shopId: string, jobId: string) {
  const [job] = await getDb()
    .select({
      number: jobs.number,
      state: jobs.state,
      shopName: shops.name,
      customer: customers.name,
      email: customers.email,
      year: vehicles.year,
      make: vehicles.make,
      model: vehicles.model,
      description: vehicles.description,
    })
    .from(jobs)
    .innerJoin(shops, eq(shops.id, jobs.shopId))
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(vehicles, eq(vehicles.id, jobs.vehicleId))
    .where(and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)));
  if (!job) return null;
  const vehicle =
    [job.year, job.make, job.model].filter(Boolean).join(' ') || job.description || 'vehicle';
  return { ...job, email: job.email.trim(), vehicle };
}

/**
 * Each wheel's ring as it was done: bolt count, sequence and final torque from its snapshot (the
 * spec as the technician was given it), or from the spec itself for a wheel recorded without one.
 */
async function reminderWheels(shopId: string, jobId: string): Promise<ReminderWheel[]> {
  const rows = await getDb()
    .select({
      position: jobWheels.position,
      snapshot: jobWheels.snapshot,
      boltCount: wheelSpecs.boltCount,
      finalTorque: wheelSpecs.finalTorque,
      torqueUnit: wheelSpecs.torqueUnit,
      patternKind: wheelSpecs.patternKind,
      skipStep: wheelSpecs.skipStep,
      makerReference: wheelSpecs.makerReference,
    })
    .from(jobWheels)
    .innerJoin(wheelSpecs, eq(wheelSpecs.id, jobWheels.specId))
    .where(and(eq(jobWheels.shopId, shopId), eq(jobWheels.jobId, jobId)))
    .orderBy(asc(jobWheels.position));
  return rows.map((r) => {
    const position = POSITION_NAMES[r.position] ?? r.position;
    if (r.snapshot)
      return {
        position,
        boltCount: r.snapshot.spec.boltCount,
        sequence: r.snapshot.plan.sequence,
        finalTorque: r.snapshot.spec.finalTorque,
        makerReference: r.snapshot.spec.makerReference,
      };
    const pattern: Pattern =
      r.patternKind === 'skip' ? { kind: 'skip', step: r.skipStep ?? 2 } : { kind: r.patternKind };
    return {
      position,
      boltCount: r.boltCount,
      sequence: tighteningSequence(r.boltCount, pattern),
      finalTorque: { value: r.finalTorque, unit: r.torqueUnit },
      makerReference: r.makerReference,
    };
  });
}

/**
 * The reminder for one job, to the customer, or to the shop's leads when the customer has no
 * address (so someone calls). Null when the job is gone or nobody could receive it. The leads get
 * one message with all of them as recipients: a retry after a refused send then repeats nothing
 * anyone already has.
 */
export async function composeRecheckReminder(
  shopId: string,
  jobId: string,
  dueOn: string,
): Promise<OutgoingMail | null> {
  const job = await getJobContact(shopId, jobId);
  if (!job) return null;
  const recipients = job.email
    ? [job.email]
    : (
        await getDb()
          .select({ email: users.email })
          .from(users)
          .where(and(eq(users.shopId, shopId), eq(users.role, 'lead'), isNull(users.removedAt)))
      ).map((u) => u.email);
  if (!recipients.length) return null;
  const mail = recheckReminderMail({
    shopName: job.shopName,
    customer: job.customer,
    vehicle: job.vehicle,
    jobNumber: job.number,
    dueOn,
    dueText: formatShopDay(dueOn),
    wheels: await reminderWheels(shopId, jobId),
    forShop: !job.email,
  });
  return { to: recipients.join(', '), shopId, ...mail };
}
