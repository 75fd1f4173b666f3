import { beforeEach, describe, expect, it } from 'vitest';
import * as specItem from '@/app/api/specs/[specId]/route';
import * as specList from '@/app/api/specs/route';
import { getSpec, listSpecs } from '@/features/specs/server/specs';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { createRecords, specBody } from '@/tests/helpers/records';

type Shop = Awaited<ReturnType<typeof createTestShop>>;
let shop: Shop, records: Awaited<ReturnType<typeof createRecords>>;

beforeEach(async () => {
  shop = await createTestShop();
  records = await createRecords(shop.lead, shop.technician.userId);
});

describe("a spec carries the wheel maker's thread condition and bolt reuse rule", () => {
  it('stores them, and clears the condition back to "not stated"', async () => {
    const cookie = await cookieFor(shop.lead.userId);
    const body = {
      ...specBody,
      name: 'Oiled ring',
      threadCondition: 'oiled',
      boltReuse: 'Replace at every tire change',
    };
    const created = await specList.POST(
      apiRequest('/api/specs', { method: 'POST', cookie, body }),
      params({}),
    );
    expect(created.status).toBe(201);
    const { data } = (await created.json()) as { data: { id: string } };
    expect(await getSpec(shop.shopId, data.id)).toMatchObject({
      threadCondition: 'oiled',
      boltReuse: 'Replace at every tire change',
    });

    const cleared = await specItem.PATCH(
      apiRequest(`/api/specs/${data.id}`, {
        method: 'PATCH',
        cookie,
        body: { ...body, threadCondition: '' },
      }),
      params({ specId: data.id }),
    );
    expect(cleared.status).toBe(200);
    expect((await getSpec(shop.shopId, data.id)).threadCondition).toBeNull();
  });

  it('refuses a condition the maker cannot have meant, naming the field, and stores nothing', async () => {
    const cookie = await cookieFor(shop.lead.userId);
    const res = await specList.POST(
      apiRequest('/api/specs', {
        method: 'POST',
        cookie,
        body: { ...specBody, name: 'Greasy', threadCondition: 'greasy' },
      }),
      params({}),
    );
    expect(res.status).toBe(400);
    const { error } = (await res.json()) as { error: { fields: Record<string, string[]> } };
    expect(error.fields.threadCondition![0]).toMatch(/dry, oiled, anti-seize or thread locker/);
    expect((await listSpecs(shop.shopId)).map((s) => s.id)).toEqual([records.spec.id]);
  });
});
