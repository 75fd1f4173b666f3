'use client';

import { useActionState } from 'react';
import { useNotify } from './toasts';

type Result = {
  ok: boolean;
  message?: string;
  fieldErrors?: Record<string, string[] | undefined>;
  values?: Record<string, string>;
};

// A server action that ends in redirect() rejects on the client with Next's redirect error, whose
// digest starts so (the same digest the integration tests read).
function isRedirect(error: unknown) {
  return (
    typeof error === 'object' &&
    error !== null &&
    'digest' in error &&
    String(error.digest).startsWith('NEXT_REDIRECT')
  );
}

/**
 * useActionState plus the two things every form reads back: field errors and echoed values.
 * `leaves`: the success message for a form that is gone once it succeeds (the action redirects,
 * or the row holding the form disappears), toasted when the server answers; other forms' results
 * are toasted by their FormMessage.
 */
export function useFormAction<R extends Result, P = FormData>(
  action: (prev: unknown, payload: P) => Promise<R>,
  { leaves }: { leaves?: string } = {},
) {
  const notify = useNotify();
  const [state, formAction, pending] = useActionState(async (prev: unknown, payload: P) => {
    try {
      const result = await action(prev, payload);
      if (result.ok && leaves) notify(true, leaves);
      return result;
    } catch (error) {
      if (leaves && isRedirect(error)) notify(true, leaves);
      throw error;
    }
  }, null);
  const failed = state && !state.ok ? state : undefined;
  return {
    state,
    formAction,
    pending,
    errors: (name: string) => failed?.fieldErrors?.[name],
    value: (name: string) => failed?.values?.[name],
  };
}
