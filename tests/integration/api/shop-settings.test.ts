import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { GET, PATCH } from '@/app/api/shop/settings/route';
import { POST as PLAN } from '@/app/api/torque-plans/route';
import { getDb } from '@/db';
import { shopSettings } from '@/db/schema';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';

type Shop = Awaited<ReturnType<typeof createTestShop>>;
type Settings = {
  timeZone: string;
  wrenchFloorPercent: number;
  verification: { recency: string; days: number; nearPercent: number };
  tooFastSecondsPerBolt: number;
  recheckDays: number;
  pressureUnit: string;
  torqueUnit: string;
  singleLeadSelfSignoff: boolean;
};

const read = async (userId?: string) =>
  GET(
    apiRequest('/api/shop/settings', { cookie: userId ? await cookieFor(userId) : undefined }),
    params({}),
  );
const patch = async (body: unknown, userId?: string) =>
  PATCH(
    apiRequest('/api/shop/settings', {
      method: 'PATCH',
      cookie: userId ? await cookieFor(userId) : undefined,
      body,
    }),
    params({}),
  );
const stored = async (shop: Shop) =>
  (await getDb().select().from(shopSettings).where(eq(shopSettings.shopId, shop.shopId)))[0]!;

/** The product's defaults for a new shop (the settings row's column defaults). */
const DEFAULTS: Settings = {
  timeZone: 'UTC',
  wrenchFloorPercent: 20,
  verification: { recency: 'same_day', days: 1, nearPercent: 25 },
  tooFastSecondsPerBolt: 1.5,
  recheckDays: 7,
  pressureUnit: 'psi',
  torqueUnit: 'lbf-ft',
  singleLeadSelfSignoff: false,
};

describe('GET/PATCH /api/shop/settings by role', () => {
  it('every member reads the settings; only a lead changes them, and the change records who and when', async () => {
    const shop = await createTestShop();
    for (const who of [shop.lead, shop.technician, shop.apprentice]) {
      const res = await read(who.userId);
      expect(res.status, who.role).toBe(200);
      expect(await res.json()).toEqual({ data: DEFAULTS });
    }

    for (const who of [shop.technician, shop.apprentice]) {
      const res = await patch({ wrenchFloorPercent: 0 }, who.userId);
      expect(res.status, who.role).toBe(403);
      expect(await res.json()).toEqual({
        error: { code: 'forbidden', message: 'Your role does not allow this.' },
      });
    }
    expect((await stored(shop)).wrenchFloorPercent).toBe(20);

    const before = Date.now();
    const res = await patch(
      { timeZone: 'America/Denver', wrenchFloorPercent: 0, verification: { nearPercent: 10 } },
      shop.lead.userId,
    );
    expect(res.status).toBe(200);
    // A subset changes only what it names; the nested verification keeps its other parts.
    expect(await res.json()).toEqual({
      data: {
        ...DEFAULTS,
        timeZone: 'America/Denver',
        wrenchFloorPercent: 0,
        verification: { recency: 'same_day', days: 1, nearPercent: 10 },
      },
    });
    const row = await stored(shop);
    expect(row.updatedById).toBe(shop.lead.userId);
    expect(row.updatedAt.getTime()).toBeGreaterThanOrEqual(before - 1000);
    expect(await (await read(shop.technician.userId)).json()).toMatchObject({
      data: { timeZone: 'America/Denver', wrenchFloorPercent: 0 },
    });
  });

  it('signed out: 401 for reading and for changing', async () => {
    expect((await read()).status).toBe(401);
    expect((await patch({ wrenchFloorPercent: 0 })).status).toBe(401);
  });

  it("one shop's PATCH never changes another shop's settings", async () => {
    const a = await createTestShop('Shop A');
    const b = await createTestShop('Shop B');
    expect(
      (await patch({ wrenchFloorPercent: 5, pressureUnit: 'bar', recheckDays: 30 }, a.lead.userId))
        .status,
    ).toBe(200);
    expect(await (await read(b.lead.userId)).json()).toEqual({ data: DEFAULTS });
    expect(await (await read(a.technician.userId)).json()).toMatchObject({
      data: { wrenchFloorPercent: 5, pressureUnit: 'bar', recheckDays: 30 },
    });
  });

  it('a bad value answers 400 naming the field, and nothing changes (not even the good values beside it)', async () => {
    const shop = await createTestShop();
    const cases: [unknown, string, RegExp][] = [
      [{ timeZone: 'Mars/Olympus_Mons' }, 'timeZone', /not a time zone/],
      [{ timeZone: 42 }, 'timeZone', /Pick the time zone/],
      [{ wrenchFloorPercent: 100 }, 'wrenchFloorPercent', /from 0 to below 100 %/],
      [{ wrenchFloorPercent: -1 }, 'wrenchFloorPercent', /from 0 to below 100 %/],
      [{ wrenchFloorPercent: '20' }, 'wrenchFloorPercent', /as a number/],
      [{ verification: { recency: 'weekly' } }, 'verification.recency', /same_day or within_days/],
      [{ verification: { days: 0 } }, 'verification.days', /from 1 to 365 days/],
      [{ verification: { days: 2.5 } }, 'verification.days', /whole number of days/],
      [{ verification: { nearPercent: 101 } }, 'verification.nearPercent', /0 to 100 %/],
      [{ verification: { near: 10 } }, 'verification.near', /Unknown verification setting "near"/],
      [{ tooFastSecondsPerBolt: 0 }, 'tooFastSecondsPerBolt', /above 0 and at most 60 seconds/],
      [{ tooFastSecondsPerBolt: 600 }, 'tooFastSecondsPerBolt', /above 0 and at most 60 seconds/],
      [{ recheckDays: 366 }, 'recheckDays', /from 1 to 365 days/],
      [{ pressureUnit: 'atm' }, 'pressureUnit', /psi \(psi\), kPa \(kPa\), bar \(bar\)/],
      [{ torqueUnit: 'kgm' }, 'torqueUnit', /lbf-ft \(ft-lb\)/],
      [{ singleLeadSelfSignoff: 'yes' }, 'singleLeadSelfSignoff', /true or false/],
      [{ wrenchFloor: 0 }, 'wrenchFloor', /Unknown setting "wrenchFloor"/],
      [{ wrenchFloorPercent: 0, recheckDays: 0 }, 'recheckDays', /from 1 to 365 days/],
    ];
    for (const [body, field, message] of cases) {
      const res = await patch(body, shop.lead.userId);
      expect(res.status, JSON.stringify(body)).toBe(400);
      const json = (await res.json()) as {
        error: { code: string; fields: Record<string, string[]> };
      };
      expect(json.error.code).toBe('invalid');
      expect(json.error.fields[field]?.join(' '), JSON.stringify(json)).toMatch(message);
    }
    expect(await (await read(shop.lead.userId)).json()).toEqual({ data: DEFAULTS });
    expect((await stored(shop)).updatedById).toBeNull();
  });

  it('a zone spelled the way a newer browser spells it is stored under the name this server knows', async () => {
    const shop = await createTestShop();
    const res = await patch({ timeZone: 'Asia/Kolkata' }, shop.lead.userId);
    expect(res.status).toBe(200);
    const { data } = (await res.json()) as { data: Settings };
    // The IANA database keeps both names for the same zone; either one this runtime lists is fine.
    expect(['Asia/Kolkata', 'Asia/Calcutta']).toContain(data.timeZone);
    expect(Intl.supportedValuesOf('timeZone')).toContain(data.timeZone);
  });
});

