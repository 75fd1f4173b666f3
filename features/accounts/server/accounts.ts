import 'server-only';
import { eq } from 'drizzle-orm';
import { getDb } from '@/db';
import { shops, shopSettings, users, type Role } from '@/db/schema';
import { burnPasswordCheck, hashPassword, verifyPassword } from '@/server/auth/password';
import {
  accountDelayMs,
  accountFailures,
  recordFailure,
  recordSuccess,
  reserveAttempt,
} from '@/server/auth/throttle';
import { DomainError } from '@/server/errors';
import type { SignInInput, SignUpInput } from '../schemas';

const EMAIL_TAKEN = 'An account with this e-mail already exists. Sign in instead.';

/** The sign-up form's fields, with the password or (from a confirmed sign-up) its hash. */
export type NewShop = Omit<SignUpInput, 'password'> &
  ({ password: string } | { passwordHash: string });

/** A new shop and its first lead, in one transaction. */
export async function createShopWithLead(
  input: NewShop,
): Promise<{ userId: string; shopId: string }> {
  const passwordHash =
    'passwordHash' in input ? input.passwordHash : await hashPassword(input.password);
  const db = getDb();
  const existing = await db
    .select({ id: users.id })
    .from(users)
    .where(eq(users.email, input.email));
  if (existing.length) throw new DomainError('conflict', EMAIL_TAKEN, { email: [EMAIL_TAKEN] });
  try {
    return await db.transaction(async (tx) => {
      const [shop] = await tx
        .insert(shops)
        .values({ name: input.shopName })
        .returning({ id: shops.id });
      // The trigger made the settings row with the shop; the clock starts as the browser's.
      if (input.timeZone)
        await tx
          .update(shopSettings)
          .set({ timeZone: input.timeZone })
          .where(eq(shopSettings.shopId, shop!.id));
      const [user] = await tx
        .insert(users)
        .values({
          shopId: shop!.id,
          email: input.email,
          name: input.name,
          role: 'lead',
          passwordHash,
        })
        .returning({ id: users.id });
      return { userId: user!.id, shopId: shop!.id };
    });
  } catch (error) {
    // Two sign-ups racing for one address: the unique index decides.
    if (
      (error as { cause?: { code?: string } }).cause?.code === '23505' ||
      (error as { code?: string }).code === '23505'
    ) {
      throw new DomainError('conflict', EMAIL_TAKEN, { email: [EMAIL_TAKEN] });
    }
    throw error;
  }
}

const WRONG = 'Wrong e-mail or password.';

/**
 * Checks a password with throttling per account and address (see server/auth/throttle.ts). The
 * same message for an unknown address and a wrong password, and the same time spent, so sign-in
 * does not reveal accounts.
 */
export async function authenticate(
  input: SignInInput,
  address: string,
): Promise<{ userId: string; role: Role }> {
  const keys = { account: input.email, address };
  const wait = await reserveAttempt(keys);
  if (wait > 0) {
    throw new DomainError(
      'rate_limited',
      `Too many failed sign-ins. Try again later (in about ${wait} minute${wait === 1 ? '' : 's'}).`,
    );
  }
  // Many failures on this account from anywhere: answer slowly rather than lock the owner out.
  const delay = accountDelayMs(await accountFailures(input.email));
  if (delay > 0) await new Promise((resolve) => setTimeout(resolve, delay));
  const [user] = await getDb()
    .select({
      id: users.id,
      role: users.role,
      passwordHash: users.passwordHash,
      removedAt: users.removedAt,
    })
    .from(users)
    .where(eq(users.email, input.email));
  const valid = user
    ? await verifyPassword(user.passwordHash, input.password)
    : (await burnPasswordCheck(input.password), false);
  if (!user || !valid || user.removedAt) {
    await recordFailure(keys);
    throw new DomainError('unauthenticated', WRONG);
  }
  await recordSuccess(keys);
  return { userId: user.id, role: user.role };
}
