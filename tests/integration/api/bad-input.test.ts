import { beforeAll, describe, expect, it } from 'vitest';
import * as customerList from '@/app/api/customers/route';
import * as jobItem from '@/app/api/jobs/[jobId]/route';
import * as jobList from '@/app/api/jobs/route';
import * as wrenchList from '@/app/api/wrenches/route';
import { addCustomer } from '@/features/jobs/actions/customer-actions';
import { getJob } from '@/features/jobs/server/jobs';
import { addWrench } from '@/features/tool-crib/actions/wrench-actions';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { createRecords, wrenchBody } from '@/tests/helpers/records';

// Each of these reached PostgreSQL and came back as our own 500 ("internal"); now each is a 400
// naming the field, and nothing is stored.
type Handler = (
  req: Request,
  ctx: { params: Promise<Record<string, string>> },
) => Promise<Response>;
let shop: Awaited<ReturnType<typeof createTestShop>>,
  records: Awaited<ReturnType<typeof createRecords>>,
  tech: string;

beforeAll(async () => {
  shop = await createTestShop();
  records = await createRecords(shop.lead, shop.technician.userId);
  tech = await cookieFor(shop.technician.userId);
});

async function refused(
  handler: Handler,
  path: string,
  init: { method?: string; body?: unknown; cookie?: string },
  p: Record<string, string> = {},
) {
  const res = await handler(apiRequest(path, { cookie: tech, ...init }), params(p));
  const body = (await res.json()) as {
    error?: { code: string; fields?: Record<string, string[]> };
  };
  return {
    status: res.status,
    code: body.error?.code,
    fields: Object.keys(body.error?.fields ?? {}),
  };
}

describe('input PostgreSQL cannot store is refused at the boundary with the field', () => {
  it('a NUL byte in a customer name (route and action)', async () => {
    expect(
      await refused(customerList.POST as Handler, '/api/customers', {
        method: 'POST',
        body: { name: 'Wren\u0000Halloway' },
      }),
    ).toEqual({ status: 400, code: 'invalid', fields: ['name'] });
    await actAs(shop.technician.userId);
    expect(await addCustomer(null, { name: 'Wren\u0000Halloway' })).toMatchObject({
      ok: false,
      code: 'invalid',
      fieldErrors: { name: [expect.stringMatching(/control character/)] },
    });
    const list = await customerList.GET(
      apiRequest('/api/customers?q=Wren', { cookie: tech }),
      params({}),
    );
    expect(((await list.json()) as { data: { name: string }[] }).data.map((c) => c.name)).toEqual([
      'Wren Halloway',
    ]);
  });

  it('a NUL byte in the board and customer searches', async () => {
    expect(await refused(jobList.GET as Handler, '/api/jobs?q=%00', {})).toEqual({
      status: 400,
      code: 'invalid',
      fields: ['q'],
    });
    expect(await refused(customerList.GET as Handler, '/api/customers?q=a%00b', {})).toEqual({
      status: 400,
      code: 'invalid',
      fields: ['q'],
    });
    expect(await refused(jobList.GET as Handler, '/api/jobs?page=3e9', {})).toEqual({
      status: 400,
      code: 'invalid',
      fields: ['page'],
    });
  });

  it("a cycle count beyond PostgreSQL's integer (3e9) and a calibration date in the year 0000", async () => {
    const lead = await cookieFor(shop.lead.userId);
    expect(
      await refused(wrenchList.POST as Handler, '/api/wrenches', {
        method: 'POST',
        cookie: lead,
        body: { ...wrenchBody, cyclesSinceCalibration: 3e9 },
      }),
    ).toEqual({ status: 400, code: 'invalid', fields: ['cyclesSinceCalibration'] });
    expect(
      await refused(wrenchList.POST as Handler, '/api/wrenches', {
        method: 'POST',
        cookie: lead,
        body: { ...wrenchBody, calibrationDueOn: '0000-01-01' },
      }),
    ).toEqual({ status: 400, code: 'invalid', fields: ['calibrationDueOn'] });
    expect(
      await refused(wrenchList.POST as Handler, '/api/wrenches', {
        method: 'POST',
        cookie: lead,
        body: { ...wrenchBody, calibrationDueOn: '2026-02-30' },
      }),
    ).toEqual({ status: 400, code: 'invalid', fields: ['calibrationDueOn'] });
    await actAs(shop.lead.userId);
    const form = new FormData();
    for (const [k, v] of Object.entries({ ...wrenchBody, cyclesSinceCalibration: '3000000000' }))
      form.set(k, String(v));
    expect(await addWrench(null, form)).toMatchObject({
      ok: false,
      code: 'invalid',
      fieldErrors: { cyclesSinceCalibration: [expect.stringMatching(/at most/)] },
    });
    const wrenches = await wrenchList.GET(
      apiRequest('/api/wrenches', { cookie: lead }),
      params({}),
    );
    expect(((await wrenches.json()) as { total: number }).total).toBe(1);
  });

  it("a due date at the end of JavaScript's range", async () => {
    const lead = await cookieFor(shop.lead.userId);
    const p = { jobId: records.job.id };
    for (const dueAt of ['+275760-09-13T00:00:00.000Z', '-271821-04-20T00:00:00.000Z', 8.64e15]) {
      expect(
        await refused(
          jobItem.PATCH as Handler,
          `/api/jobs/${records.job.id}`,
          { method: 'PATCH', cookie: lead, body: { dueAt } },
          p,
        ),
      ).toEqual({ status: 400, code: 'invalid', fields: ['dueAt'] });
    }
    expect((await getJob(shop.shopId, records.job.id)).dueAt).toBeNull();
  });
});
