import { randomUUID } from 'node:crypto';
import { count, eq, sql } from 'drizzle-orm';
import type { PgTable } from 'drizzle-orm/pg-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { GET as getOne } from '@/app/api/practice/attempts/[attemptId]/route';
import { POST as saveEvents } from '@/app/api/practice/attempts/[attemptId]/events/route';
import { POST as finish } from '@/app/api/practice/attempts/[attemptId]/finish/route';
import { GET as list, POST as start } from '@/app/api/practice/attempts/route';
import { getDb } from '@/db';
import {
  jobEvents,
  jobs,
  jobWheels,
  practiceEvents,
  refusedRunEvents,
  wheelPhotos,
  wheelRunEvents,
  wrenches,
  wrenchStatusEvents,
  wrenchVerifications,
} from '@/db/schema';
import type { PracticeSetup } from '@/features/practice/types';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { createRecords } from '@/tests/helpers/records';

type Shop = Awaited<ReturnType<typeof createTestShop>>;
let a: Shop, b: Shop, specId: string;
const cookies: Record<string, string> = {};

beforeAll(async () => {
  a = await createTestShop('Practice A');
  b = await createTestShop('Practice B');
  specId = (await createRecords(a.lead, a.technician.userId)).spec.id;
  for (const [key, m] of Object.entries({
    lead: a.lead,
    tech: a.technician,
    apprentice: a.apprentice,
    otherLead: b.lead,
  }))
    cookies[key] = await cookieFor(m.userId);
});

// The API's JSON read as the browser would, field by field; the assertions say what each must be.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Body = { data?: any; error?: { code: string; message: string } };
const json = async (res: Response) => ({ status: res.status, body: (await res.json()) as Body });
const startAs = async (who: string | null, body: unknown) =>
  json(
    await start(
      apiRequest('/api/practice/attempts', {
        method: 'POST',
        cookie: who ? cookies[who] : undefined,
        body,
      }),
      params({}),
    ),
  );
const getAs = async (who: string | null, id: string) =>
  json(
    await getOne(
      apiRequest(`/api/practice/attempts/${id}`, { cookie: who ? cookies[who] : undefined }),
      params({ attemptId: id }),
    ),
  );
const listAs = async (who: string, query = '') =>
  json(
    await list(apiRequest(`/api/practice/attempts${query}`, { cookie: cookies[who] }), params({})),
  );
const postEvents = async (who: string | null, id: string, events: unknown[]) =>
  json(
    await saveEvents(
      apiRequest(`/api/practice/attempts/${id}/events`, {
        method: 'POST',
        cookie: who ? cookies[who] : undefined,
        body: { events },
      }),
      params({ attemptId: id }),
    ),
  );
const finishAs = async (who: string, id: string) =>
  json(
    await finish(
      apiRequest(`/api/practice/attempts/${id}/finish`, { method: 'POST', cookie: cookies[who] }),
      params({ attemptId: id }),
    ),
  );

let t = 0;
const base = Date.now() - 60 * 60 * 1000;
const event = (type: string, payload: unknown) => ({
  type,
  payload,
  clientId: randomUUID(),
  clientAt: new Date(base + 1000 * t++).toISOString(),
});

