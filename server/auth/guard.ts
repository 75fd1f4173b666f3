import 'server-only';
import { forbidden, redirect } from 'next/navigation';
import { DomainError } from '@/server/errors';
import { can, type Permission } from './permissions';
import { signInThenBackTo } from './return-path';
import { getCurrentMember, sessionCookieName, validateSessionId, type Member } from './session';
import { sessionIdOf } from './session-token';

/**
 * For pages and layouts: the signed-in member, or a redirect to sign-in (and back to `returnTo`
 * afterwards, when the page says where it is); a member without the permission gets the 403
 * page. Every shop page calls it itself (layouts do not protect pages).
 */
export async function requireMember(
  permission: Permission = 'board.view',
  returnTo?: string,
): Promise<Member> {
  const member = await getCurrentMember();
  if (!member) redirect(returnTo ? signInThenBackTo(returnTo) : '/sign-in');
  if (!can(member, permission)) forbidden();
  return member;
}

function readCookie(header: string | null, name: string): string | undefined {
  if (!header) return undefined;
  for (const part of header.split(';')) {
    const [key, ...rest] = part.trim().split('=');
    if (key === name) return decodeURIComponent(rest.join('='));
  }
  return undefined;
}

/** The request's session id (its cookie's hash) without asking the database; null when none. */
export function sessionIdForRequest(request: Request): string | null {
  const token = readCookie(request.headers.get('cookie'), sessionCookieName());
  return token ? sessionIdOf(token) : null;
}

/** For route handlers: reads the cookie from the request itself and throws a DomainError. */
export async function requireMemberForRequest(
  request: Request,
  permission: Permission,
): Promise<Member> {
  const result = await validateSessionId(
    readCookie(request.headers.get('cookie'), sessionCookieName()),
  );
  if (!result) throw new DomainError('unauthenticated', 'Sign in to continue.');
  if (!can(result.member, permission)) {
    throw new DomainError('forbidden', 'Your role does not allow this.');
  }
  return result.member;
}
