import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { POST } from '@/app/api/torque-plans/route';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';

const wrenches = [
  { id: 'in-lb', min: 20, max: 200, unit: 'lbf-in', graduation: 1, kind: 'click' },
  { id: 'ft-lb', min: 5, max: 80, unit: 'lbf-ft', graduation: 1, kind: 'click' },
];

async function post(body: unknown, userId?: string) {
  const cookie = userId ? await cookieFor(userId) : undefined;
  return POST(apiRequest('/api/torque-plans', { method: 'POST', cookie, body }), params({}));
}

describe('POST /api/torque-plans', () => {
  it('answers the sequence and, per pass, the target, wrench and setting (an apprentice may ask too)', async () => {
    const shop = await createTestShop();
    const res = await post(
      { boltCount: 16, pattern: { kind: 'cross' }, final: { value: 12, unit: 'lbf-ft' }, wrenches },
      shop.apprentice.userId,
    );
    expect(res.status).toBe(200);
    const { data } = (await res.json()) as {
      data: {
        sequence: number[];
        passes: {
          kind: string;
          target: { value: number };
          order: number[];
          wrench: { ok: boolean; wrenchId?: string; setting?: { value: number; unit: string } };
        }[];
      };
    };
    expect(data.sequence).toEqual([1, 9, 5, 13, 3, 11, 7, 15, 2, 10, 6, 14, 4, 12, 8, 16]);
    expect(
      data.passes.map((p) => [
        p.kind,
        p.target.value,
        p.wrench.wrenchId,
        p.wrench.setting?.value,
        p.wrench.setting?.unit,
      ]),
    ).toEqual([
      ['staged', 3.6, 'in-lb', 43, 'lbf-in'],
      ['staged', 8.4, 'in-lb', 101, 'lbf-in'],
      // 12 ft-lb is under the ft-lb wrench's 20 % floor (16 ft-lb), and 72 % of the in-lb one.
      ['staged', 12, 'in-lb', 144, 'lbf-in'],
      ['check', 12, 'in-lb', 144, 'lbf-in'],
    ]);
    expect(data.passes[3]!.order).toEqual(Array.from({ length: 16 }, (_, i) => i + 1));
  });

  it('401 signed out', async () => {
    expect(
      (
        await post({
          boltCount: 8,
          pattern: { kind: 'cross' },
          final: { value: 10, unit: 'Nm' },
          wrenches,
        })
      ).status,
    ).toBe(401);
  });

  it('bad input answers 400 with the field named', async () => {
    const shop = await createTestShop();
    const cases: [unknown, string][] = [
      [
        { boltCount: 3, pattern: { kind: 'cross' }, final: { value: 10, unit: 'Nm' }, wrenches },
        'boltCount',
      ],
      [
        {
          boltCount: 8,
          pattern: { kind: 'skip', step: 8 },
          final: { value: 10, unit: 'Nm' },
          wrenches,
        },
        'pattern.step',
      ],
      [
        { boltCount: 8, pattern: { kind: 'cross' }, final: { value: -1, unit: 'Nm' }, wrenches },
        'final.value',
      ],
      [
        { boltCount: 8, pattern: { kind: 'cross' }, final: { value: 10, unit: 'kgm' }, wrenches },
        'final.unit',
      ],
      [
        {
          boltCount: 8,
          pattern: { kind: 'cross' },
          final: { value: 10, unit: 'Nm' },
          fractions: [0.7, 0.3, 1],
          wrenches,
        },
        'fractions.1',
      ],
      [{ boltCount: 8, pattern: { kind: 'cross' }, final: { value: 10, unit: 'Nm' } }, 'wrenches'],
      [
        {
          boltCount: 8,
          pattern: { kind: 'cross' },
          start: 9,
          final: { value: 10, unit: 'Nm' },
          wrenches,
        },
        'start',
      ],
      [
        {
          boltCount: 8,
          pattern: { kind: 'cross' },
          final: { value: 10, unit: 'Nm' },
          wrenchIds: ['00000000-0000-4000-8000-000000000000'],
        },
        'wrenchIds',
      ],
    ];
    for (const [body, field] of cases) {
      const res = await post(body, shop.technician.userId);
      expect(res.status, JSON.stringify(body)).toBe(400);
      const json = (await res.json()) as {
        error: { code: string; fields: Record<string, string[]> };
      };
      expect(json.error.code).toBe('invalid');
      expect(Object.keys(json.error.fields), JSON.stringify(json)).toContain(field);
    }
  });

  it('never answers 500, whatever the body', async () => {
    const shop = await createTestShop();
    const cookie = await cookieFor(shop.technician.userId);
    await fc.assert(
      fc.asyncProperty(
        fc.oneof(
          fc.anything(),
          fc.record({
            boltCount: fc.anything(),
            pattern: fc.anything(),
            final: fc.anything(),
            wrenches: fc.anything(),
          }),
        ),
        async (body) => {
          const res = await POST(
            apiRequest('/api/torque-plans', {
              method: 'POST',
              cookie,
              body: JSON.stringify(body) ?? 'null',
            }),
            params({}),
          );
          expect([200, 400]).toContain(res.status);
        },
      ),
      { numRuns: 150 },
    );
  });
});
