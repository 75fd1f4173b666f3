import type { ActionResult, FailureCode } from '@/server/action';
import type { ClientEvent, EventRefusal } from '../events';

/** Stores a batch: `postWheelEvents` (./post-events) for a real wheel, practice's `postPracticeEvents` for an attempt. */
export type SaveEvents = (
  prev: unknown,
  input: { wheelId: string; events: ClientEvent[] },
) => Promise<ActionResult<{ saved: number; duplicates: number; refused?: EventRefusal[] }>>;

// Refusals that may pass: a session that ended (sign in again), a rate limit, our own failure.
const KEEP_AND_RETRY = new Set<FailureCode>(['unauthenticated', 'rate_limited', 'internal']);

/** A whole-batch failure that may pass: the events stay on the phone and the send is retried. */
export class KeptForRetry extends Error {
  constructor(
    message: string,
    readonly signedOut: boolean,
  ) {
    super(message);
    this.name = 'KeptForRetry';
  }
}

/** Whether a failed answer means "keep the events and try again" rather than "refused for good". */
export const keepsAndRetries = (code: FailureCode) => KEEP_AND_RETRY.has(code);

/**
 * Waits between sends after a failure: 2 s, 4 s, 8 s … at most 30 s (the server is not hammered).
 * Query passes the failures before this one (0 at the first).
 */
export const retryDelay = (failuresBefore: number) =>
  Math.min(30_000, 1000 * 2 ** (failuresBefore + 1));

/** What the technician reads when the server set some confirmations aside. */
export function refusalMessage(refused: EventRefusal[]): string | null {
  if (refused.length === 0) return null;
  const what =
    refused.length === 1 ? 'One confirmation was' : `${refused.length} confirmations were`;
  return `${what} not saved and set aside: ${refused[0]!.message} Everything else was saved; redo that step if it still needs doing.`;
}
