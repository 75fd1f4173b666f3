import type { ReactNode } from 'react';
import { ForgetRunnerPages } from '@/features/runner/components/forget-runner-pages';

// Every way into an account (sign in, sign up, accept an invite) starts a new person's session on
// this phone: the runner pages kept for offline use by the one before are deleted first.
export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <main className="mx-auto flex min-h-dvh w-full max-w-md flex-col justify-center gap-6 p-4">
      <ForgetRunnerPages />
      <p className="text-work text-3xl font-black tracking-tight">Ringpass</p>
      {children}
    </main>
  );
}
