import type { ReactNode } from 'react';

/** Full screen for the runner: no shop header, the phone's whole height for the work. */
export default function RunnerLayout({ children }: { children: ReactNode }) {
  return children;
}
