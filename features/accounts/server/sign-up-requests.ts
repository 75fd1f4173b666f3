import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import { and, eq, gt, isNull, sql } from 'drizzle-orm';
import { getDb } from '@/db';
import { signUpRequests, users } from '@/db/schema';
import { hashPassword } from '@/server/auth/password';
import { env } from '@/server/env.mjs';
import { DomainError } from '@/server/errors';
import { sendMail } from '@/server/mail/mailer';
import { signUpSchema, type SignUpInput } from '../schemas';
import { createShopWithLead } from './accounts';
import { finishSignUpMail, signUpWithExistingAccountMail } from './notice-mail';

/** How long the link that finishes a sign-up works. */
export const SIGN_UP_LINK_HOURS = 24;
export const SIGN_UP_UNUSABLE =
  'This link has expired or was already used. Sign up again to get a new one.';

const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');
const detailsSchema = signUpSchema.omit({ email: true, password: true });
const usable = () => and(isNull(signUpRequests.usedAt), gt(signUpRequests.expiresAt, sql`now()`));

/**
 * The first step of sign-up. Whether or not the address has an account, the answer is the same
 * and costs about the same (the password is hashed either way): a new address gets the link that
 * creates the shop, an address with an account gets a notice telling its owner someone tried.
 */
export async function requestSignUp(input: SignUpInput): Promise<void> {
  const passwordHash = await hashPassword(input.password);
  const db = getDb();
  const [existing] = await db
    .select({ shopId: users.shopId })
    .from(users)
    .where(eq(users.email, input.email));
  const { email } = input;
  const details = detailsSchema.parse(input); // the form without the address and the password
  const token = randomBytes(32).toString('base64url');
  const [request] = existing
    ? []
    : await db
        .insert(signUpRequests)
        .values({
          email,
          tokenHash: hashToken(token),
          details,
          passwordHash,
          expiresAt: new Date(Date.now() + SIGN_UP_LINK_HOURS * 3_600_000),
        })
        .returning({ id: signUpRequests.id });
  try {
    if (existing) {
      const signInUrl = new URL('/sign-in', env().APP_URL).toString();
      await sendMail({
        to: email,
        shopId: existing.shopId,
        ...signUpWithExistingAccountMail({ signInUrl }),
      });
    } else {
      const link = new URL(`/sign-up/${token}`, env().APP_URL).toString();
      await sendMail({
        to: email,
        shopId: null,
        ...finishSignUpMail({ shopName: details.shopName, link, hours: SIGN_UP_LINK_HOURS }),
      });
    }
  } catch (error) {
    console.error('[sign-up] mail failed', error);
    if (request) await db.delete(signUpRequests).where(eq(signUpRequests.id, request.id));
    throw new DomainError(
      'invalid',
      'We could not send the e-mail that finishes sign-up. Try again in a moment.',
    );
  }
}

/** What the confirmation page shows; null when the link cannot be used. */
export async function findUsableSignUp(
  token: string,
): Promise<{ email: string; shopName: string } | null> {
  const [row] = await getDb()
    .select({ email: signUpRequests.email, details: signUpRequests.details })
    .from(signUpRequests)
    .where(and(eq(signUpRequests.tokenHash, hashToken(token)), usable()));
  if (!row) return null;
  const details = detailsSchema.safeParse(row.details);
  return details.success ? { email: row.email, shopName: details.data.shopName } : null;
}

/** Uses the link exactly once (a conditional update wins the race) and creates the shop and its lead. */
export async function confirmSignUp(token: string): Promise<{ userId: string }> {
  const [row] = await getDb()
    .update(signUpRequests)
    .set({ usedAt: new Date() })
    .where(and(eq(signUpRequests.tokenHash, hashToken(token)), usable()))
    .returning({
      email: signUpRequests.email,
      details: signUpRequests.details,
      passwordHash: signUpRequests.passwordHash,
    });
  if (!row) throw new DomainError('invalid', SIGN_UP_UNUSABLE);
  const details = detailsSchema.parse(row.details);
  // Only the address's owner reads this link, so saying it is taken reveals nothing new.
  const { userId } = await createShopWithLead({
    ...details,
    email: row.email,
    passwordHash: row.passwordHash,
  });
  return { userId };
}
