import 'server-only';
import { inArray, sql } from 'drizzle-orm';
import { getDb } from '@/db';
import { signInThrottle } from '@/db/schema';

// Five wrong passwords in a row lock the account for the rest of a 15-minute window; an address
// gets more room because a shop shares one public address. Counters live in PostgreSQL so that
// every app instance sees them.
export const THROTTLE_WINDOW_MINUTES = 15;
export const ACCOUNT_FAILURE_LIMIT = 5;
export const ADDRESS_FAILURE_LIMIT = 30;

export type ThrottleKeys = { account: string; address: string };

const keysOf = (k: ThrottleKeys) => ({
  account: `account:${k.account.toLowerCase()}`,
  address: `address:${k.address}`,
});

/** Minutes until the caller may try again, or 0 when not throttled. */
export async function retryAfterMinutes(keys: ThrottleKeys): Promise<number> {
  const k = keysOf(keys);
  const rows = await getDb()
    .select({
      key: signInThrottle.key,
      failures: signInThrottle.failures,
      minutesLeft: sql<number>`ceil(extract(epoch from (${signInThrottle.windowStartedAt} + make_interval(mins => ${THROTTLE_WINDOW_MINUTES}) - now())) / 60)`,
    })
    .from(signInThrottle)
    .where(inArray(signInThrottle.key, [k.account, k.address]));
  let wait = 0;
  for (const row of rows) {
    const limit = row.key === k.account ? ACCOUNT_FAILURE_LIMIT : ADDRESS_FAILURE_LIMIT;
    const left = Number(row.minutesLeft);
    if (row.failures >= limit && left > 0) wait = Math.max(wait, left);
  }
  return wait;
}

/** Counts a failure against both keys; a window that has run out starts again at one. */
export async function recordFailure(keys: ThrottleKeys): Promise<void> {
  const k = keysOf(keys);
  const expired = sql`${signInThrottle.windowStartedAt} < now() - make_interval(mins => ${THROTTLE_WINDOW_MINUTES})`;
  await getDb()
    .insert(signInThrottle)
    .values([
      { key: k.account, failures: 1 },
      { key: k.address, failures: 1 },
    ])
    .onConflictDoUpdate({
      target: signInThrottle.key,
      set: {
        failures: sql`case when ${expired} then 1 else ${signInThrottle.failures} + 1 end`,
        windowStartedAt: sql`case when ${expired} then now() else ${signInThrottle.windowStartedAt} end`,
      },
    });
}

/** A successful sign-in ends the account's run of failures (the address keeps its count). */
export async function clearAccountFailures(account: string): Promise<void> {
  await getDb()
    .delete(signInThrottle)
    .where(inArray(signInThrottle.key, [keysOf({ account, address: '' }).account]));
}
