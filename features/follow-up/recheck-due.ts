import { addDays, fromShopLocal, shopDay } from '@/features/ui/shop-time';

/** The reminder goes out at this time on its due day, on the shop's wall clock. */
export const REMINDER_TIME = '09:00';

/**
 * The shop's calendar day the re-check is due: the day of the sign-off on the shop's calendar
 * (not the server's), plus the shop's re-check days. A late-evening sign-off counts for that
 * evening's date even where UTC has already moved on.
 */
export function recheckDueOn(signedOffAt: Date, timeZone: string, recheckDays: number): string {
  return addDays(shopDay(signedOffAt, timeZone), recheckDays);
}

/**
 * The instant the reminder is sent: REMINDER_TIME on the due day in the shop's zone, through any
 * change of the clocks in between (a day with a spring-forward gap still gets its 09:00).
 */
export function reminderSendsAt(dueOn: string, timeZone: string): Date {
  const at = fromShopLocal(`${dueOn}T${REMINDER_TIME}`, timeZone);
  if (!at) throw new Error(`Not a calendar day: ${dueOn}`);
  return at;
}

/** The key that makes the queue hold one waiting reminder per job card and due day. */
export const reminderKey = (jobId: string, dueOn: string) => `${jobId}:${dueOn}`;
