import 'server-only';
import { eq } from 'drizzle-orm';
import { cache } from 'react';
import { getDb } from '@/db';
import { shopSettings, type ShopSettingsRow } from '@/db/schema';
import { notFound } from '@/server/errors';

/**
 * A shop's own rules, as every feature reads them. The row is made with the shop (a database
 * trigger); its column defaults are the only place the product's defaults live.
 */
export type ShopSettings = {
  timeZone: string;
  wrenchFloorPercent: number;
  verification: {
    recency: ShopSettingsRow['verificationRecency'];
    /** With `within_days`: a passing verification counts for this many shop days (1 = today only). */
    days: number;
    /** ±% of the setting within which the verification's reference must lie (0 = any point). */
    nearPercent: number;
  };
  tooFastSecondsPerBolt: number;
  recheckDays: number;
  pressureUnit: ShopSettingsRow['pressureUnit'];
  torqueUnit: ShopSettingsRow['torqueUnit'];
  singleLeadSelfSignoff: boolean;
};

export function toShopSettings(row: ShopSettingsRow): ShopSettings {
  return {
    timeZone: row.timeZone,
    wrenchFloorPercent: row.wrenchFloorPercent,
    verification: {
      recency: row.verificationRecency,
      days: row.verificationDays,
      nearPercent: row.verificationNearPercent,
    },
    tooFastSecondsPerBolt: row.tooFastSecondsPerBolt,
    recheckDays: row.recheckDays,
    pressureUnit: row.pressureUnit,
    torqueUnit: row.torqueUnit,
    singleLeadSelfSignoff: row.singleLeadSelfSignoff,
  };
}

/** The shop's settings, read once per request. */
export const getShopSettings = cache(async (shopId: string): Promise<ShopSettings> => {
  const [row] = await getDb().select().from(shopSettings).where(eq(shopSettings.shopId, shopId));
  if (!row) throw notFound('Shop settings');
  return toShopSettings(row);
});
