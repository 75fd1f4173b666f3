import 'server-only';
import { eq } from 'drizzle-orm';
import { cache } from 'react';
import { getDb } from '@/db';
import { shops } from '@/db/schema';

export const getShopName = cache(async (shopId: string): Promise<string> => {
  const [row] = await getDb().select({ name: shops.name }).from(shops).where(eq(shops.id, shopId));
  return row?.name ?? 'Your shop';
});
