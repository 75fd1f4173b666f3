'use client';

import { createContext, useCallback, useContext, useEffect, useRef, type ReactNode } from 'react';
import { toast, Toaster } from 'sonner';

// Only pages inside a ToastRegion toast: the shop's pages do, the runner (at the wheel, gloves on)
// and the sign-in pages do not, so nothing there can start toasting by accident.
const ToastsOn = createContext(false);

const BASE =
  'flex w-full items-start gap-2 rounded-lg border-2 p-3 text-base font-semibold shadow-lg';

export function ToastRegion({ children }: { children: ReactNode }) {
  return (
    <ToastsOn.Provider value={true}>
      {children}
      <Toaster
        position="bottom-center"
        closeButton={false}
        toastOptions={{
          unstyled: true,
          // The shape on every toast, the colours by type only: two colour classes on one
          // element would be settled by stylesheet order, not by which type it is.
          classNames: {
            toast: BASE,
            default: 'border-ink bg-paper text-ink',
            success: 'border-ok bg-ok-tint text-ok',
            error: 'border-danger bg-danger-tint text-danger',
          },
        }}
      />
    </ToastsOn.Provider>
  );
}

/** Shows one toast (a no-op outside a ToastRegion). Same text twice in view: one toast, refreshed. */
export function useNotify() {
  const on = useContext(ToastsOn);
  return useCallback(
    (ok: boolean, message: string) => {
      if (!on) return;
      // The inline message is the one announced to screen readers; the toast is its visual echo.
      const body = <span aria-hidden="true">{message}</span>;
      if (ok) toast.success(body, { id: message });
      else toast.error(body, { id: message, duration: 8000 });
    },
    [on],
  );
}

/**
 * Echoes a finished action's message as a toast, once per submission (a second identical save
 * toasts again; a re-render or remount with the same message does not stack a second toast).
 */
export function useResultToast(state: { ok: boolean; message?: string } | null, pending: boolean) {
  const notify = useNotify();
  const shown = useRef<string | null>(null);
  const message = state?.message;
  const ok = state?.ok;
  useEffect(() => {
    if (pending) shown.current = null;
    if (pending || !message || shown.current === message) return;
    shown.current = message;
    notify(Boolean(ok), message);
  }, [notify, pending, message, ok]);
}
