import 'server-only';
import { and, eq, inArray, sql } from 'drizzle-orm';
import { getDb } from '@/db';
import { signInThrottle } from '@/db/schema';

// Sign-in throttling, counters in PostgreSQL so every app instance sees them:
// - one account from one address: a hard limit (the 6th try in a window is refused);
// - one address across accounts: a higher hard limit (a shop shares one public address);
// - one account across addresses: never locked (that would lock the real owner out from
//   anywhere), only slowed: each answer waits longer as failures pile up, up to a cap.
// Hard limits count the attempt *before* the password is checked, with one upsert that returns
// the new count, and decide on that count: parallel tries cannot all read "4" and all pass.
export const THROTTLE_WINDOW_MINUTES = 15;
export const PAIR_FAILURE_LIMIT = 5;
export const ADDRESS_FAILURE_LIMIT = 30;
/** Failures of one account (any address) before its answers are slowed. */
export const ACCOUNT_FREE_FAILURES = 5;
export const ACCOUNT_DELAY_BASE_MS = 500;
export const ACCOUNT_DELAY_CAP_MS = 8_000;

export type ThrottleKeys = { account: string; address: string };

const keysOf = (k: ThrottleKeys) => {
  const account = k.account.toLowerCase();
  return {
    pair: `pair:${account}|${k.address}`,
    address: `address:${k.address}`,
    account: `account:${account}`,
  };
};

const expired = sql`${signInThrottle.windowStartedAt} < now() - make_interval(mins => ${THROTTLE_WINDOW_MINUTES})`;
const bumpOnConflict = {
  target: signInThrottle.key,
  set: {
    failures: sql`case when ${expired} then 1 else ${signInThrottle.failures} + 1 end`,
    windowStartedAt: sql`case when ${expired} then now() else ${signInThrottle.windowStartedAt} end`,
  },
};

/**
 * Counts this attempt against the account-and-address and the address keys, atomically.
 * Answers the minutes until the caller may try again when a limit is passed, else 0.
 */
export async function reserveAttempt(keys: ThrottleKeys): Promise<number> {
  const k = keysOf(keys);
  const rows = await getDb()
    .insert(signInThrottle)
    .values([
      { key: k.pair, failures: 1 },
      { key: k.address, failures: 1 },
    ])
    .onConflictDoUpdate(bumpOnConflict)
    .returning({
      key: signInThrottle.key,
      failures: signInThrottle.failures,
      minutesLeft: sql<number>`ceil(extract(epoch from (${signInThrottle.windowStartedAt} + make_interval(mins => ${THROTTLE_WINDOW_MINUTES}) - now())) / 60)`,
    });
  let wait = 0;
  for (const row of rows) {
    const limit = row.key === k.pair ? PAIR_FAILURE_LIMIT : ADDRESS_FAILURE_LIMIT;
    if (row.failures > limit) wait = Math.max(wait, Math.max(1, Number(row.minutesLeft)));
  }
  return wait;
}

/** How long to hold this answer back: nothing at first, then doubling per failure, capped. */
export function accountDelayMs(failures: number): number {
  if (failures < ACCOUNT_FREE_FAILURES) return 0;
  return Math.min(
    ACCOUNT_DELAY_CAP_MS,
    ACCOUNT_DELAY_BASE_MS * 2 ** (failures - ACCOUNT_FREE_FAILURES),
  );
}

/** The account's failures in the current window, from any address. */
export async function accountFailures(account: string): Promise<number> {
  const [row] = await getDb()
    .select({ failures: signInThrottle.failures })
    .from(signInThrottle)
    .where(
      and(eq(signInThrottle.key, keysOf({ account, address: '' }).account), sql`not (${expired})`),
    );
  return row?.failures ?? 0;
}

/** A wrong password: the account's run of failures grows (the hard-limit counts already did). */
export async function recordFailure(keys: ThrottleKeys): Promise<void> {
  await getDb()
    .insert(signInThrottle)
    .values({ key: keysOf(keys).account, failures: 1 })
    .onConflictDoUpdate(bumpOnConflict);
}

/**
 * A successful sign-in ends the account's run of failures (here and from elsewhere) and gives
 * the address back the attempt it reserved, so colleagues behind one address are not counted.
 */
export async function recordSuccess(keys: ThrottleKeys): Promise<void> {
  const k = keysOf(keys);
  const db = getDb();
  await db.delete(signInThrottle).where(inArray(signInThrottle.key, [k.pair, k.account]));
  await db
    .update(signInThrottle)
    .set({ failures: sql`greatest(${signInThrottle.failures} - 1, 0)` })
    .where(eq(signInThrottle.key, k.address));
}
