/**
 * The short name a person can read for a phone's device id ("Phone 3F9A"): the runner shows it
 * for this phone, the review shows it beside each bolt. Pure, so both features derive the same words.
 * Null when the event came from before phones kept an id.
 */
export function deviceLabel(id: string | null | undefined): string | null {
  const hex = id
    ?.replace(/[^0-9a-f]/gi, '')
    .slice(0, 4)
    .toUpperCase();
  return hex && hex.length === 4 ? `Phone ${hex}` : null;
}
