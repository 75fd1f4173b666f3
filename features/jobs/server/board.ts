import 'server-only';
import { and, asc, desc, eq, ilike, inArray, isNull, lt, ne, or, sql, type SQL } from 'drizzle-orm';
import { getDb } from '@/db';
import { customers, jobs, jobWheels, users, vehicles } from '@/db/schema';
import type { Member } from '@/server/auth/session';
import { containsPattern } from '@/server/db-search';
import type { BoardQuery, JobStateName } from '../schemas';
import { vehicleLabel } from './customers';

export type BoardRow = {
  id: string;
  number: number;
  state: JobStateName;
  customer: string;
  vehicle: string;
  wheelCount: number;
  assignee: { id: string; name: string } | null;
  dueAt: string | null;
  updatedAt: string;
};

export type BoardPage = { data: BoardRow[]; page: number; pageSize: number; total: number };

function filters(member: Member, q: BoardQuery): SQL | undefined {
  const search = q.q ? containsPattern(q.q) : undefined;
  return and(
    eq(jobs.shopId, member.shopId),
    q.state?.length ? inArray(jobs.state, q.state) : undefined,
    q.assignee === 'me' ? eq(jobs.assigneeId, member.userId) : q.assignee === 'unassigned' ? isNull(jobs.assigneeId) : q.assignee ? eq(jobs.assigneeId, q.assignee) : undefined,
    q.due === 'overdue' ? and(lt(jobs.dueAt, sql`now()`), ne(jobs.state, 'signed_off')) : undefined,
    q.due === 'today' ? sql`(${jobs.dueAt} at time zone 'UTC')::date = (now() at time zone 'UTC')::date` : undefined,
    q.due === 'week' ? sql`${jobs.dueAt} between now() and now() + interval '7 days'` : undefined,
    search
      ? or(
          ilike(customers.name, search),
          ilike(vehicles.make, search),
          ilike(vehicles.model, search),
          ilike(vehicles.description, search),
          ilike(vehicles.vin, search),
          sql`${jobs.number}::text = ${q.q}`,
        )
      : undefined,
  );
}

function ordering(q: BoardQuery): SQL[] {
  const dir = q.dir === 'desc' ? desc : asc;
  switch (q.sort) {
    case 'number':
      return [dir(jobs.number)];
    case 'state':
      return [dir(jobs.state), asc(jobs.dueAt), asc(jobs.number)];
    case 'customer':
      return [dir(customers.name), asc(jobs.number)];
    case 'updated':
      return [dir(jobs.updatedAt), asc(jobs.number)];
    default:
      return [sql`${jobs.dueAt} ${sql.raw(q.dir === 'desc' ? 'desc' : 'asc')} nulls last`, asc(jobs.number)];
  }
}

/** The board's page of job cards: the member's shop only, filtered, sorted and paginated in SQL. */
export function boardQuery(member: Member, q: BoardQuery) {
  return getDb()
    .select({
      id: jobs.id,
      number: jobs.number,
      state: jobs.state,
      customer: customers.name,
      year: vehicles.year,
      make: vehicles.make,
      model: vehicles.model,
      description: vehicles.description,
      assigneeId: jobs.assigneeId,
      assigneeName: users.name,
      dueAt: jobs.dueAt,
      updatedAt: jobs.updatedAt,
      wheelCount: sql<number>`(select count(*)::int from ${jobWheels} where ${jobWheels.jobId} = ${jobs.id})`,
      total: sql<number>`count(*) over ()::int`,
    })
    .from(jobs)
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(vehicles, eq(vehicles.id, jobs.vehicleId))
    .leftJoin(users, eq(users.id, jobs.assigneeId))
    .where(filters(member, q))
    .orderBy(...ordering(q))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize);
}

export async function listBoard(member: Member, q: BoardQuery): Promise<BoardPage> {
  const rows = await boardQuery(member, q);
  return {
    data: rows.map((r) => ({
      id: r.id,
      number: r.number,
      state: r.state,
      customer: r.customer,
      vehicle: vehicleLabel(r),
      wheelCount: r.wheelCount,
      assignee: r.assigneeId ? { id: r.assigneeId, name: r.assigneeName ?? '' } : null,
      dueAt: r.dueAt?.toISOString() ?? null,
      updatedAt: r.updatedAt.toISOString(),
    })),
    page: q.page,
    pageSize: q.pageSize,
    total: rows[0]?.total ?? 0,
  };
}
