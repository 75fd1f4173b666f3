import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { signUpSchema } from '@/features/accounts/schemas';
import { createShopWithLead } from '@/features/accounts/server/accounts';
import { getShopSettings } from '@/server/shop/settings';

/** Sign-up as the form sends it: the browser's zone in a hidden field. */
async function signUpFrom(timeZone: unknown) {
  const input = signUpSchema.parse({
    shopName: 'Zone Test Tires',
    name: 'Zed Lead',
    email: `zone-${randomUUID().slice(0, 8)}@shop.test`,
    password: 'correct horse battery',
    timeZone,
  });
  const { shopId } = await createShopWithLead(input);
  return (await getShopSettings(shopId)).timeZone;
}

describe("sign-up starts the shop's clock in the browser's time zone", () => {
  it("a zone the browser reports is the new shop's zone", async () => {
    expect(await signUpFrom('America/Denver')).toBe('America/Denver');
    expect(await signUpFrom('Pacific/Auckland')).toBe('Pacific/Auckland');
  });

  it('no zone, or one that is not a zone, leaves the shop on UTC (a lead can change it in Settings)', async () => {
    expect(await signUpFrom(undefined)).toBe('UTC');
    expect(await signUpFrom('')).toBe('UTC');
    expect(await signUpFrom('Mars/Olympus_Mons')).toBe('UTC');
    expect(await signUpFrom('<script>')).toBe('UTC');
  });
});
