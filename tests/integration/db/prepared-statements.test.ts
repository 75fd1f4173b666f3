import { eq, sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { getDb } from '@/db';
import { shops } from '@/db/schema';
import { createTestShop } from '@/tests/helpers/factories';

describe('the app database client', () => {
  it('prepares ordinary drizzle queries (one round trip each), inside transactions too', async () => {
    const shop = await createTestShop('Prepared Tires');
    // A transaction holds one connection, so its prepared statements can be listed.
    const listed = await getDb().transaction(async (tx) => {
      const [row] = await tx
        .select({ name: shops.name })
        .from(shops)
        .where(eq(shops.id, shop.shopId));
      expect(row?.name).toBe('Prepared Tires');
      return tx.execute<{ statement: string }>(sql`select statement from pg_prepared_statements`);
    });
    expect(listed.map((r) => r.statement)).toContainEqual(
      expect.stringMatching(/^select "name" from "shops" where "shops"\."id" = \$1/),
    );
  });
});
