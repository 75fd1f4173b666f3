'use client';

import type { ReactNode } from 'react';

export type RouteErrorProps = {
  error: Error & { digest?: string };
  /** Next 16: re-fetches the segment's server data and renders it again. */
  retry?: () => void;
  /** Clears the boundary only (older Next, or a boundary without retry). */
  reset?: () => void;
};

/**
 * What a page shows when it failed on our side: a plain sentence, a way to try again, and the
 * error's reference (digest) to read to whoever looks at the server's log. Never the message or
 * stack: a server error's text can hold details that are not for the shop floor. Kept apart from
 * RouteError so the runner's boundary can show it without loading next/link (`children` sits
 * beside Try again: RouteError's link home).
 */
export function RouteErrorBody({
  error,
  retry,
  reset,
  children,
}: RouteErrorProps & { children?: ReactNode }) {
  const again = retry ?? reset;
  return (
    <section
      role="alert"
      aria-labelledby="route-error-title"
      className="border-danger bg-danger-tint flex flex-col gap-3 rounded-xl border-2 p-4"
    >
      <h1 id="route-error-title" className="text-danger text-xl font-bold">
        This page could not be shown
      </h1>
      <p>
        Something went wrong on our side. Nothing you entered before this page was lost. Try again;
        if it keeps happening, tell a lead.
      </p>
      {error.digest ? (
        <p className="text-sm">
          Reference for the shop&apos;s support:{' '}
          <code className="font-mono font-semibold">{error.digest}</code>
        </p>
      ) : null}
      <div className="flex flex-wrap gap-3">
        {again ? (
          <button
            type="button"
            onClick={() => again()}
            className="min-h-touch bg-work hover:bg-work-dark inline-flex items-center rounded-lg px-5 font-semibold text-white"
          >
            Try again
          </button>
        ) : null}
        {children}
      </div>
    </section>
  );
}
