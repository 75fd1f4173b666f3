'use client';

import Link, { useLinkStatus } from 'next/link';
import { usePathname } from 'next/navigation';
import type { ReactNode } from 'react';

/** A main-navigation link that marks the current section (underline + aria-current, not colour alone). */
export function NavLink({ href, children }: { href: string; children: ReactNode }) {
  const pathname = usePathname();
  const current = pathname === href || pathname.startsWith(`${href}/`);
  return (
    <Link
      href={href}
      aria-current={current ? 'page' : undefined}
      className={`min-h-touch hover:bg-work-dark inline-flex items-center rounded-lg px-3 font-semibold ${current ? 'underline decoration-4 underline-offset-8' : ''}`}
    >
      {children}
      <Pending />
    </Link>
  );
}

/**
 * A tapped link shows it is on its way while the next page renders on the server. Pages have no
 * loading.tsx (a loading boundary would stream the shell before a page's guard and lose its 403,
 * 404 or redirect status), so this is the feedback on a slow connection.
 */
function Pending() {
  const { pending } = useLinkStatus();
  return pending ? (
    <span aria-hidden className="ml-1 inline-block size-2 animate-pulse rounded-full bg-current" />
  ) : null;
}
