import { expect, type Page } from '@playwright/test';
import { DOUBLE_TAP_MS } from '../../features/runner/double-tap';

/** Starts every bolt by hand in the order the runner suggests, then finishes the step. */
export async function startAllBolts(page: Page) {
  const next = page.getByRole('button', { name: /^Bolt \d+ started by hand$/ });
  while (await next.count()) await next.click();
  await page.getByRole('button', { name: 'All bolts started — step done' }).click();
}

const bounce = DOUBLE_TAP_MS + 50;

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
    await confirm.first().click();
    n++;
    await page.waitForTimeout(bounce);
  }
}
