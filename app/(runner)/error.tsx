'use client';

import { lazy, Suspense, type ReactNode } from 'react';
import { RouteErrorBody, type RouteErrorProps } from '@/features/ui/route-error-body';

const TRIES = 3;
const PAUSE_MS = 500;

// Fetched only when an error shows: every runner page carries this boundary in its first load,
// and RouteError brings next/link with it (this group's own copy). React's lazy rather than
// next/dynamic, whose loader would be copied into this boundary's chunk too. The service worker
// keeps the file with the runner's others; a first visit offline may not have it, and React.lazy
// keeps a failed load for good, so the loader tries a few times and then settles on RouteErrorBody
// (RouteError's words without its link home, also shown while it loads).
const load = (tries: number): Promise<{ default: (props: RouteErrorProps) => ReactNode }> =>
  import('@/features/ui/route-error')
    .then((m) => ({ default: m.RouteError }))
    .catch(() =>
      tries > 1
        ? new Promise<void>((done) => setTimeout(done, PAUSE_MS)).then(() => load(tries - 1))
        : { default: RouteErrorBody },
    );
const RouteError = lazy(() => load(TRIES));

export default function GroupError(props: RouteErrorProps) {
  return (
    <Suspense fallback={<RouteErrorBody {...props} />}>
      <RouteError {...props} />
    </Suspense>
  );
}