describe('practice attempts: start, read, save once, finish', () => {
  it('starts an attempt from a shop spec and from "surprise me", with the shop’s floor', async () => {
    const fromSpec = await startAs('apprentice', { source: 'spec', specId, level: 'guided' });
    expect(fromSpec.status).toBe(201);
    const setup = fromSpec.body.data.setup as PracticeSetup;
    expect(setup.level).toBe('guided');
    expect(setup.snapshot.spec.id).toBe(specId);
    // The demo shop's default floor: 20 % of a wrench's maximum (shop_settings default).
    expect(setup.minFractionOfMax).toBeCloseTo(0.2);
    const surprise = await startAs('apprentice', { source: 'surprise', level: 'from_memory' });
    expect(surprise.status).toBe(201);
    expect(surprise.body.data.setup.source).toBe('surprise');
  });

  it('refuses another shop’s spec (404), a bad level (400) and a signed-out caller (401)', async () => {
    expect((await startAs('otherLead', { source: 'spec', specId, level: 'guided' })).status).toBe(
      404,
    );
    expect((await startAs('apprentice', { source: 'surprise', level: 'expert' })).status).toBe(400);
    expect((await startAs(null, { source: 'surprise', level: 'guided' })).status).toBe(401);
  });

  it('stores the same events once, however often they are sent', async () => {
    const { body } = await startAs('apprentice', { source: 'surprise', level: 'guided' });
    const id = body.data.id as string;
    const batch = [
      event('step_done', { step: 'safety', checklist: [] }),
      event('bolt_confirmed', { pass: 1, bolt: 1 }),
    ];
    expect((await postEvents('apprentice', id, batch)).body.data).toEqual({
      saved: 2,
      duplicates: 0,
      refused: [],
    });
    expect((await postEvents('apprentice', id, batch)).body.data).toEqual({
      saved: 0,
      duplicates: 2,
      refused: [],
    });
    const [row] = await getDb()
      .select({ n: count() })
      .from(practiceEvents)
      .where(eq(practiceEvents.attemptId, id));
    expect(row!.n).toBe(2);
    // The stored bolt carries its pass's target, as on a real wheel.
    const got = await getAs('apprentice', id);
    const bolt = (got.body.data.events as { type: string; payload: { target?: unknown } }[]).find(
      (e) => e.type === 'bolt_confirmed',
    );
    expect(bolt?.payload.target).toEqual(got.body.data.setup.snapshot.plan.passes[0].target);
  });

  it('refuses only the event naming a bolt the ring does not have; the rest are stored', async () => {
    const { body } = await startAs('apprentice', { source: 'surprise', level: 'guided' });
    const boltCount = (body.data.setup as PracticeSetup).snapshot.spec.boltCount;
    const good = event('hand_started', { bolt: 1 });
    const bad = event('hand_started', { bolt: boltCount + 1 });
    const res = await postEvents('apprentice', body.data.id, [bad, good]);
    expect(res.body.data.saved).toBe(1);
    expect(res.body.data.refused).toHaveLength(1);
    expect(res.body.data.refused[0]).toMatchObject({ index: 0, clientId: bad.clientId });
    expect(res.body.data.refused[0].message).toContain(`${boltCount}-bolt ring`);
  });

  it('a phone clock days behind is pulled into the server’s window; the phone’s own time is kept', async () => {
    const { body } = await startAs('apprentice', { source: 'surprise', level: 'guided' });
    const phoneAt = new Date(Date.now() - 3 * 86_400_000).toISOString();
    const e = { ...event('hand_started', { bolt: 1 }), clientAt: phoneAt };
    const before = Date.now();
    expect((await postEvents('apprentice', body.data.id, [e])).body.data.saved).toBe(1);
    const [row] = await getDb()
      .select({ clientAt: practiceEvents.clientAt, deviceAt: practiceEvents.deviceAt })
      .from(practiceEvents)
      .where(eq(practiceEvents.clientId, e.clientId));
    // At most a day behind the server (CLOCK_WINDOW, as on a real wheel).
    expect(row!.clientAt.getTime()).toBeGreaterThanOrEqual(before - 86_400_000);
    expect(row!.deviceAt?.toISOString()).toBe(phoneAt);
  });

  it('an event id used by another attempt is refused there, never moved', async () => {
    const one = (await startAs('apprentice', { source: 'surprise', level: 'guided' })).body.data;
    const two = (await startAs('apprentice', { source: 'surprise', level: 'guided' })).body.data;
    const e = event('hand_started', { bolt: 2 });
    expect((await postEvents('apprentice', one.id, [e])).body.data.saved).toBe(1);
    const again = await postEvents('apprentice', two.id, [e]);
    expect(again.body.data).toMatchObject({ saved: 0, duplicates: 0 });
    expect(again.body.data.refused).toHaveLength(1);
  });

  it('finish scores once: a second finish returns the same result, later events are refused', async () => {
    const { body } = await startAs('apprentice', { source: 'surprise', level: 'guided' });
    const id = body.data.id as string;
    await postEvents('apprentice', id, [event('step_done', { step: 'safety', checklist: [] })]);
    const first = await finishAs('apprentice', id);
    expect(first.status).toBe(200);
    expect(first.body.data.score).toBeGreaterThanOrEqual(0);
    expect(first.body.data.score).toBeLessThanOrEqual(100);
    const second = await finishAs('apprentice', id);
    expect(second.body.data).toEqual(first.body.data);
    const late = await postEvents('apprentice', id, [event('hand_started', { bolt: 1 })]);
    expect(late.body.data.saved).toBe(0);
    expect(late.body.data.refused[0].message).toContain('finished');
    const got = await getAs('apprentice', id);
    expect(got.body.data.score).toBe(first.body.data.score);
    expect(got.body.data.finishedAt).not.toBeNull();
  });
});

