/** A gloved thumb often lands twice: a second tap this soon after a confirmation is a bounce, not a bolt. */
export const DOUBLE_TAP_MS = 400;

/**
 * Whether a tap at `now` counts, given when the last confirmation was taken (ms, same clock).
 * Pure, so the rule is tested without a screen. A clock that went backwards never blocks a tap.
 */
export function tapCounts(
  lastAcceptedAt: number | null,
  now: number,
  windowMs = DOUBLE_TAP_MS,
): boolean {
  if (lastAcceptedAt === null) return true;
  const since = now - lastAcceptedAt;
  return since < 0 || since >= windowMs;
}
