import { expect, type Locator, type Page } from '@playwright/test';
import { DOUBLE_TAP_MS } from '../../features/runner/double-tap';

/** Starts every bolt by hand in the order the runner suggests, then finishes the step. */
export async function startAllBolts(page: Page) {
  const next = page.getByRole('button', { name: /^Bolt \d+ started by hand$/ });
  while (await next.count()) await next.click();
  await page.getByRole('button', { name: 'All bolts started — step done' }).click();
}

/**
 * The runner drops a confirmation that comes within DOUBLE_TAP_MS of the last one (a gloved thumb
 * bouncing). It judges by the tap event's own time stamp, which Playwright's page clock does not
 * move, so a test taps at human speed in real time: never two confirmations closer than the guard
 * window (plus a margin), counted from when the last tap had been delivered.
 */
const bounce = DOUBLE_TAP_MS + 50;
const lastTapAt = new WeakMap<Page, number>();

/** Taps a confirmation (a bolt, "Turned", "Didn't turn"), spaced past the double-tap guard. */
export async function tapConfirmation(page: Page, button: Locator) {
  const since = Date.now() - (lastTapAt.get(page) ?? 0);
  // Deliberate human-speed spacing, the one fixed wait: the guard is a real-time rule.
  if (since < bounce) await page.waitForTimeout(bounce - since);
  await button.click();
  lastTapAt.set(page, Date.now());
}

/**
 * Works the torque passes as a technician would: "Wrench set" on each setting card, one
 * confirmation per bolt (spaced past the double-tap guard), "Didn't turn" on a check pass. Stops
 * after `bolts` confirmations, or when no pass is left.
 */
export async function confirmBolts(page: Page, bolts = Infinity) {
  const set = page.getByRole('button', { name: 'Wrench set' });
  const confirm = page.getByRole('button', {
    name: /^(Clicked|Reached) — bolt \d+$|^Didn't turn$/,
  });
  let n = 0;
  while (n < bolts) {
    await expect(
      set
        .or(confirm)
        .or(page.getByRole('button', { name: 'Torque passes done' }))
        .first(),
    ).toBeVisible();
    if (await set.count()) {
      await set.click();
      continue;
    }
    if (!(await confirm.count())) break;
    await tapConfirmation(page, confirm.first());
    n++;
  }
}
