'use client';

import { NavLink } from '@/features/ui/nav-link';
import { useSignoffCount } from '../api/get-signoff-queue';

/** "Sign-off" in the main nav with the number of job cards waiting, kept live by polling. */
export function SignoffNavLink() {
  const { data } = useSignoffCount();
  const count = data?.count;
  return (
    <NavLink href="/signoff">
      Sign-off
      {count ? (
        <>
          <span
            className="text-work ml-1.5 inline-flex min-w-6 items-center justify-center rounded-full bg-white px-1.5 text-sm font-black"
            aria-hidden
          >
            {count}
          </span>
          <span className="sr-only"> ({count} waiting)</span>
        </>
      ) : null}
    </NavLink>
  );
}
