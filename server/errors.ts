import 'server-only';
import { notFound as nextNotFound } from 'next/navigation';

export type DomainErrorCode =
  | 'invalid'
  | 'unauthenticated'
  | 'forbidden'
  // A write from an Origin the app does not know: it says nothing about the request's content
  // (a proxy may have rewritten the header), so the runner's outbox keeps such events and retries.
  | 'cross_origin'
  | 'not_found'
  | 'conflict'
  | 'rate_limited';

/**
 * An expected failure with a message fit to show the user. Actions and route handlers turn it
 * into their own shape; anything else that is thrown is a bug and is logged, not shown.
 */
export class DomainError extends Error {
  constructor(
    readonly code: DomainErrorCode,
    message: string,
    readonly fields?: Record<string, string[]>,
  ) {
    super(message);
    this.name = 'DomainError';
  }
}

export const notFound = (what = 'That record') =>
  new DomainError('not_found', `${what} was not found.`);

/** For pages: a not-found DomainError becomes Next's 404 page; anything else is rethrown. */
export async function orNotFound<T>(promise: Promise<T>): Promise<T> {
  try {
    return await promise;
  } catch (error) {
    if (error instanceof DomainError && error.code === 'not_found') nextNotFound();
    throw error;
  }
}
