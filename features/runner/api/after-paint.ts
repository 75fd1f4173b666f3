/**
 * Resolves once the browser has painted the frame the current input produced: work started after
 * it (an IndexedDB write, speech) no longer delays what the technician sees. A page that paints
 * nothing (hidden, the phone locked) gets no animation frame, so at most `latestMs` later it
 * resolves anyway: a confirmation is never held back from the phone's storage for long.
 */
export function afterPaint(latestMs = 100): Promise<void> {
  return new Promise((resolve) => {
    let done = false;
    const go = () => {
      if (done) return;
      done = true;
      resolve();
    };
    // A task queued from the frame callback runs after that frame's paint.
    if (typeof requestAnimationFrame === 'function') requestAnimationFrame(() => setTimeout(go, 0));
    setTimeout(go, latestMs);
  });
}
