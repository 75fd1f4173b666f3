import { expect, test } from '@playwright/test';
import { expectNoSideScroll } from './helpers';
import { authFile } from './roles';

test('at 360×640 the sign-in and sign-up pages fit the screen', async ({ page }) => {
  for (const path of ['/sign-in', '/sign-up']) {
    await page.goto(path);
    await expectNoSideScroll(page, path);
  }
});

test.describe('signed in as a lead', () => {
  test.use({ storageState: authFile('lead') });

  test('at 360×640 the pages fit the screen and every control is at least 48 px tall', async ({
    page,
  }) => {
    for (const path of ['/board', '/team']) {
      await page.goto(path);
      await expectNoSideScroll(page, path);
      const small = await page.evaluate(() =>
        [...document.querySelectorAll('button, input, select, nav a')]
          .map((el) => ({
            text: (el as HTMLElement).innerText || el.getAttribute('name') || '',
            h: el.getBoundingClientRect().height,
          }))
          .filter((c) => c.h > 0 && c.h < 48),
      );
      expect(small, `${path} has small touch targets`).toEqual([]);
    }
  });
});
