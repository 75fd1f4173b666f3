/**
 * How far a phone's clock may stray from the server's before its times are pulled in: a day back
 * (a phone that queued work offline overnight) and five minutes ahead (clock drift). A phone whose
 * clock says 9999 then cannot reorder a wheel's history.
 */
export const CLOCK_WINDOW = { backMs: 24 * 60 * 60 * 1000, aheadMs: 5 * 60 * 1000 } as const;

/** The time to store for an event, and the phone's own time when it had to be clamped (else null). */
export function clampClientAt(
  clientAt: string,
  now: Date,
): { clientAt: string; deviceAt: string | null } {
  const t = Date.parse(clientAt);
  const low = now.getTime() - CLOCK_WINDOW.backMs;
  const high = now.getTime() + CLOCK_WINDOW.aheadMs;
  if (t >= low && t <= high) return { clientAt: new Date(t).toISOString(), deviceAt: null };
  return {
    clientAt: new Date(Math.min(high, Math.max(low, t))).toISOString(),
    deviceAt: new Date(t).toISOString(),
  };
}