describe('the shop floor in POST /api/torque-plans', () => {
  const oneWrench = [
    { id: 'grey 5–80 ft-lb', min: 5, max: 80, unit: 'lbf-ft', graduation: 1, kind: 'click' },
  ];
  const plan = async (shop: Shop, extra: Record<string, unknown> = {}) => {
    const res = await PLAN(
      apiRequest('/api/torque-plans', {
        method: 'POST',
        cookie: await cookieFor(shop.technician.userId),
        body: {
          boltCount: 8,
          pattern: { kind: 'cross' },
          final: { value: 12, unit: 'lbf-ft' },
          wrenches: oneWrench,
          ...extra,
        },
      }),
      params({}),
    );
    expect(res.status).toBe(200);
    const { data } = (await res.json()) as {
      data: {
        passes: {
          target: { value: number };
          wrench: { ok: boolean; reason?: string; setting?: { value: number } };
        }[];
      };
    };
    return data.passes.map((p) =>
      p.wrench.ok
        ? `${p.target.value}: ${p.wrench.setting!.value} ft-lb`
        : `${p.target.value}: none`,
    );
  };

  it("without its own minFractionOfMax, a plan uses the shop's floor: at 0 %, one 5–80 ft-lb wrench runs the 8.4 and 12 ft-lb passes", async () => {
    const shop = await createTestShop();
    // 20 %: nothing under 16 ft-lb on an 80 ft-lb wrench.
    expect(await plan(shop)).toEqual(['3.6: none', '8.4: none', '12: none', '12: none']);
    await patch({ wrenchFloorPercent: 0 }, shop.lead.userId);
    // 0 %: only the lowest mark (5 ft-lb) limits it; 8.4 rounds to the 1 ft-lb graduation.
    expect(await plan(shop)).toEqual(['3.6: none', '8.4: 8 ft-lb', '12: 12 ft-lb', '12: 12 ft-lb']);
    // A request that names its own floor keeps it.
    expect(await plan(shop, { minFractionOfMax: 0.2 })).toEqual([
      '3.6: none',
      '8.4: none',
      '12: none',
      '12: none',
    ]);
  });
});
