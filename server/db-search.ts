import 'server-only';

/** A LIKE pattern that matches `text` anywhere, with the user's own % and _ taken literally. */
export function containsPattern(text: string): string {
  return `%${text.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
}
