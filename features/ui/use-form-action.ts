'use client';

import { useActionState } from 'react';

type Result = {
  ok: boolean;
  message?: string;
  fieldErrors?: Record<string, string[] | undefined>;
  values?: Record<string, string>;
};

/** useActionState plus the two things every form reads back: field errors and echoed values. */
export function useFormAction<R extends Result, P = FormData>(
  action: (prev: unknown, payload: P) => Promise<R>,
) {
  const [state, formAction, pending] = useActionState(action, null);
  const failed = state && !state.ok ? state : undefined;
  return {
    state,
    formAction,
    pending,
    errors: (name: string) => failed?.fieldErrors?.[name],
    value: (name: string) => failed?.values?.[name],
  };
}
