import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import * as customerItem from '@/app/api/customers/[customerId]/route';
import * as customerList from '@/app/api/customers/route';
import * as jobItem from '@/app/api/jobs/[jobId]/route';
import * as jobTransitions from '@/app/api/jobs/[jobId]/transitions/route';
import * as jobWheels from '@/app/api/jobs/[jobId]/wheels/route';
import * as jobList from '@/app/api/jobs/route';
import * as specItem from '@/app/api/specs/[specId]/route';
import * as specList from '@/app/api/specs/route';
import * as vehicleItem from '@/app/api/vehicles/[vehicleId]/route';
import * as vehicleList from '@/app/api/vehicles/route';
import * as wheelEvents from '@/app/api/wheels/[wheelId]/events/route';
import * as wheelItem from '@/app/api/wheels/[wheelId]/route';
import * as wrenchClear from '@/app/api/wrenches/[wrenchId]/clear/route';
import * as wrenchItem from '@/app/api/wrenches/[wrenchId]/route';
import * as wrenchVerifications from '@/app/api/wrenches/[wrenchId]/verifications/route';
import * as wrenchList from '@/app/api/wrenches/route';
import { getJob } from '@/features/jobs/server/jobs';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { createRecords, fourWheels, specBody, wrenchBody } from '@/tests/helpers/records';
import { workAndSubmitWheels } from '@/tests/helpers/wheel-work';

type Handler = (
  req: Request,
  ctx: { params: Promise<Record<string, string>> },
) => Promise<Response>;
type Shop = Awaited<ReturnType<typeof createTestShop>>;
type Records = Awaited<ReturnType<typeof createRecords>>;

let a: Shop,
  b: Shop,
  ra: Records,
  rb: Records,
  wheelA: string,
  runWheelA: string,
  cookies: Record<'lead' | 'technician' | 'apprentice' | 'otherLead', string>;

beforeAll(async () => {
  a = await createTestShop('Shop A');
  b = await createTestShop('Shop B');
  ra = await createRecords(a.lead, a.technician.userId);
  rb = await createRecords(b.lead, b.technician.userId);
  wheelA = (await getJob(a.shopId, ra.job.id)).wheels[0]!.id;
  // A job of its own for the runner's save (its first event starts the job; ra.job's transitions
  // are tested below), assigned to the technician.
  const runJob = (await createRecords(a.lead, a.technician.userId)).job;
  runWheelA = (await getJob(a.shopId, runJob.id)).wheels[0]!.id;
  cookies = {
    lead: await cookieFor(a.lead.userId),
    technician: await cookieFor(a.technician.userId),
    apprentice: await cookieFor(a.apprentice.userId),
    otherLead: await cookieFor(b.lead.userId),
  };
});

/** One row per handler: how to call it well, and who may. */
type Case = {
  name: string;
  handler: Handler;
  method: string;
  path: () => string;
  params: () => Record<string, string>;
  body?: () => unknown;
  bad?: () => unknown;
  allowed: ('lead' | 'technician' | 'apprentice')[];
  ok: number;
};

