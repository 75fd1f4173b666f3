'use client';

import { lazy, Suspense, type ReactNode } from 'react';
import type { RouteErrorProps } from '@/features/ui/route-error';

const TRIES = 3;
const PAUSE_MS = 500;

// Fetched only when an error shows: every runner page carries this boundary in its first load,
// and RouteError brings next/link with it (this group's own copy). React's lazy rather than
// next/dynamic, whose loader would be copied into this boundary's chunk too. The service worker
// keeps the file with the runner's others; a first visit offline may not have it, and React.lazy
// keeps a failed load for good, so the loader tries a few times and then settles on PlainError.
const load = (tries: number): Promise<{ default: (props: RouteErrorProps) => ReactNode }> =>
  import('@/features/ui/route-error')
    .then((m) => ({ default: m.RouteError }))
    .catch(() =>
      tries > 1
        ? new Promise<void>((done) => setTimeout(done, PAUSE_MS)).then(() => load(tries - 1))
        : { default: PlainError },
    );
const RouteError = lazy(() => load(TRIES));

export default function GroupError(props: RouteErrorProps) {
  return (
    <Suspense fallback={<PlainError {...props} />}>
      <RouteError {...props} />
    </Suspense>
  );
}

/** RouteError's words without its link home: shown while it loads, or when it cannot load. */
function PlainError({ error, retry, reset }: RouteErrorProps) {
  const again = retry ?? reset;
  return (
    <section role="alert" className="border-danger bg-danger-tint rounded-xl border-2 p-4">
      <h1 className="text-danger text-xl font-bold">This page could not be shown</h1>
      <p>Something went wrong. Nothing you entered before this page was lost. Try again.</p>
      {error.digest ? (
        <p className="text-sm">
          Reference: <code className="font-mono font-semibold">{error.digest}</code>
        </p>
      ) : null}
      {again ? (
        <button
          type="button"
          onClick={() => again()}
          className="min-h-touch bg-work mt-3 rounded-lg px-5 font-semibold text-white"
        >
          Try again
        </button>
      ) : null}
    </section>
  );
}
