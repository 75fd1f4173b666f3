/**
 * Resolves once the browser has painted the frame the current input produced: work started after
 * it (an IndexedDB write, speech) no longer delays what the technician sees. A page that paints
 * nothing gets no animation frame, so at most `latestMs` later it resolves anyway. A page that is
 * hidden, or being hidden or closed (the phone locked, the app switched, the tab killed), resolves at
 * once: there is no frame to wait for, timers may be frozen, and a confirmation already on screen
 * must reach the phone's storage before the page can go.
 */
export function afterPaint(latestMs = 100): Promise<void> {
  return new Promise((resolve) => {
    if (typeof document === 'undefined' || document.visibilityState !== 'visible') {
      resolve();
      return;
    }
    let done = false;
    const go = () => {
      if (done) return;
      done = true;
      window.removeEventListener('pagehide', go);
      document.removeEventListener('visibilitychange', go);
      resolve();
    };
    // Resolving inside these events' own task starts the write before the page is frozen or gone.
    window.addEventListener('pagehide', go);
    document.addEventListener('visibilitychange', go);
    // A task queued from the frame callback runs after that frame's paint.
    if (typeof requestAnimationFrame === 'function') requestAnimationFrame(() => setTimeout(go, 0));
    setTimeout(go, latestMs);
  });
}