const cases: Case[] = [
  {
    name: 'GET /api/jobs',
    handler: jobList.GET as Handler,
    method: 'GET',
    path: () => '/api/jobs?state=open',
    params: () => ({}),
    allowed: ['lead', 'technician'],
    ok: 200,
  },
  {
    name: 'POST /api/jobs',
    handler: jobList.POST as Handler,
    method: 'POST',
    path: () => '/api/jobs',
    params: () => ({}),
    body: () => ({
      customerId: ra.customer.id,
      vehicleId: ra.vehicle.id,
      wheels: fourWheels(ra.spec.id),
    }),
    bad: () => ({ customerId: ra.customer.id, wheels: [] }),
    allowed: ['lead', 'technician'],
    ok: 201,
  },
  {
    name: 'GET /api/jobs/:id',
    handler: jobItem.GET as Handler,
    method: 'GET',
    path: () => `/api/jobs/${ra.job.id}`,
    params: () => ({ jobId: ra.job.id }),
    allowed: ['lead', 'technician'],
    ok: 200,
  },
  {
    name: 'PATCH /api/jobs/:id',
    handler: jobItem.PATCH as Handler,
    method: 'PATCH',
    path: () => `/api/jobs/${ra.job.id}`,
    params: () => ({ jobId: ra.job.id }),
    body: () => ({ notes: 'Bring the cage.' }),
    bad: () => ({ dueAt: 'not a date' }),
    allowed: ['lead'],
    ok: 200,
  },
  {
    name: 'GET /api/jobs/:id/wheels',
    handler: jobWheels.GET as Handler,
    method: 'GET',
    path: () => `/api/jobs/${ra.job.id}/wheels`,
    params: () => ({ jobId: ra.job.id }),
    allowed: ['lead', 'technician'],
    ok: 200,
  },
  {
    name: 'GET /api/wheels/:id',
    handler: wheelItem.GET as Handler,
    method: 'GET',
    path: () => `/api/wheels/${wheelA}`,
    params: () => ({ wheelId: wheelA }),
    allowed: ['lead', 'technician'],
    ok: 200,
  },
  {
    // The lead's call starts the wheel (the full path); the technician's then takes the quick
    // statement, which checks the role itself. Unassigned, cleared and removed people:
    // wheel-events-access.test.ts.
    name: 'POST /api/wheels/:id/events',
    handler: wheelEvents.POST as Handler,
    method: 'POST',
    path: () => `/api/wheels/${runWheelA}/events`,
    params: () => ({ wheelId: runWheelA }),
    body: () => ({
      events: [
        {
          type: 'bolt_confirmed',
          payload: { pass: 1, bolt: 1 },
          clientId: randomUUID(),
          clientAt: new Date().toISOString(),
        },
      ],
    }),
    bad: () => ({ events: [] }),
    allowed: ['lead', 'technician'],
    ok: 200,
  },
  {
    name: 'PATCH /api/wheels/:id',
    handler: wheelItem.PATCH as Handler,
    method: 'PATCH',
    path: () => `/api/wheels/${wheelA}`,
    params: () => ({ wheelId: wheelA }),
    body: () => ({ ...fourWheels(ra.spec.id)[0], targetPressure: 15 }),
    bad: () => ({
      position: 'LF',
      specId: 'x',
      tireSize: '',
      targetPressure: -1,
      pressureUnit: 'atm',
    }),
    allowed: ['lead'],
    ok: 200,
  },
  {
    name: 'GET /api/customers',
    handler: customerList.GET as Handler,
    method: 'GET',
    path: () => '/api/customers?q=Wren',
    params: () => ({}),
    allowed: ['lead', 'technician'],
    ok: 200,
  },
  {
    name: 'POST /api/customers',
    handler: customerList.POST as Handler,
    method: 'POST',
    path: () => '/api/customers',
    params: () => ({}),
    body: () => ({ name: 'Nell Orchard', phone: '555-0100' }),
    bad: () => ({ name: '', email: 'nope' }),
    allowed: ['lead', 'technician'],
    ok: 201,
  },
  {
    name: 'GET /api/customers/:id',
    handler: customerItem.GET as Handler,
    method: 'GET',
    path: () => `/api/customers/${ra.customer.id}`,
    params: () => ({ customerId: ra.customer.id }),
    allowed: ['lead', 'technician'],
    ok: 200,
  },
  {
    name: 'PATCH /api/customers/:id',
    handler: customerItem.PATCH as Handler,
    method: 'PATCH',
    path: () => `/api/customers/${ra.customer.id}`,
    params: () => ({ customerId: ra.customer.id }),
    body: () => ({ name: 'Wren Halloway', phone: '555-0143' }),
    bad: () => ({ name: '', phone: 'call me' }),
    allowed: ['lead'],
    ok: 200,
  },
  {
    name: 'GET /api/vehicles',
    handler: vehicleList.GET as Handler,
    method: 'GET',
    path: () => `/api/vehicles?customerId=${ra.customer.id}`,
    params: () => ({}),
    allowed: ['lead', 'technician'],
    ok: 200,
  },
  {
    name: 'POST /api/vehicles',
    handler: vehicleList.POST as Handler,
    method: 'POST',
    path: () => '/api/vehicles',
    params: () => ({}),
    body: () => ({ customerId: ra.customer.id, make: 'Boreal', model: 'Scout' }),
    bad: () => ({ customerId: ra.customer.id, year: 1800 }),
    allowed: ['lead', 'technician'],
    ok: 201,
  },
  {
    name: 'GET /api/vehicles/:id',
    handler: vehicleItem.GET as Handler,
    method: 'GET',
    path: () => `/api/vehicles/${ra.vehicle.id}`,
    params: () => ({ vehicleId: ra.vehicle.id }),
    allowed: ['lead', 'technician'],
    ok: 200,
  },
  {
    name: 'PATCH /api/vehicles/:id',
    handler: vehicleItem.PATCH as Handler,
    method: 'PATCH',
    path: () => `/api/vehicles/${ra.vehicle.id}`,
    params: () => ({ vehicleId: ra.vehicle.id }),
    body: () => ({ customerId: ra.customer.id, make: 'Talonworks', model: 'Ridgeback 1000' }),
    bad: () => ({ customerId: ra.customer.id, vin: 'SHORT' }),
    allowed: ['lead'],
    ok: 200,
  },
  {
    name: 'GET /api/specs',
    handler: specList.GET as Handler,
    method: 'GET',
    path: () => '/api/specs',
    params: () => ({}),
    allowed: ['lead', 'technician', 'apprentice'],
    ok: 200,
  },
  {
    name: 'POST /api/specs',
    handler: specList.POST as Handler,
    method: 'POST',
    path: () => '/api/specs',
    params: () => ({}),
    body: () => ({ ...specBody, name: 'Another' }),
    bad: () => ({ ...specBody, boltCount: 80 }),
    allowed: ['lead'],
    ok: 201,
  },
  {
    name: 'GET /api/specs/:id',
    handler: specItem.GET as Handler,
    method: 'GET',
    path: () => `/api/specs/${ra.spec.id}`,
    params: () => ({ specId: ra.spec.id }),
    allowed: ['lead', 'technician', 'apprentice'],
    ok: 200,
  },
  {
    name: 'PATCH /api/specs/:id',
    handler: specItem.PATCH as Handler,
    method: 'PATCH',
    path: () => `/api/specs/${ra.spec.id}`,
    params: () => ({ specId: ra.spec.id }),
    body: () => ({ ...specBody, finalTorque: 13 }),
    bad: () => ({ ...specBody, passPercents: [70, 30, 100] }),
    allowed: ['lead'],
    ok: 200,
  },
  {
    name: 'GET /api/wrenches',
    handler: wrenchList.GET as Handler,
    method: 'GET',
    path: () => '/api/wrenches',
    params: () => ({}),
    allowed: ['lead', 'technician'],
    ok: 200,
  },
  {
    name: 'POST /api/wrenches',
    handler: wrenchList.POST as Handler,
    method: 'POST',
    path: () => '/api/wrenches',
    params: () => ({}),
    body: () => ({ ...wrenchBody, label: 'Second' }),
    bad: () => ({ ...wrenchBody, max: 10, min: 20 }),
    allowed: ['lead'],
    ok: 201,
  },
  {
    name: 'GET /api/wrenches/:id',
    handler: wrenchItem.GET as Handler,
    method: 'GET',
    path: () => `/api/wrenches/${ra.wrench.id}`,
    params: () => ({ wrenchId: ra.wrench.id }),
    allowed: ['lead', 'technician'],
    ok: 200,
  },
  {
    name: 'PATCH /api/wrenches/:id',
    handler: wrenchItem.PATCH as Handler,
    method: 'PATCH',
    path: () => `/api/wrenches/${ra.wrench.id}`,
    params: () => ({ wrenchId: ra.wrench.id }),
    body: () => ({ ...wrenchBody, serial: 'SN-1' }),
    bad: () => ({ ...wrenchBody, calibrationDueOn: 'soon' }),
    allowed: ['lead'],
    ok: 200,
  },
  {
    name: 'GET /api/wrenches/:id/verifications',
    handler: wrenchVerifications.GET as Handler,
    method: 'GET',
    path: () => `/api/wrenches/${ra.wrench.id}/verifications`,
    params: () => ({ wrenchId: ra.wrench.id }),
    allowed: ['lead', 'technician'],
    ok: 200,
  },
  {
    name: 'POST /api/wrenches/:id/verifications',
    handler: wrenchVerifications.POST as Handler,
    method: 'POST',
    path: () => `/api/wrenches/${ra.wrench.id}/verifications`,
    params: () => ({ wrenchId: ra.wrench.id }),
    body: () => ({ referenceValue: 100, readingValue: 101, unit: 'lbf-in' }),
    bad: () => ({ referenceValue: 0, readingValue: 'x', unit: 'lbf-in' }),
    allowed: ['lead', 'technician'],
    ok: 201,
  },
];

