'use client';

import { buttonClass } from './button';

/** Opens the browser's print dialog; the page's print stylesheet decides what goes on paper. */
export function PrintButton({ children }: { children: string }) {
  return (
    <button
      type="button"
      className={buttonClass('secondary', 'print:hidden')}
      onClick={() => window.print()}
    >
      {children}
    </button>
  );
}
