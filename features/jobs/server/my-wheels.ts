import 'server-only';
import { and, asc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { getDb } from '@/db';
import { customers, jobs, jobWheels, vehicles, wheelSpecs, type WheelPosition } from '@/db/schema';
import type { Member } from '@/server/auth/session';
import { vehicleLabel } from './customers';

/** Why a wheel sits where it does in the list: what the technician does about it differs. */
export type MyWheelStatus = 'sent_back' | 'in_progress' | 'open' | 'stopped';

export type MyWheel = {
  jobId: string;
  jobNumber: number;
  wheelId: string;
  position: WheelPosition;
  customer: string;
  vehicle: string;
  tireSize: string;
  specName: string;
  dueAt: string | null;
  status: MyWheelStatus;
  /** The lead's note when the wheel was sent back. */
  reworkNote: string | null;
};

// Sent back first (a lead is waiting on it), then what is already on the machine, then the rest;
// a stopped wheel waits for a lead, so it goes last.
const rank = sql<number>`case
  when ${jobWheels.flaggedReason} is not null then 3
  when ${jobWheels.rework} is not null then 0
  when ${jobWheels.startedAt} is not null then 1
  else 2 end`;
const positionOrder = sql`array_position(array['LF','RF','LR','RR','spare']::wheel_position[], ${jobWheels.position})`;

/**
 * The wheels assigned to this member that still need their hands, in the order they should be
 * done: sent back, in progress, open by due time (none last), then job number and position.
 * Submitted wheels and jobs waiting for (or past) sign-off are not theirs to do.
 */
export async function listMyWheels(member: Member): Promise<MyWheel[]> {
  const rows = await getDb()
    .select({
      jobId: jobs.id,
      jobNumber: jobs.number,
      wheelId: jobWheels.id,
      position: jobWheels.position,
      customer: customers.name,
      year: vehicles.year,
      make: vehicles.make,
      model: vehicles.model,
      description: vehicles.description,
      tireSize: jobWheels.tireSize,
      specName: wheelSpecs.name,
      dueAt: jobs.dueAt,
      rank,
      rework: jobWheels.rework,
    })
    .from(jobWheels)
    .innerJoin(jobs, and(eq(jobs.id, jobWheels.jobId), eq(jobs.shopId, member.shopId)))
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(vehicles, eq(vehicles.id, jobs.vehicleId))
    .innerJoin(wheelSpecs, eq(wheelSpecs.id, jobWheels.specId))
    .where(
      and(
        eq(jobWheels.shopId, member.shopId),
        eq(jobs.assigneeId, member.userId),
        inArray(jobs.state, ['open', 'in_progress', 'sent_back']),
        isNull(jobWheels.submittedAt),
      ),
    )
    .orderBy(rank, sql`${jobs.dueAt} asc nulls last`, asc(jobs.number), positionOrder)
    .limit(200);
  const statuses: MyWheelStatus[] = ['sent_back', 'in_progress', 'open', 'stopped'];
  return rows.map((r) => ({
    jobId: r.jobId,
    jobNumber: r.jobNumber,
    wheelId: r.wheelId,
    position: r.position,
    customer: r.customer,
    vehicle: vehicleLabel(r),
    tireSize: r.tireSize,
    specName: r.specName,
    dueAt: r.dueAt?.toISOString() ?? null,
    status: statuses[r.rank] ?? 'open',
    reworkNote: r.rework?.note || null,
  }));
}
