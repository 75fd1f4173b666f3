'use client';

/**
 * What shows while a part of the runner that loads on demand arrives: a box of about the part's
 * height, so nothing below it jumps when it lands, and a status line a screen reader announces.
 */
export function StepLoading({ what, height }: { what: string; height: string }) {
  return (
    <div
      role="status"
      aria-live="polite"
      className={`border-paper-line text-ink-soft flex items-center justify-center rounded-xl border-2 border-dashed p-3 ${height}`}
    >
      Loading {what}…
    </div>
  );
}

/**
 * A part that could not load: the phone is offline and has never opened it. Said plainly, with
 * a way to try again; nothing recorded so far is lost (the events wait on the phone).
 */
export function StepNotLoaded({ what }: { what: string }) {
  return (
    <div role="alert" className="border-danger flex flex-col gap-2 rounded-xl border-2 p-3">
      <p className="font-bold">
        This phone could not load {what}: it needs the Wi-Fi once. Everything recorded so far is
        kept on the phone.
      </p>
      <button
        type="button"
        onClick={() => location.reload()}
        className="border-ink min-h-14 rounded-xl border-2 px-4 text-lg font-bold"
      >
        Try again
      </button>
    </div>
  );
}
