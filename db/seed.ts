/**
 * The demo shop: a fictional off-road tire shop with invented people. Idempotent: a second run
 * finds the shop and changes nothing.
 */
import { eq } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/postgres-js';
import postgres from 'postgres';
import { hashPassword } from '@/server/auth/password';
import * as schema from './schema';
import { seedDemoRecords } from './seed-demo-records';

export const DEMO_PASSWORD = 'dustline-demo-2026';
export const DEMO_SHOP = 'Dustline Off-Road Tire Co.';
export const DEMO_PEOPLE = [
  { name: 'Mara Quillfeather', email: 'lead@dustline.test', role: 'lead' },
  { name: 'Tobiah Renwick', email: 'tech@dustline.test', role: 'technician' },
  { name: 'Ines Pohlmann', email: 'apprentice@dustline.test', role: 'apprentice' },
] as const;

/** `photoDir`: the local upload fake's folder, where the demo's bead photos are written. */
export async function seedDemoShop(
  url: string,
  options: { photoDir?: string } = {},
): Promise<{ created: boolean }> {
  const sql = postgres(url, { max: 1, onnotice: () => {} });
  const db = drizzle(sql, { schema, casing: 'snake_case' });
  try {
    const [lead] = await db
      .select({ id: schema.users.id })
      .from(schema.users)
      .where(eq(schema.users.email, DEMO_PEOPLE[0].email));
    if (lead) return { created: false };
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    await db.transaction(async (tx) => {
      const [shop] = await tx
        .insert(schema.shops)
        .values({ name: DEMO_SHOP })
        .returning({ id: schema.shops.id });
      const people = await tx
        .insert(schema.users)
        .values(DEMO_PEOPLE.map((p) => ({ ...p, shopId: shop!.id, passwordHash })))
        .returning({ id: schema.users.id, role: schema.users.role });
      const id = (role: string) => people.find((p) => p.role === role)!.id;
      await seedDemoRecords(tx, shop!.id, { lead: id('lead'), tech: id('technician') }, options);
    });
    return { created: true };
  } finally {
    await sql.end({ timeout: 5 });
  }
}
