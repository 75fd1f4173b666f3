import 'server-only';
import { and, count, eq, isNull, sql } from 'drizzle-orm';
import { getDb } from '@/db';
import { users } from '@/db/schema';
import { getShopSettings } from '@/server/shop/settings';
import type { WorkFacts } from '../transitions';

/**
 * Who worked on a job, judged by the record and never by who is assigned now (a lead who
 * unassigns themselves still recorded the events): anyone with a runner event on it (superseded
 * ones too), who submitted one of its wheels, or who submitted the job.
 */
export async function jobWorkerIds(shopId: string, jobId: string): Promise<string[]> {
  const rows = await getDb().execute<{ id: string }>(sql`
    select by_id as id from wheel_run_events where shop_id = ${shopId} and job_id = ${jobId}
    union select submitted_by_id from job_wheels where shop_id = ${shopId} and job_id = ${jobId} and submitted_by_id is not null
    union select by_id from job_events where shop_id = ${shopId} and job_id = ${jobId} and action = 'submit'`);
  return rows.map((r) => r.id);
}

/** The single-lead setting applies only while the shop has exactly one (active) lead. */
export async function selfSignoffAllowed(shopId: string): Promise<boolean> {
  const settings = await getShopSettings(shopId);
  if (!settings.singleLeadSelfSignoff) return false;
  const [leads] = await getDb()
    .select({ n: count() })
    .from(users)
    .where(and(eq(users.shopId, shopId), eq(users.role, 'lead'), isNull(users.removedAt)));
  return leads?.n === 1;
}

export async function getWorkFacts(shopId: string, jobId: string): Promise<Required<WorkFacts>> {
  const [workerIds, allowed] = await Promise.all([
    jobWorkerIds(shopId, jobId),
    selfSignoffAllowed(shopId),
  ]);
  return { workerIds, selfSignoffAllowed: allowed };
}
