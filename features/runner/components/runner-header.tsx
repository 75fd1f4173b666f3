'use client';

import Link from 'next/link';
import type { useRunQueue } from '../api/use-run-queue';
import type { BackLink } from '../back-link';

type QueueStatus = ReturnType<typeof useRunQueue>['status'];

/**
 * The runner's sticky header: the way back, which wheel this is, and what this phone still holds
 * ("Saved", "3 waiting · offline"); when saving stopped, why, with "Sign in again" if the session ended.
 */
export function RunnerHeader({
  back,
  title,
  status,
  signInHref,
}: {
  back: BackLink;
  /** "LF · 30x10R14 · Dune 16". */
  title: string;
  status: QueueStatus;
  signInHref: string;
}) {
  return (
    <header className="bg-ink sticky top-0 z-10 px-3 py-2 text-white landscape:py-1">
      <div className="flex items-center justify-between gap-2">
        {/* On its side the phone has little height: one line, so the ring keeps the room. */}
        <div className="flex min-w-0 flex-col landscape:flex-row landscape:items-center landscape:gap-3">
          <Link
            href={back.href}
            className="min-h-touch inline-flex shrink-0 items-center font-bold underline"
          >
            ← {back.label}
          </Link>
          <p className="font-semibold">{title}</p>
        </div>
        <p
          role="status"
          aria-live="polite"
          className={`shrink-0 rounded-full px-3 py-1 text-sm font-bold ${!status.ready ? 'text-ink bg-white' : status.waiting ? 'bg-caution text-caution-ink' : 'bg-ok text-white'}`}
        >
          {!status.ready
            ? 'Checking this phone…'
            : status.waiting
              ? `${status.waiting} waiting${status.online ? '' : ' · offline'}`
              : 'Saved'}
        </p>
      </div>
      {status.error ? (
        <p role="alert" className="bg-danger mt-1 rounded px-2 py-1 text-sm font-bold">
          {status.error}
          {status.signedOut ? (
            <>
              {' '}
              <a href={signInHref} className="min-h-touch inline-flex items-center underline">
                Sign in again
              </a>
            </>
          ) : null}
        </p>
      ) : null}
    </header>
  );
}
