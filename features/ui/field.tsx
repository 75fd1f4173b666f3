import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes } from 'react';

type Common = { label: string; name: string; errors?: string[]; hint?: ReactNode };

function Describe({ name, errors, hint }: Omit<Common, 'label'>) {
  return (
    <>
      {hint ? (
        <p id={`${name}-hint`} className="text-ink-soft text-sm">
          {hint}
        </p>
      ) : null}
      {errors?.length ? (
        <p id={`${name}-error`} className="text-danger text-sm font-semibold" role="alert">
          {errors.join(' ')}
        </p>
      ) : null}
    </>
  );
}

function describedBy(name: string, errors?: string[], hint?: ReactNode) {
  return (
    [hint ? `${name}-hint` : '', errors?.length ? `${name}-error` : ''].filter(Boolean).join(' ') ||
    undefined
  );
}

const INPUT =
  'min-h-touch w-full rounded-lg border-2 bg-paper px-3 text-base text-ink aria-[invalid=true]:border-danger';

export function TextField({
  label,
  name,
  errors,
  hint,
  ...input
}: Common & InputHTMLAttributes<HTMLInputElement>) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={name} className="font-semibold">
        {label}
      </label>
      <input
        id={name}
        name={name}
        aria-invalid={errors?.length ? true : undefined}
        aria-describedby={describedBy(name, errors, hint)}
        className={`${INPUT} border-ink-soft`}
        {...input}
      />
      <Describe name={name} errors={errors} hint={hint} />
    </div>
  );
}

export function SelectField({
  label,
  name,
  errors,
  hint,
  options,
  ...select
}: Common &
  SelectHTMLAttributes<HTMLSelectElement> & { options: { value: string; label: string }[] }) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={name} className="font-semibold">
        {label}
      </label>
      <select
        id={name}
        name={name}
        aria-invalid={errors?.length ? true : undefined}
        aria-describedby={describedBy(name, errors, hint)}
        className={`${INPUT} border-ink-soft`}
        {...select}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      <Describe name={name} errors={errors} hint={hint} />
    </div>
  );
}
