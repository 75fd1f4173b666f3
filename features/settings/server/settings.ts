import 'server-only';
import { eq } from 'drizzle-orm';
import { getDb } from '@/db';
import { shopSettings } from '@/db/schema';
import type { Member } from '@/server/auth/session';
import { notFound } from '@/server/errors';
import { toShopSettings, type ShopSettings } from '@/server/shop/settings';
import type { SettingsPatch } from '../schemas';

/** The PATCH shape onto the row's columns: only what was sent. */
function columnsOf(patch: SettingsPatch) {
  const v = patch.verification;
  return {
    timeZone: patch.timeZone,
    wrenchFloorPercent: patch.wrenchFloorPercent,
    verificationRecency: v?.recency,
    verificationDays: v?.days,
    verificationNearPercent: v?.nearPercent,
    tooFastSecondsPerBolt: patch.tooFastSecondsPerBolt,
    recheckDays: patch.recheckDays,
    pressureUnit: patch.pressureUnit,
    torqueUnit: patch.torqueUnit,
    singleLeadSelfSignoff: patch.singleLeadSelfSignoff,
  };
}

/**
 * Changes the member's own shop's settings (any subset) and records who changed them and when.
 * Reads go through `getShopSettings` (server/shop/settings.ts); this returns the same DTO.
 */
export async function updateShopSettings(
  actor: Member,
  patch: SettingsPatch,
): Promise<ShopSettings> {
  const changes = Object.fromEntries(
    Object.entries(columnsOf(patch)).filter(([, value]) => value !== undefined),
  );
  const [row] = await getDb()
    .update(shopSettings)
    .set({ ...changes, updatedAt: new Date(), updatedById: actor.userId })
    .where(eq(shopSettings.shopId, actor.shopId))
    .returning();
  if (!row) throw notFound('Shop settings');
  return toShopSettings(row);
}
