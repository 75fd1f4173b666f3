/**
 * The IANA time-zone names a shop may choose: the runtime's own list (`Intl.supportedValuesOf`)
 * plus UTC, which the list leaves out. Pure (Intl only): the settings page, the settings API and
 * sign-up check names the same way.
 */
let names: string[] | undefined;

export function timeZoneNames(): string[] {
  names ??= [...new Set([...Intl.supportedValuesOf('timeZone'), 'UTC'])].sort();
  return names;
}

/**
 * The name to store for a zone, or null when it is not one. A listed name (or UTC) stays as it
 * is; another spelling the time-zone database knows (a browser's newer "Asia/Kolkata" where this
 * runtime lists "Asia/Calcutta") becomes the runtime's own name for the same zone.
 */
export function knownTimeZone(name: unknown): string | null {
  if (typeof name !== 'string' || name.length === 0 || name.length > 64) return null;
  const list = timeZoneNames();
  if (list.includes(name)) return name;
  try {
    const canonical = new Intl.DateTimeFormat('en-US', { timeZone: name }).resolvedOptions()
      .timeZone;
    return list.includes(canonical) ? canonical : null;
  } catch {
    return null;
  }
}
