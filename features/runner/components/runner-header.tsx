'use client';

import Link from 'next/link';
import { memo, useDeferredValue } from 'react';
import type { BackLink } from '../back-link';

/**
 * The runner's sticky header: the way back, which wheel this is, and what this phone still holds
 * ("Saved", "3 waiting · offline"); when saving stopped, why, with "Sign in again" if the session ended.
 * Memoised on plain values: a save's answer redraws this header and nothing else, and within it
 * only the status (the way back and the title keep their memo).
 */
export const RunnerHeader = memo(function RunnerHeader({
  back,
  title,
  waiting,
  ready,
  online,
  error,
  signedOut,
  signInHref,
}: {
  back: BackLink;
  /** "LF · 30x10R14 · Dune 16". */
  title: string;
  /** The outbox's status (useRunQueue): events still on the phone, whether its queue was read yet. */
  waiting: number;
  ready: boolean;
  online: boolean;
  error: string | null;
  signedOut: boolean;
  signInHref: string;
}) {
  // The count follows a tap in a render of its own, after the frame that draws the next bolt.
  // Only the number waits: "Saved" shows only when neither the live nor the deferred count has
  // anything waiting, so no frame claims a tap is saved while it is not. From Saved, the first
  // tap's frame shows its live count (the header restyles then anyway).
  const deferredWaiting = useDeferredValue(waiting);
  const shownWaiting = deferredWaiting || waiting;
  return (
    <header className="bg-ink sticky top-0 z-10 px-3 py-2 text-white landscape:py-1">
      <div className="flex items-center justify-between gap-2">
        <HeaderTitle back={back} title={title} />
        <p
          role="status"
          aria-live="polite"
          className={`shrink-0 rounded-full px-3 py-1 text-sm font-bold ${!ready ? 'text-ink bg-white' : shownWaiting ? 'bg-caution text-caution-ink' : 'bg-ok text-white'}`}
        >
          {!ready
            ? 'Checking this phone…'
            : shownWaiting
              ? `${shownWaiting} waiting${online ? '' : ' · offline'}`
              : 'Saved'}
        </p>
      </div>
      {error ? (
        <p role="alert" className="bg-danger mt-1 rounded px-2 py-1 text-sm font-bold">
          {error}
          {signedOut ? (
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
});

/** The way back and which wheel this is: the same all through a run, so never redrawn by a tap. */
const HeaderTitle = memo(function HeaderTitle({ back, title }: { back: BackLink; title: string }) {
  return (
    // On its side the phone has little height: one line, so the ring keeps the room.
    <div className="flex min-w-0 flex-col landscape:flex-row landscape:items-center landscape:gap-3">
      <Link
        href={back.href}
        className="min-h-touch inline-flex shrink-0 items-center font-bold underline"
      >
        ← {back.label}
      </Link>
      <p className="font-semibold">{title}</p>
    </div>
  );
});
