import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'danger';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-work text-white hover:bg-work-dark disabled:bg-ink-faint',
  secondary: 'border-2 border-ink bg-paper text-ink hover:bg-paper-dim',
  danger: 'bg-danger text-white hover:brightness-90',
};

export function buttonClass(variant: Variant = 'primary', extra = '') {
  return `inline-flex min-h-touch min-w-touch items-center justify-center gap-2 rounded-lg px-5 text-base font-semibold ${VARIANTS[variant]} ${extra}`;
}

export function Button({
  variant = 'primary',
  className = '',
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return <button type="submit" {...props} className={buttonClass(variant, className)} />;
}
