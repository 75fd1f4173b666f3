import { eq } from 'drizzle-orm';
import { beforeEach, describe, expect, it } from 'vitest';
import { postToWheelEvents } from '@/tests/helpers/wheel-events-route';
import { getDb } from '@/db';
import { jobs, practiceClearances, sessions, users, wheelRunEvents } from '@/db/schema';
import { getJob } from '@/features/jobs/server/jobs';
import { sessionIdOf } from '@/server/auth/session-token';
import { createTestShop } from '@/tests/helpers/factories';
import { actAs, cookieValue } from '@/tests/helpers/next-request';
import { createRecords } from '@/tests/helpers/records';
import { addTechnician, clockedConfirmations } from '@/tests/helpers/wheel-events-fixtures';

/**
 * Once a wheel has started, a plain bolt confirmation is saved by one statement that also checks
 * the session (live, not due for renewal, the person not removed, the role or clearance). These
 * cases run on a started wheel, so that statement is the one deciding: whatever it lets through is
 * stored, whatever it refuses must go the ordinary way and come back refused with nothing stored.
 */
type Shop = Awaited<ReturnType<typeof createTestShop>>;
let shop: Shop, wheelId: string, jobId: string;

const confirm = clockedConfirmations();
/** Signs in as `userId` (a fresh session) and returns that session's row id. */
const signIn = async (userId: string) => {
  await actAs(userId);
  return sessionIdOf(cookieValue('ringpass_session')!)!;
};
/** Sends from the session already signed in (no new sign-in). */
const send = (events: unknown[]) =>
  postToWheelEvents(null, { wheelId, events } as Parameters<typeof postToWheelEvents>[1]);
const storedBolts = async () =>
  (
    await getDb()
      .select({ payload: wheelRunEvents.payload })
      .from(wheelRunEvents)
      .where(eq(wheelRunEvents.wheelId, wheelId))
  )
    .map((r) => (r.payload as { bolt: number }).bolt)
    .sort((a, b) => a - b);
const sessionRow = async (id: string) =>
  (
    await getDb()
      .select({ expiresAt: sessions.expiresAt })
      .from(sessions)
      .where(eq(sessions.id, id))
  )[0];
const setSession = (id: string, values: Partial<typeof sessions.$inferInsert>) =>
  getDb().update(sessions).set(values).where(eq(sessions.id, id));
const hoursFromNow = (h: number) => new Date(Date.now() + h * 3_600_000);

beforeEach(async () => {
  shop = await createTestShop();
  const r = await createRecords(shop.lead, shop.technician.userId);
  jobId = r.job.id;
  wheelId = (await getJob(shop.shopId, jobId)).wheels[0]!.id;
  // The first event takes the wheel's snapshot (the full path); later bolts take the quick one.
  await signIn(shop.technician.userId);
  expect(await send([confirm(1)])).toMatchObject({ ok: true, data: { saved: 1 } });
});

describe('the one-statement save checks the session itself', () => {
  it('stores a bolt without writing the session while it is fresh', async () => {
    const id = await signIn(shop.technician.userId);
    const before = await sessionRow(id);
    expect(await send([confirm(2)])).toEqual({
      ok: true,
      data: { saved: 1, duplicates: 0, refused: [] },
    });
    expect((await sessionRow(id))!.expiresAt).toEqual(before!.expiresAt);
    expect(await storedBolts()).toEqual([1, 2]);
  });

  it('a session past half its idle life is renewed by the save, and the bolt is stored', async () => {
    const id = await signIn(shop.technician.userId);
    await setSession(id, { expiresAt: hoursFromNow(1) });
    expect(await send([confirm(2)])).toMatchObject({ ok: true, data: { saved: 1 } });
    // Renewed to the 12 h idle lifetime (server/auth/session.ts).
    expect((await sessionRow(id))!.expiresAt.getTime()).toBeGreaterThan(hoursFromNow(11).getTime());
    expect(await storedBolts()).toEqual([1, 2]);
  });

  it('an idle-expired session, a session past its absolute end and a removed person store nothing', async () => {
    const idle = await signIn(shop.technician.userId);
    await setSession(idle, { expiresAt: hoursFromNow(-1) });
    expect(await send([confirm(2)])).toMatchObject({ ok: false, code: 'unauthenticated' });

    const absolute = await signIn(shop.technician.userId);
    await setSession(absolute, { absoluteExpiresAt: hoursFromNow(-0.01) });
    expect(await send([confirm(3)])).toMatchObject({ ok: false, code: 'unauthenticated' });

    await signIn(shop.technician.userId);
    await getDb()
      .update(users)
      .set({ removedAt: new Date() })
      .where(eq(users.id, shop.technician.userId));
    expect(await send([confirm(4)])).toMatchObject({ ok: false, code: 'unauthenticated' });
    expect(await storedBolts()).toEqual([1]);
  });

  it("another technician, another shop's lead, an apprentice not cleared: nothing stored", async () => {
    const tech2 = await addTechnician(shop.shopId);
    await signIn(tech2);
    expect(await send([confirm(2)])).toMatchObject({
      ok: false,
      code: 'forbidden',
      message: expect.stringMatching(/assigned to someone else/),
    });
    const other = await createTestShop('Other');
    await signIn(other.lead.userId);
    expect(await send([confirm(3)])).toMatchObject({ ok: false, code: 'not_found' });
    // Even as the card's assignee, an apprentice needs a lead's clearance.
    await getDb()
      .update(jobs)
      .set({ assigneeId: shop.apprentice.userId })
      .where(eq(jobs.id, jobId));
    await signIn(shop.apprentice.userId);
    expect(await send([confirm(4)])).toMatchObject({ ok: false, code: 'forbidden' });
    expect(await storedBolts()).toEqual([1]);
  });

  it('a cleared apprentice on their card is stored; after the revoke, nothing more', async () => {
    await getDb()
      .update(jobs)
      .set({ assigneeId: shop.apprentice.userId })
      .where(eq(jobs.id, jobId));
    const [clearance] = await getDb()
      .insert(practiceClearances)
      .values({
        shopId: shop.shopId,
        userId: shop.apprentice.userId,
        clearedById: shop.lead.userId,
      })
      .returning({ id: practiceClearances.id });
    await signIn(shop.apprentice.userId);
    expect(await send([confirm(2)])).toMatchObject({ ok: true, data: { saved: 1 } });
    await getDb()
      .update(practiceClearances)
      .set({ revokedAt: new Date(), revokedById: shop.lead.userId })
      .where(eq(practiceClearances.id, clearance!.id));
    expect(await send([confirm(3)])).toMatchObject({ ok: false, code: 'forbidden' });
    expect(await storedBolts()).toEqual([1, 2]);
  });
});
