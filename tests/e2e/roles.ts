import type { Browser, BrowserContextOptions } from '@playwright/test';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { ROOT } from '../helpers/test-services';

/**
 * The people the setup project (auth.setup.ts) makes once per run through the product's own
 * sign-up and invites, and their signed-in browser state. A test that only needs "a lead of a shop"
 * uses these instead of signing up; it must not sign them out (that ends the shared session), change
 * the shop's rules or tool crib, or count what the shop holds (other tests add to it in parallel).
 * `other-lead` is the lead of a second shop that nobody writes to: the "another shop's id" checks.
 */
export type SharedRole = 'lead' | 'technician' | 'apprentice' | 'other-lead';
export type Person = { email: string; name: string };
export type People = { shop: string; otherShop: string } & Record<SharedRole, Person>;

export const AUTH_DIR = path.join(ROOT, '.data', 'e2e-auth');
export const PEOPLE_FILE = path.join(AUTH_DIR, 'people.json');

/** The storage state file (cookies, local storage) of a role signed in by the setup project. */
export const authFile = (role: SharedRole) => path.join(AUTH_DIR, `${role}.json`);

let people: People | undefined;
/** Who the setup project made: names and e-mail addresses to sign in with or look for. */
export function sharedPeople(): People {
  people ??= JSON.parse(readFileSync(PEOPLE_FILE, 'utf8')) as People;
  return people;
}

/** A second browser context signed in as `role` (close it when done). */
export async function contextAs(
  browser: Browser,
  role: SharedRole,
  options: BrowserContextOptions = {},
) {
  const context = await browser.newContext({ ...options, storageState: authFile(role) });
  return { context, page: await context.newPage() };
}
