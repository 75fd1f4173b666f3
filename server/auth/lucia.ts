import 'server-only';
import { DrizzlePostgreSQLAdapter } from '@lucia-auth/adapter-drizzle';
import { Lucia, TimeSpan } from 'lucia';
import { getDb } from '@/db';
import { sessions, users, type Role } from '@/db/schema';
import { env } from '@/server/env.mjs';

// Lucia v3 is no longer developed upstream. It is used only inside server/auth/, so replacing it
// touches this folder alone.
function createLucia() {
  const secure = env().COOKIE_SECURE ?? env().NODE_ENV === 'production';
  return new Lucia(new DrizzlePostgreSQLAdapter(getDb(), sessions, users), {
    sessionExpiresIn: new TimeSpan(12, 'h'),
    sessionCookie: {
      name: 'ringpass_session',
      expires: false,
      attributes: { secure, sameSite: 'lax' },
    },
    getUserAttributes: (row) => ({
      shopId: row.shopId,
      email: row.email,
      name: row.name,
      role: row.role,
      removedAt: row.removedAt,
    }),
    getSessionAttributes: (row) => ({ absoluteExpiresAt: row.absoluteExpiresAt }),
  });
}

let instance: ReturnType<typeof createLucia> | undefined;
export function lucia() {
  instance ??= createLucia();
  return instance;
}

declare module 'lucia' {
  interface Register {
    Lucia: ReturnType<typeof createLucia>;
    UserId: string;
    DatabaseUserAttributes: {
      shopId: string;
      email: string;
      name: string;
      role: Role;
      removedAt: Date | null;
    };
    DatabaseSessionAttributes: { absoluteExpiresAt: Date };
  }
}
