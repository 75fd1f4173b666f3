import type { InputHTMLAttributes } from 'react';

export function CheckboxField({
  label,
  name,
  hint,
  ...input
}: { label: string; name: string; hint?: string } & InputHTMLAttributes<HTMLInputElement>) {
  return (
    <div className="flex items-start gap-3">
      <input
        id={name}
        name={name}
        type="checkbox"
        className="accent-work mt-1 size-7 shrink-0"
        aria-describedby={hint ? `${name}-hint` : undefined}
        {...input}
      />
      <div>
        <label htmlFor={name} className="font-semibold">
          {label}
        </label>
        {hint ? (
          <p id={`${name}-hint`} className="text-ink-soft text-sm">
            {hint}
          </p>
        ) : null}
      </div>
    </div>
  );
}