const call = (
  c: Case,
  cookie: string | undefined,
  body = c.body?.(),
  p = c.params(),
  path = c.path(),
) => c.handler(apiRequest(path, { method: c.method, cookie, body }), params(p));

describe.each(cases)('$name', (c) => {
  it('answers the allowed roles, refuses the others with 403 and signed-out with 401', async () => {
    for (const role of ['lead', 'technician', 'apprentice'] as const) {
      const res = await call(c, cookies[role]);
      expect(res.status, `${role}: ${await res.clone().text()}`).toBe(
        c.allowed.includes(role) ? c.ok : 403,
      );
      if (!c.allowed.includes(role))
        expect(await res.json()).toMatchObject({ error: { code: 'forbidden' } });
    }
    const signedOut = await call(c, undefined);
    expect(signedOut.status).toBe(401);
    expect(await signedOut.json()).toMatchObject({ error: { code: 'unauthenticated' } });
  });

  if (c.name.includes(':id')) {
    it("answers 404 for another shop's id, and for a malformed one", async () => {
      const theirs = {
        jobId: rb.job.id,
        wheelId: rb.job.id,
        customerId: rb.customer.id,
        vehicleId: rb.vehicle.id,
        specId: rb.spec.id,
        wrenchId: rb.wrench.id,
      } as Record<string, string>;
      const key = {
        jobs: 'jobId',
        wheels: 'wheelId',
        customers: 'customerId',
        vehicles: 'vehicleId',
        specs: 'specId',
        wrenches: 'wrenchId',
      }[c.name.split('/')[2]!]!;
      const res = await call(c, cookies.lead, c.body?.(), { [key]: theirs[key]! });
      expect(res.status).toBe(404);
      expect(await res.json()).toMatchObject({ error: { code: 'not_found' } });
      expect((await call(c, cookies.lead, c.body?.(), { [key]: 'not-an-id' })).status).toBe(404);
    });
  }

  if (c.bad !== undefined) {
    it('answers 400 with field errors for bad input, and for a body that is not JSON', async () => {
      const res = await call(c, cookies.lead, c.bad!());
      expect(res.status, await res.clone().text()).toBe(400);
      const json = (await res.json()) as {
        error: { code: string; fields?: Record<string, string[]> };
      };
      expect(json.error.code).toBe('invalid');
      expect(Object.keys(json.error.fields ?? {}).length).toBeGreaterThan(0);
      expect((await call(c, cookies.lead, '{oops')).status).toBe(400);
    });
  }
});

