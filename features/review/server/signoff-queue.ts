import 'server-only';
import { and, asc, eq, max, sql } from 'drizzle-orm';
import { getDb } from '@/db';
import { customers, jobEvents, jobs, users, vehicles } from '@/db/schema';
import { countBySeverity } from '../anomalies';
import { getJobReview, type ReviewSources } from './review-data';

export type QueueEntry = {
  id: string;
  number: number;
  customerName: string;
  vehicleLabel: string;
  assigneeName: string | null;
  /** When it was submitted for sign-off (the latest submit). */
  awaitingSince: string;
  blocks: number;
  notes: number;
};
export type SignoffQueue = { count: number; jobs: QueueEntry[] };

/** A queue longer than this is a shop problem the board shows better; the count stays exact. */
const QUEUE_LIMIT = 50;

/**
 * The shop's job cards awaiting sign-off, oldest first, each with its anomalies counted by severity.
 * `countOnly`: just how many (the nav polls it), without computing every job's anomalies.
 */
export async function getSignoffQueue(
  shopId: string,
  sources: ReviewSources,
  { countOnly = false } = {},
): Promise<SignoffQueue> {
  const db = getDb();
  const since = max(jobEvents.at);
  const rows = await db
    .select({
      id: jobs.id,
      number: jobs.number,
      customerName: customers.name,
      year: vehicles.year,
      make: vehicles.make,
      model: vehicles.model,
      description: vehicles.description,
      assigneeName: users.name,
      since,
      updatedAt: jobs.updatedAt,
    })
    .from(jobs)
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(vehicles, eq(vehicles.id, jobs.vehicleId))
    .leftJoin(users, eq(users.id, jobs.assigneeId))
    .leftJoin(
      jobEvents,
      and(
        eq(jobEvents.jobId, jobs.id),
        eq(jobEvents.shopId, shopId),
        eq(jobEvents.toState, 'awaiting_signoff'),
      ),
    )
    .where(and(eq(jobs.shopId, shopId), eq(jobs.state, 'awaiting_signoff')))
    .groupBy(jobs.id, customers.name, vehicles.id, users.name)
    .orderBy(asc(sql`coalesce(${since}, ${jobs.updatedAt})`), asc(jobs.number));
  if (countOnly) return { count: rows.length, jobs: [] };
  const shown = rows.slice(0, QUEUE_LIMIT);
  const reviews = await Promise.all(shown.map((r) => getJobReview(shopId, r.id, sources)));
  return {
    count: rows.length,
    jobs: shown.map((r, i) => ({
      id: r.id,
      number: r.number,
      customerName: r.customerName,
      vehicleLabel:
        [r.year, r.make, r.model].filter(Boolean).join(' ') || r.description || 'Vehicle',
      assigneeName: r.assigneeName,
      awaitingSince: (r.since ?? r.updatedAt).toISOString(),
      ...countBySeverity(reviews[i]!.anomalies),
    })),
  };
}
