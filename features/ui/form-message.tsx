/** The form-level outcome of an action, announced to screen readers. */
export function FormMessage({ state }: { state: { ok: boolean; message?: string } | null }) {
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
