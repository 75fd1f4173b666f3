import { randomUUID } from 'node:crypto';
import { getDb } from '@/db';
import { users, type Role } from '@/db/schema';
import { createShopWithLead } from '@/features/accounts/server/accounts';
import { hashPassword } from '@/server/auth/password';
import { createSessionCookie, type Member } from '@/server/auth/session';

export const PASSWORD = 'correct horse battery';
let passwordHash: Promise<string> | undefined;

/** A shop with one person in each role, and a way to act as any of them. */
export async function createTestShop(name = 'Test Shop') {
  const tag = randomUUID().slice(0, 8);
  const lead = await createShopWithLead({
    shopName: name,
    name: 'Lena Lead',
    email: `lead-${tag}@shop.test`,
    password: PASSWORD,
  });
  passwordHash ??= hashPassword(PASSWORD);
  const hash = await passwordHash;
  const others = await getDb()
    .insert(users)
    .values(
      (['technician', 'apprentice'] as const).map((role) => ({
        shopId: lead.shopId,
        role,
        name: role === 'technician' ? 'Theo Tech' : 'Ada Apprentice',
        email: `${role}-${tag}@shop.test`,
        passwordHash: hash,
      })),
    )
    .returning({ id: users.id, role: users.role, email: users.email, name: users.name });
  const member = (id: string, role: Role, email: string, personName: string): Member => ({
    userId: id,
    shopId: lead.shopId,
    role,
    email,
    name: personName,
    sessionId: 'test',
  });
  const tech = others.find((o) => o.role === 'technician')!;
  const apprentice = others.find((o) => o.role === 'apprentice')!;
  return {
    shopId: lead.shopId,
    lead: member(lead.userId, 'lead', `lead-${tag}@shop.test`, 'Lena Lead'),
    technician: member(tech.id, 'technician', tech.email, tech.name),
    apprentice: member(apprentice.id, 'apprentice', apprentice.email, apprentice.name),
  };
}

/** A Cookie header that signs a request in as this user. */
export async function cookieFor(userId: string): Promise<string> {
  const cookie = await createSessionCookie(userId);
  return `${cookie.name}=${cookie.value}`;
}

/** A same-origin JSON request as the browser would send it. */
export function apiRequest(
  path: string,
  init: { method?: string; cookie?: string; body?: unknown; origin?: string | null } = {},
) {
  const headers = new Headers({ host: '127.0.0.1:3000', 'content-type': 'application/json' });
  if (init.cookie) headers.set('cookie', init.cookie);
  const origin = init.origin === undefined ? 'http://127.0.0.1:3000' : init.origin;
  if (origin) headers.set('origin', origin);
  return new Request(`http://127.0.0.1:3000${path}`, {
    method: init.method ?? 'GET',
    headers,
    body:
      init.body === undefined
        ? undefined
        : typeof init.body === 'string'
          ? init.body
          : JSON.stringify(init.body),
  });
}

export const params = <T extends Record<string, string>>(p: T) => ({ params: Promise.resolve(p) });
