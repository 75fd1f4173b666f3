'use client';

import Link from 'next/link';
import { RouteErrorBody, type RouteErrorProps } from './route-error-body';

export type { RouteErrorProps } from './route-error-body';

/** The route groups' error page: RouteErrorBody with a link to the start page. */
export function RouteError({ home = '/', ...props }: RouteErrorProps & { home?: string }) {
  return (
    <RouteErrorBody {...props}>
      <Link
        href={home}
        className="min-h-touch text-work inline-flex items-center font-semibold underline"
      >
        Start page
      </Link>
    </RouteErrorBody>
  );
}
