// Pieces the wheel-events integration tests share: a second technician in the shop (not the
// card's assignee) and bolt confirmations made a second apart from an hour ago, so their order
// is their clock's and each lies inside the save path's accepted window.
import { randomUUID } from 'node:crypto';
import { getDb } from '@/db';
import { users } from '@/db/schema';

/** A technician of `shopId` who is on no card; returns the user's id. */
export async function addTechnician(shopId: string): Promise<string> {
  const [row] = await getDb()
    .insert(users)
    .values({
      shopId,
      email: `t2-${randomUUID()}@shop.test`,
      name: 'Tess Two',
      role: 'technician',
      passwordHash: 'x',
    })
    .returning({ id: users.id });
  return row!.id;
}

/** A `confirm(bolt)` for pass 1 whose every event is one second later than the one before. */
export function clockedConfirmations() {
  let t = 0;
  const base = Date.now() - 60 * 60 * 1000;
  return (bolt: number) => ({
    type: 'bolt_confirmed',
    payload: { pass: 1, bolt },
    clientId: randomUUID(),
    clientAt: new Date(base + 1000 * t++).toISOString(),
  });
}
