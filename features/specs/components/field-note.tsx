import type { ReactNode } from 'react';

/**
 * A field's hint with its plausibility warnings. It goes in the field's hint slot, so the input's
 * aria-describedby already points at it; the warnings sit in a live region that is always there,
 * so a screen reader hears them as they appear while typing.
 */
export function FieldNote({ hint, warnings }: { hint?: ReactNode; warnings?: string[] }) {
  return (
    <>
      {hint}
      <span aria-live="polite" className="block">
        {warnings?.map((w) => (
          <span
            key={w}
            className="border-caution bg-caution-tint text-caution-ink mt-1 block rounded border-l-4 p-2 font-semibold"
          >
            Check: {w}
          </span>
        ))}
      </span>
    </>
  );
}
