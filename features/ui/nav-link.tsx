'use client';

import Link from 'next/link';
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
      className={`inline-flex min-h-touch items-center rounded-lg px-3 font-semibold hover:bg-work-dark ${current ? 'underline decoration-4 underline-offset-8' : ''}`}
    >
      {children}
    </Link>
  );
}
