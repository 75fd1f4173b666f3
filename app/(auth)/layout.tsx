import type { ReactNode } from 'react';

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <main className="mx-auto flex min-h-dvh w-full max-w-md flex-col justify-center gap-6 p-4">
      <p className="text-work text-3xl font-black tracking-tight">Ringpass</p>
      {children}
    </main>
  );
}
