import type { ReactNode } from 'react';

export function PageHeader({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="mb-6 flex flex-wrap items-center justify-between gap-3">
      <h1 className="text-2xl font-bold">{title}</h1>
      {children}
    </div>
  );
}

export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <section className="border-paper-line bg-paper-dim rounded-xl border-2 border-dashed p-6 text-center">
      <h2 className="text-lg font-bold">{title}</h2>
      {children ? <div className="text-ink-soft mt-2">{children}</div> : null}
    </section>
  );
}