describe('practice attempts: who sees and writes what', () => {
  let apprenticeAttempt: string, techAttempt: string;
  beforeAll(async () => {
    apprenticeAttempt = (await startAs('apprentice', { source: 'surprise', level: 'guided' })).body
      .data.id;
    techAttempt = (await startAs('tech', { source: 'surprise', level: 'wrench_setup' })).body.data
      .id;
  });

  it('an apprentice sees their own attempts only; someone else’s is not found', async () => {
    expect((await getAs('apprentice', apprenticeAttempt)).status).toBe(200);
    expect((await getAs('apprentice', techAttempt)).status).toBe(404);
    const mine = await listAs('apprentice');
    const people = new Set((mine.body.data as { userId: string }[]).map((x) => x.userId));
    expect([...people]).toEqual([a.apprentice.userId]);
    expect((await listAs('apprentice', `?userId=${a.technician.userId}`)).status).toBe(403);
  });

  it('a lead sees the shop’s attempts, by person too', async () => {
    expect((await getAs('lead', techAttempt)).status).toBe(200);
    const all = await listAs('lead');
    const ids = (all.body.data as { id: string }[]).map((x) => x.id);
    expect(ids).toEqual(expect.arrayContaining([apprenticeAttempt, techAttempt]));
    const one = await listAs('lead', `?userId=${a.apprentice.userId}`);
    expect(
      (one.body.data as { userId: string }[]).every((x) => x.userId === a.apprentice.userId),
    ).toBe(true);
  });

  it('another shop gets 404, and nothing in its lists; signed out gets 401', async () => {
    expect((await getAs('otherLead', apprenticeAttempt)).status).toBe(404);
    expect((await listAs('otherLead')).body.data).toEqual([]);
    expect((await getAs(null, apprenticeAttempt)).status).toBe(401);
  });

  it('every role saves to its own attempt; signed out gets 401 and nothing is stored', async () => {
    for (const who of ['lead', 'tech', 'apprentice']) {
      const { body } = await startAs(who, { source: 'surprise', level: 'guided' });
      const e = event('hand_started', { bolt: 1 });
      expect((await postEvents(who, body.data.id, [e])).body.data, who).toMatchObject({ saved: 1 });
    }
    const signedOut = await postEvents(null, apprenticeAttempt, [
      event('hand_started', { bolt: 2 }),
    ]);
    expect(signedOut).toMatchObject({ status: 401, body: { error: { code: 'unauthenticated' } } });
    expect((await getAs('apprentice', apprenticeAttempt)).body.data.events).not.toContainEqual(
      expect.objectContaining({ payload: expect.objectContaining({ bolt: 2 }) }),
    );
  });

  it('only the attempt’s own person writes to it or finishes it (a lead included)', async () => {
    const e = event('hand_started', { bolt: 1 });
    expect((await postEvents('lead', apprenticeAttempt, [e])).status).toBe(404);
    expect((await postEvents('otherLead', apprenticeAttempt, [e])).status).toBe(404);
    expect((await finishAs('lead', apprenticeAttempt)).status).toBe(404);
  });
});

describe('practice writes nothing outside its own tables', () => {
  const countRows = async () => {
    const db = getDb();
    const n = async (table: PgTable) => (await db.select({ n: count() }).from(table))[0]!.n;
    const [cycles] = await db
      .select({ n: sql<number>`coalesce(sum(${wrenches.cyclesSinceCalibration}), 0)::int` })
      .from(wrenches);
    return {
      jobs: await n(jobs),
      jobWheels: await n(jobWheels),
      jobEvents: await n(jobEvents),
      runEvents: await n(wheelRunEvents),
      refused: await n(refusedRunEvents),
      photos: await n(wheelPhotos),
      verifications: await n(wrenchVerifications),
      wrenchStatus: await n(wrenchStatusEvents),
      cycles: cycles!.n,
    };
  };

  it('a whole attempt, with bolts confirmed on a named wrench, leaves job, wheel and tool-crib rows as they were', async () => {
    const before = await countRows();
    const { body } = await startAs('apprentice', { source: 'spec', specId, level: 'wrench_setup' });
    const setup = body.data.setup as PracticeSetup;
    const wrench = setup.wrenches[0]!;
    const order = setup.snapshot.plan.passes[0]!.order;
    await postEvents('apprentice', body.data.id, [
      event('wrench_chosen', { pass: 1, wrenchId: wrench.id }),
      ...order.map((bolt) =>
        event('bolt_confirmed', {
          pass: 1,
          bolt,
          wrenchId: wrench.id,
          setting: { value: wrench.min, unit: wrench.unit },
        }),
      ),
    ]);
    await finishAs('apprentice', body.data.id);
    expect(await countRows()).toEqual(before);
  });
});
