import { beforeAll, describe, expect, it } from 'vitest';
import { getDb } from '@/db';
import { practiceAttempts } from '@/db/schema';
import { getProgress } from '@/features/practice/server/progress';
import { createTestShop } from '@/tests/helpers/factories';

type Shop = Awaited<ReturnType<typeof createTestShop>>;
let a: Shop, b: Shop;
const ids: Record<string, string> = {};

// Minimal attempt rows: the progress page reads only the listed columns and the ring's name.
async function attempt(shop: Shop, userId: string, score: number | null, ring: string) {
  const [row] = await getDb()
    .insert(practiceAttempts)
    .values({
      shopId: shop.shopId,
      userId,
      level: 'from_memory',
      source: 'surprise',
      setup: { snapshot: { spec: { name: ring } } },
      finishedAt: score === null ? null : new Date(),
      score,
    })
    .returning({ id: practiceAttempts.id });
  return row!.id;
}

beforeAll(async () => {
  a = await createTestShop('Progress A');
  b = await createTestShop('Progress B');
  ids.apprentice = await attempt(a, a.apprentice.userId, 72, 'Ring of 24');
  ids.technician = await attempt(a, a.technician.userId, 90, 'Ring of 16');
  ids.otherShop = await attempt(b, b.apprentice.userId, 55, 'Ring of 32');
});

describe('practice progress: who sees whose attempts', () => {
  it('an apprentice and a technician see only their own', async () => {
    const own = await getProgress(a.apprentice);
    expect(own.scope).toBe('own');
    expect(own.attempts.map((x) => x.id)).toEqual([ids.apprentice]);
    expect(own.attempts[0]).toMatchObject({ ringName: 'Ring of 24', score: 72 });
    expect(own.apprentices.map((x) => x.userId)).toEqual([a.apprentice.userId]);
    const tech = await getProgress(a.technician);
    expect(tech.attempts.map((x) => x.id)).toEqual([ids.technician]);
    expect(tech.apprentices).toEqual([]);
  });

  it("a lead sees the shop's attempts and apprentices, never another shop's", async () => {
    const shop = await getProgress(a.lead);
    expect(shop.scope).toBe('shop');
    expect(shop.attempts.map((x) => x.id).sort()).toEqual([ids.apprentice, ids.technician].sort());
    expect(shop.apprentices.map((x) => x.userId)).toEqual([a.apprentice.userId]);
    const other = await getProgress(b.lead);
    expect(other.attempts.map((x) => x.id)).toEqual([ids.otherShop]);
    expect(other.apprentices.map((x) => x.userId)).toEqual([b.apprentice.userId]);
  });
});
