'use client';

import { lazy, Suspense } from 'react';
import type { RouteErrorProps } from '@/features/ui/route-error';

// Fetched only when an error shows: every runner page carries this boundary in its first load,
// and RouteError brings next/link with it (this group's own copy). React's lazy rather than
// next/dynamic, whose loader would be copied into this boundary's chunk too. The service worker
// keeps the file with the runner's others, so the error still shows offline.
const RouteError = lazy(() =>
  import('@/features/ui/route-error').then((m) => ({ default: m.RouteError })),
);

export default function GroupError(props: RouteErrorProps) {
  return (
    <Suspense fallback={null}>
      <RouteError {...props} />
    </Suspense>
  );
}