describe('shop isolation on lists', () => {
  it("a lead's board, customers, specs and wrenches hold only their own shop's rows", async () => {
    for (const [handler, path, ownId] of [
      [jobList.GET, '/api/jobs', ra.job.id],
      [customerList.GET, '/api/customers', ra.customer.id],
      [specList.GET, '/api/specs', ra.spec.id],
      [wrenchList.GET, '/api/wrenches', ra.wrench.id],
    ] as const) {
      const res = await (handler as Handler)(
        apiRequest(path, { cookie: cookies.otherLead }),
        params({}),
      );
      const json = (await res.json()) as { data: { id: string }[] };
      expect(json.data.map((r) => r.id)).not.toContain(ownId);
      expect(json.data.length).toBeGreaterThan(0);
    }
  });
});

describe('POST /api/wrenches/:id/clear', () => {
  it('only a lead, only for a wrench out of service, with a reason', async () => {
    const path = `/api/wrenches/${ra.wrench.id}/clear`;
    const p = { wrenchId: ra.wrench.id };
    const tech = await wrenchClear.POST(
      apiRequest(path, {
        method: 'POST',
        cookie: cookies.technician,
        body: { reason: 'recalibrated' },
      }),
      params(p),
    );
    expect(tech.status).toBe(403);
    const inService = await wrenchClear.POST(
      apiRequest(path, { method: 'POST', cookie: cookies.lead, body: { reason: 'recalibrated' } }),
      params(p),
    );
    expect(inService.status).toBe(409);
    const noReason = await wrenchClear.POST(
      apiRequest(path, { method: 'POST', cookie: cookies.lead, body: { reason: '' } }),
      params(p),
    );
    expect(noReason.status).toBe(400);
    const other = await wrenchClear.POST(
      apiRequest(`/api/wrenches/${rb.wrench.id}/clear`, {
        method: 'POST',
        cookie: cookies.lead,
        body: { reason: 'recalibrated' },
      }),
      params({ wrenchId: rb.wrench.id }),
    );
    expect(other.status).toBe(404);
  });
});

