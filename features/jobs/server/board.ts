import 'server-only';
import {
  and,
  asc,
  desc,
  eq,
  gte,
  ilike,
  inArray,
  isNull,
  lt,
  ne,
  or,
  sql,
  type SQL,
} from 'drizzle-orm';
import { getDb } from '@/db';
import { customers, jobs, jobWheels, users, vehicles } from '@/db/schema';
import { dueWindows, type ShopClock } from '@/features/ui/shop-time';
import type { Member } from '@/server/auth/session';
import { containsPattern } from '@/server/db-search';
import { getShopSettings } from '@/server/shop/settings';
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

function filters(member: Member, q: BoardQuery, clock: ShopClock): SQL | undefined {
  const search = q.q ? containsPattern(q.q) : undefined;
  // "Today" and "next 7 days" are the shop's calendar days in its zone, not the database's:
  // bounds computed as instants, so the due-date index still serves them.
  const windows = dueWindows(clock);
  return and(
    eq(jobs.shopId, member.shopId),
    q.state?.length ? inArray(jobs.state, q.state) : undefined,
    q.assignee === 'me'
      ? eq(jobs.assigneeId, member.userId)
      : q.assignee === 'unassigned'
        ? isNull(jobs.assigneeId)
        : q.assignee
          ? eq(jobs.assigneeId, q.assignee)
          : undefined,
    q.due === 'overdue' ? and(lt(jobs.dueAt, clock.now), ne(jobs.state, 'signed_off')) : undefined,
    q.due === 'today'
      ? and(gte(jobs.dueAt, windows.today.from), lt(jobs.dueAt, windows.today.to))
      : undefined,
    q.due === 'week'
      ? and(gte(jobs.dueAt, windows.week.from), lt(jobs.dueAt, windows.week.to))
      : undefined,
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
      return [
        sql`${jobs.dueAt} ${sql.raw(q.dir === 'desc' ? 'desc' : 'asc')} nulls last`,
        asc(jobs.number),
      ];
  }
}

/**
 * How many job cards match, for the pager. Its own scan of `jobs` (index-only on the board
 * index for the usual state filter), joined to customers and vehicles only when a search needs
 * them: `count(*) over ()` on the page's query made every matching card go through the joins and
 * the wheel count before the page was cut (about 2,000 rows for one shop's cards in progress).
 */
function totalQuery(member: Member, q: BoardQuery, clock: ShopClock) {
  const count = getDb()
    .select({ n: sql<number>`count(*)::int` })
    .from(jobs);
  const joined = q.q
    ? count
        .innerJoin(customers, eq(customers.id, jobs.customerId))
        .innerJoin(vehicles, eq(vehicles.id, jobs.vehicleId))
    : count;
  return joined.where(filters(member, q, clock));
}

/**
 * The board's page of job cards: the member's shop only, filtered, sorted and paginated in SQL.
 * One statement: the total is an uncorrelated subquery (run once, before the page's rows), whose
 * own `jobs` hides the outer one, so the same filters read its rows.
 */
export function boardQuery(member: Member, q: BoardQuery, clock: ShopClock) {
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
      total: sql<number>`(${totalQuery(member, q, clock)})`,
    })
    .from(jobs)
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(vehicles, eq(vehicles.id, jobs.vehicleId))
    .leftJoin(users, eq(users.id, jobs.assigneeId))
    .where(filters(member, q, clock))
    .orderBy(...ordering(q))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize);
}

/** `now` is for tests that stand at a chosen moment (say 23:30 at the shop); the app passes none. */
export async function listBoard(
  member: Member,
  q: BoardQuery,
  now = new Date(),
): Promise<BoardPage> {
  // Only the calendar windows need the zone; the board's hot path skips the settings read.
  const calendar = q.due === 'today' || q.due === 'week';
  const timeZone = calendar ? (await getShopSettings(member.shopId)).timeZone : 'UTC';
  const rows = await boardQuery(member, q, { timeZone, now });
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
