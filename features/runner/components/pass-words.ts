import type { PassProgress } from '../state';
import type { CribWrench } from '../wrench-gate';

/** What the big button says: a click wrench clicks; a beam, dial or digital wrench is read until it reaches the setting. */
export function confirmWord(kind: CribWrench['kind'] | undefined): 'Clicked' | 'Reached' {
  return kind === 'click' || kind === undefined ? 'Clicked' : 'Reached';
}

/** "Pass 2 of 3" or "Check pass" (then "Check pass 2" for each one a turned bolt added). */
export function passName(pass: PassProgress, passes: readonly PassProgress[]): string {
  if (pass.kind === 'check') {
    const n = passes.filter((p) => p.kind === 'check' && p.index <= pass.index).length;
    return n > 1 ? `Check pass ${n}` : 'Check pass';
  }
  return `Pass ${pass.index} of ${passes.filter((p) => p.kind === 'staged').length}`;
}