describe('POST /api/jobs/:id/transitions', () => {
  it('moves only along allowed transitions, and only for the right person', async () => {
    const path = `/api/jobs/${ra.job.id}/transitions`;
    const p = { jobId: ra.job.id };
    const move = (cookie: string | undefined, body: unknown) =>
      jobTransitions.POST(apiRequest(path, { method: 'POST', cookie, body }), params(p));
    expect((await move(undefined, { action: 'start' })).status).toBe(401);
    expect((await move(cookies.apprentice, { action: 'start' })).status).toBe(403);
    expect((await move(cookies.technician, { action: 'sign_off' })).status).toBe(409);
    expect((await move(cookies.technician, { action: 'fly' })).status).toBe(400);
    expect(await (await move(cookies.technician, { action: 'start' })).json()).toMatchObject({
      data: { state: 'in_progress' },
    });
    expect((await move(cookies.technician, { action: 'submit' })).status).toBe(409); // no wheel run yet
    await workAndSubmitWheels(a.shopId, ra.job.id, a.technician.userId);
    expect(await (await move(cookies.technician, { action: 'submit' })).json()).toMatchObject({
      data: { state: 'awaiting_signoff' },
    });
    expect((await move(cookies.technician, { action: 'sign_off' })).status).toBe(403);
    expect((await move(cookies.lead, { action: 'send_back' })).status).toBe(400); // needs a note
    const back = await move(cookies.lead, { action: 'send_back', note: 'Retake the bead photo.' });
    expect(await back.json()).toMatchObject({
      data: {
        state: 'sent_back',
        events: expect.arrayContaining([
          expect.objectContaining({ action: 'send_back', note: 'Retake the bead photo.' }),
        ]),
      },
    });
    const otherShop = await jobTransitions.POST(
      apiRequest(`/api/jobs/${rb.job.id}/transitions`, {
        method: 'POST',
        cookie: cookies.lead,
        body: { action: 'start' },
      }),
      params({ jobId: rb.job.id }),
    );
    expect(otherShop.status).toBe(404);
  });
});
