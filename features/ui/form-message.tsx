'use client';

import { useFormStatus } from 'react-dom';
import { useResultToast } from './toasts';

/**
 * The form-level outcome of an action, announced to screen readers, and echoed as a toast where
 * the page has a ToastRegion. `pending` is needed only outside a <form> (inside, the form's own
 * status is read).
 */
export function FormMessage({
  state,
  pending,
}: {
  state: { ok: boolean; message?: string } | null;
  pending?: boolean;
}) {
  const form = useFormStatus();
  useResultToast(state, pending ?? form.pending);
  if (!state?.message) return null;
  return (
    <p
      role={state.ok ? 'status' : 'alert'}
      className={`rounded-lg border-2 p-3 font-semibold ${
        state.ok ? 'border-ok bg-ok-tint text-ok' : 'border-danger bg-danger-tint text-danger'
      }`}
    >
      {state.message}
    </p>
  );
}
