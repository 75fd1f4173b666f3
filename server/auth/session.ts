import 'server-only';
import type { Cookie } from 'lucia';
import { cookies } from 'next/headers';
import { cache } from 'react';
import type { Role } from '@/db/schema';
import { env } from '@/server/env.mjs';
import { lucia } from './lucia';

/** The signed-in person as every guard hands it on: who, which shop, which role. */
export type Member = {
  userId: string;
  shopId: string;
  role: Role;
  name: string;
  email: string;
  sessionId: string;
};

export async function createSessionCookie(userId: string): Promise<Cookie> {
  const absoluteExpiresAt = new Date(Date.now() + env().SESSION_ABSOLUTE_HOURS * 3_600_000);
  const session = await lucia().createSession(userId, { absoluteExpiresAt });
  return lucia().createSessionCookie(session.id);
}

export function blankSessionCookie(): Cookie {
  return lucia().createBlankSessionCookie();
}

export function sessionCookieName(): string {
  return lucia().sessionCookieName;
}

/**
 * Checks a session id: Lucia's sliding expiry, then our absolute lifetime and the member's
 * removal. `refresh` is a cookie to send back when Lucia extended the session.
 */
export async function validateSessionId(
  sessionId: string | null | undefined,
): Promise<{ member: Member; refresh?: Cookie } | null> {
  if (!sessionId) return null;
  const { session, user } = await lucia().validateSession(sessionId);
  if (!session || !user) return null;
  if (session.absoluteExpiresAt.getTime() <= Date.now() || user.removedAt) {
    await lucia().invalidateSession(session.id);
    return null;
  }
  const member: Member = {
    userId: user.id,
    shopId: user.shopId,
    role: user.role,
    name: user.name,
    email: user.email,
    sessionId: session.id,
  };
  return { member, refresh: session.fresh ? lucia().createSessionCookie(session.id) : undefined };
}

export async function setSessionCookie(cookie: Cookie) {
  (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
}

/** The member behind this request's cookie, once per request. Null when signed out. */
export const getCurrentMember = cache(async (): Promise<Member | null> => {
  const jar = await cookies();
  const result = await validateSessionId(jar.get(sessionCookieName())?.value);
  if (!result) return null;
  if (result.refresh) {
    // Server components may not set cookies; the next action or route handler will.
    try {
      jar.set(result.refresh.name, result.refresh.value, result.refresh.attributes);
    } catch {}
  }
  return result.member;
});

export async function endSession(sessionId: string) {
  await lucia().invalidateSession(sessionId);
  await setSessionCookie(blankSessionCookie());
}

/** Ends every session of a user: on a role change and on removal. */
export async function endAllSessionsOf(userId: string) {
  await lucia().invalidateUserSessions(userId);
}
