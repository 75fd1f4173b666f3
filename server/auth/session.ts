import 'server-only';
import { and, eq, lt, or, sql, type SQL } from 'drizzle-orm';
import { cookies } from 'next/headers';
import { cache } from 'react';
import { getDb } from '@/db';
import { roleEnum, sessions, users, type Role } from '@/db/schema';
import { env } from '@/server/env.mjs';
import { isClearedForRealWheels, standingClearanceSql } from './clearance';
import { can, type Permission } from './permissions';
import {
  blankCookie,
  generateSessionToken,
  SESSION_COOKIE,
  sessionCookie,
  sessionIdOf,
  type SessionCookie,
} from './session-token';

/** The signed-in person as every guard hands it on: who, which shop, which role. */
export type Member = {
  userId: string;
  shopId: string;
  role: Role;
  name: string;
  email: string;
  /** The session's id in the database (the hash of the cookie's token, never the token). */
  sessionId: string;
  /** An apprentice a lead has cleared for real wheels (read on every request, so a revoke counts at once). */
  clearedForRealWheels?: boolean;
};

export type Cookie = SessionCookie;

// An unused session ends after 12 hours; use renews it once half of that has passed (the idle
// lifetime the app had under Lucia). Independently it ends at its absolute lifetime.
const IDLE_MS = 12 * 3_600_000;

export async function createSessionCookie(userId: string): Promise<Cookie> {
  const token = generateSessionToken();
  const now = Date.now();
  const absoluteExpiresAt = new Date(now + env().SESSION_ABSOLUTE_HOURS * 3_600_000);
  const expiresAt = new Date(Math.min(now + IDLE_MS, absoluteExpiresAt.getTime()));
  const db = getDb();
  // Housekeeping: this person's ended sessions go when they start a new one.
  await db
    .delete(sessions)
    .where(
      and(
        eq(sessions.userId, userId),
        or(lt(sessions.expiresAt, new Date(now)), lt(sessions.absoluteExpiresAt, new Date(now))),
      ),
    );
  await db
    .insert(sessions)
    .values({ id: sessionIdOf(token)!, userId, expiresAt, absoluteExpiresAt });
  return sessionCookie(token, absoluteExpiresAt);
}

export function blankSessionCookie(): Cookie {
  return blankCookie();
}

export function sessionCookieName(): string {
  return SESSION_COOKIE;
}

/**
 * Checks a cookie's token: the idle expiry (renewed in the database when half used), the
 * absolute lifetime and the member's removal. The cookie itself never changes, so nothing needs
 * sending back.
 */
export async function validateSessionId(
  token: string | null | undefined,
): Promise<{ member: Member } | null> {
  const id = token ? sessionIdOf(token) : null;
  if (!id) return null;
  const db = getDb();
  const [row] = await db
    .select({
      id: sessions.id,
      expiresAt: sessions.expiresAt,
      absoluteExpiresAt: sessions.absoluteExpiresAt,
      userId: users.id,
      shopId: users.shopId,
      role: users.role,
      name: users.name,
      email: users.email,
      removedAt: users.removedAt,
    })
    .from(sessions)
    .innerJoin(users, eq(users.id, sessions.userId))
    .where(eq(sessions.id, id));
  if (!row) return null;
  const now = Date.now();
  if (row.expiresAt.getTime() <= now || row.absoluteExpiresAt.getTime() <= now || row.removedAt) {
    await db.delete(sessions).where(eq(sessions.id, id));
    return null;
  }
  if (row.expiresAt.getTime() - now < IDLE_MS / 2) {
    const expiresAt = new Date(Math.min(now + IDLE_MS, row.absoluteExpiresAt.getTime()));
    await db.update(sessions).set({ expiresAt }).where(eq(sessions.id, id));
  }
  const member: Member = {
    userId: row.userId,
    shopId: row.shopId,
    role: row.role,
    name: row.name,
    email: row.email,
    sessionId: row.id,
    ...(row.role === 'apprentice'
      ? { clearedForRealWheels: await isClearedForRealWheels(row.shopId, row.userId, db) }
      : {}),
  };
  return { member };
}

export async function setSessionCookie(cookie: Cookie) {
  (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
}

/** The member behind this request's cookie, once per request. Null when signed out. */
export const getCurrentMember = cache(async (): Promise<Member | null> => {
  const result = await validateSessionId((await cookies()).get(SESSION_COOKIE)?.value);
  return result?.member ?? null;
});

/**
 * The member behind a session id as a subquery of one statement — `(user_id, shop_id, role)` —
 * holding every check validateSessionId and can() make: the session live (idle and absolute end),
 * the person not removed, the role granted `permission` (an apprentice only with a standing
 * clearance). A session due for renewal gives no row: the caller then goes the ordinary way, so
 * the renewing write stays in validateSessionId (once per six hours of use), never in a save.
 */
export function liveMemberSql(sessionId: string, permission: Permission, now = Date.now()): SQL {
  const roles = roleEnum.enumValues.filter((role) => can(role, permission));
  const granted = [
    ...roles.map((role) => sql`u.role = ${role}`),
    ...(!roles.includes('apprentice') &&
    can({ role: 'apprentice', clearedForRealWheels: true }, permission)
      ? [sql`(u.role = 'apprentice' and ${standingClearanceSql(sql`u.shop_id`, sql`u.id`)})`]
      : []),
  ];
  if (!granted.length)
    return sql`select null::uuid as user_id, null::uuid as shop_id, null::text as role where false`;
  return sql`select u.id as user_id, u.shop_id, u.role::text as role
    from ${sessions} s join ${users} u on u.id = s.user_id
    where s.id = ${sessionId} and u.removed_at is null
      and s.expires_at >= ${new Date(now + IDLE_MS / 2).toISOString()}::timestamptz
      and s.absolute_expires_at > ${new Date(now).toISOString()}::timestamptz
      and (${sql.join(granted, sql` or `)})`;
}

export async function endSession(sessionId: string) {
  await getDb().delete(sessions).where(eq(sessions.id, sessionId));
  await setSessionCookie(blankSessionCookie());
}

/** Ends every session of a user: on a role change and on removal. */
export async function endAllSessionsOf(userId: string) {
  await getDb().delete(sessions).where(eq(sessions.userId, userId));
}
