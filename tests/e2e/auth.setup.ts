import { expect, test as setup } from '@playwright/test';
import { mkdirSync, writeFileSync } from 'node:fs';
import { inviteAndJoin, signUp, uniqueEmail } from './helpers';
import { AUTH_DIR, authFile, PEOPLE_FILE, type People } from './roles';

// Runs once before the browser tests: one shop with a person in each role and a second shop's lead,
// made the way a shop makes them (sign-up by e-mailed link, invites accepted), then each signed-in
// browser state is saved for the tests to reuse (roles.ts).
setup(
  'a shop with a lead, a technician and an apprentice, and another shop’s lead',
  async ({ page, browser }) => {
    setup.setTimeout(120_000);
    mkdirSync(AUTH_DIR, { recursive: true });
    const people: People = {
      shop: 'Ridgeline Bead Shop',
      otherShop: 'Far Valley Rims',
      lead: { email: uniqueEmail('shared-lead'), name: 'Lena Ridge' },
      technician: { email: uniqueEmail('shared-tech'), name: 'Theo Tread' },
      apprentice: { email: uniqueEmail('shared-apprentice'), name: 'Ada Prentice' },
      'other-lead': { email: uniqueEmail('other-lead'), name: 'Otto Far' },
    };

    await signUp(page, people.shop, people.lead.name, people.lead.email);
    await page.context().storageState({ path: authFile('lead') });
    for (const role of ['technician', 'apprentice'] as const) {
      const { email, name } = people[role];
      const joined = await inviteAndJoin(
        page,
        browser,
        email,
        name,
        role === 'technician' ? 'Technician' : 'Apprentice',
      );
      await joined.context.storageState({ path: authFile(role) });
      await joined.context.close();
    }

    const other = await browser.newContext();
    const otherPage = await other.newPage();
    await signUp(
      otherPage,
      people.otherShop,
      people['other-lead'].name,
      people['other-lead'].email,
    );
    await expect(otherPage.getByText('No job cards yet')).toBeVisible();
    await other.storageState({ path: authFile('other-lead') });
    await other.close();

    writeFileSync(PEOPLE_FILE, JSON.stringify(people, null, 2));
  },
);
