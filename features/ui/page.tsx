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
    <section className="rounded-xl border-2 border-dashed border-paper-line bg-paper-dim p-6 text-center">
      <h2 className="text-lg font-bold">{title}</h2>
      {children ? <div className="mt-2 text-ink-soft">{children}</div> : null}
    </section>
  );
}
