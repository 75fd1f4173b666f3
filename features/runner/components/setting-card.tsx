'use client';

import { useEffect, useRef, type ReactNode } from 'react';

/**
 * The wrench setting nobody can miss: full width at the start of a pass and whenever the wrench
 * or its setting changes, acknowledged with "Wrench set" before the first bolt of the pass.
 */
export function SettingCard({
  passName,
  wrench,
  setting,
  warnings,
  onSet,
  children,
}: {
  passName: string;
  wrench: string;
  setting: string;
  warnings: string[];
  onSet: () => void;
  children?: ReactNode;
}) {
  const ref = useRef<HTMLElement>(null);
  // A new pass may start far down the page (the last bolt's button): bring the card into view.
  // A block body: newer browsers return a promise from scrollIntoView, which React would call as a cleanup.
  useEffect(() => {
    ref.current?.scrollIntoView?.({ block: 'start' });
  }, [passName, wrench, setting]);
  return (
    <section
      ref={ref}
      aria-label="Wrench setting"
      className="border-work bg-work-tint flex scroll-mt-32 flex-col gap-3 rounded-2xl border-4 p-4"
    >
      <p className="text-work-dark text-lg font-bold">{passName}</p>
      <p className="text-3xl leading-tight font-black">
        Set {wrench} to {setting}
      </p>
      {warnings.map((w) => (
        <p key={w} className="text-caution-ink font-semibold">
          ⚠ {w}
        </p>
      ))}
      {children}
      <button
        type="button"
        onClick={onSet}
        className="bg-work active:bg-work-dark min-h-24 w-full rounded-2xl px-4 text-2xl font-black text-white"
      >
        Wrench set
      </button>
    </section>
  );
}
